"use client";
import { memo } from "react";
import { Shape } from "react-konva";
import type { HeatQuad } from "../model/heat-band";

/** The stress strip along the gasket path, drawn in model coordinates (the parent group scales). */
export const HeatLayerShape = memo(function HeatLayerShape({ quads, colour }: { quads: HeatQuad[]; colour: (mpa: number) => string }) {
  return (
    <Shape
      id="heat-map"
      listening={false}
      perfectDrawEnabled={false}
      sceneFunc={(context) => {
        // The native context: thousands of small quads, Konva's wrappers add nothing here.
        const ctx = (context as unknown as { _context: CanvasRenderingContext2D })._context;
        for (const q of quads) {
          ctx.beginPath();
          ctx.moveTo(q.x[0], q.y[0]);
          for (let i = 1; i < 4; i++) ctx.lineTo(q.x[i], q.y[i]);
          ctx.closePath();
          const c = colour(q.stressMpa);
          ctx.fillStyle = c;
          ctx.strokeStyle = c;
          ctx.lineWidth = 0.3;
          ctx.fill();
          ctx.stroke();
        }
      }}
    />
  );
});
