"use client";
import { memo } from "react";
import { Shape } from "react-konva";
import type { HeatQuad } from "../model/heat-band";

/**
 * The stress strip along the gasket path, drawn in model coordinates (the parent group scales).
 * Filled only: the strips overlap a little (model/heat-band.ts), so no stroke is needed, and a
 * fill is the cheap operation for the software rasteriser of a headless or GPU-less browser.
 */
export const HeatLayerShape = memo(function HeatLayerShape({
  quads,
  colour,
}: {
  quads: HeatQuad[];
  colour: (mpa: number) => string;
}) {
  return (
    <Shape
      id="heat-map"
      listening={false}
      perfectDrawEnabled={false}
      sceneFunc={(context) => {
        // Konva's public context (its path calls and fillStyle pass straight to the canvas).
        for (const q of quads) {
          context.beginPath();
          context.moveTo(q.x[0], q.y[0]);
          for (let i = 1; i < 4; i++) context.lineTo(q.x[i], q.y[i]);
          context.closePath();
          context.fillStyle = colour(q.stressMpa);
          context.fill();
        }
      }}
    />
  );
});
