"use client";
import { memo } from "react";
import { Line, Shape } from "react-konva";
import type { PointMm } from "@/features/analysis/core/design";

const flat = (pts: PointMm[]) => pts.flatMap((p) => [p.x, p.y]);

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
      <Line
        id="flange-outline"
        points={flat(outline)}
        closed
        stroke="#1d2739"
        strokeWidth={1.5}
        strokeScaleEnabled={false}
        listening={false}
      />
      {bore && (
        <Line
          id="bore"
          points={flat(bore)}
          closed
          stroke="#394864"
          strokeWidth={1}
          strokeScaleEnabled={false}
          listening={false}
        />
      )}
      <Line
        id="gasket-outer"
        points={flat(gasketOuter)}
        closed
        stroke="#845616"
        strokeWidth={1}
        dash={[6, 3]}
        strokeScaleEnabled={false}
        listening={false}
      />
      {gasketInner && (
        <Line
          id="gasket-inner"
          points={flat(gasketInner)}
          closed
          stroke="#845616"
          strokeWidth={1}
          dash={[6, 3]}
          strokeScaleEnabled={false}
          listening={false}
        />
      )}
    </>
  );
});
