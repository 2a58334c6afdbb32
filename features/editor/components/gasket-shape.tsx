"use client";
import { memo } from "react";
import { Line, Shape } from "react-konva";
import type { PointMm } from "@/features/analysis/core/design";

const flat = (pts: PointMm[]) => pts.flatMap((p) => [p.x, p.y]);

const GASKET_DASH = [6, 3];

/** One closed edge line of the drawing: a hairline whatever the zoom, never hit by the pointer. */
function Edge({
  id,
  ring,
  stroke,
  width = 1,
  dash,
}: {
  id: string;
  ring: PointMm[];
  stroke: string;
  width?: number;
  dash?: number[];
}) {
  return (
    <Line
      id={id}
      points={flat(ring)}
      closed
      stroke={stroke}
      strokeWidth={width}
      dash={dash}
      strokeScaleEnabled={false}
      listening={false}
    />
  );
}

/** Flange plate, bore and gasket edges, in model coordinates. */
export const FlangeShapes = memo(function FlangeShapes(props: {
  outline: PointMm[];
  bore: PointMm[] | null;
  gasketOuter: PointMm[];
  gasketInner: PointMm[] | null;
}) {
  const { outline, bore, gasketOuter, gasketInner } = props;
  return (
    <>
      <Shape
        id="flange-plate"
        listening={false}
        sceneFunc={(context) => {
          // Konva's public context; the even-odd rule leaves the bore open.
          context.beginPath();
          for (const ring of [outline, bore]) {
            if (!ring) continue;
            context.moveTo(ring[0].x, ring[0].y);
            for (const p of ring) context.lineTo(p.x, p.y);
            context.closePath();
          }
          context.fillStyle = "#eeeeea";
          context.fill("evenodd");
        }}
      />
      <Edge id="flange-outline" ring={outline} stroke="#1d2739" width={1.5} />
      {bore && <Edge id="bore" ring={bore} stroke="#394864" />}
      <Edge id="gasket-outer" ring={gasketOuter} stroke="#845616" dash={GASKET_DASH} />
      {gasketInner && <Edge id="gasket-inner" ring={gasketInner} stroke="#845616" dash={GASKET_DASH} />}
    </>
  );
});
