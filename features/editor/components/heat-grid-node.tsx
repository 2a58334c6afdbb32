"use client";
import { memo } from "react";
import { Image as KonvaImage } from "react-konva";

export interface HeatGridPicture {
  canvas: HTMLCanvasElement;
  xMinMm: number;
  xMaxMm: number;
  yMinMm: number;
  yMaxMm: number;
}

/**
 * The grid heat map in model coordinates. The parent group flips y, so the image is flipped back
 * (row 0 of the grid is the top, y = yMax).
 */
export const HeatGridNode = memo(function HeatGridNode({ picture }: { picture: HeatGridPicture }) {
  const w = picture.xMaxMm - picture.xMinMm;
  const h = picture.yMaxMm - picture.yMinMm;
  return (
    <KonvaImage
      id="heat-map"
      image={picture.canvas}
      x={picture.xMinMm}
      y={picture.yMaxMm}
      width={w}
      height={h}
      scaleY={-1}
      listening={false}
      imageSmoothingEnabled={false}
    />
  );
});
