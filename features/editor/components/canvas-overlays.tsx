"use client";
import { Group, Line, Circle, Text } from "react-konva";
import type { UnitSystem } from "@/features/analysis/core/design";
import type { CheckView } from "../model/readout-view";
import type { PitchLabel } from "../model/canvas-scene";
import { formatQuantity } from "../model/quantities";
import { toScreen, type ViewTransform } from "../model/view-transform";
import type { BoltDot } from "./bolt-nodes";
import { violationNodeId } from "./canvas-ids";

const COLOUR = { fail: "#b3261e", warn: "#a86a00" } as const;

interface OverlayProps {
  view: ViewTransform;
  bolts: BoltDot[];
  holeRadiusMm: number;
  pitches: PitchLabel[];
  checks: CheckView[];
  units: UnitSystem;
  highlightBoltIds: Set<string>;
}

/**
 * Screen-space marks over the drawing: a bracket between the two bolts of a failing pair rule,
 * a ring around a bolt that breaks a single-bolt rule, pitch labels and bolt numbers. Text stays
 * upright and readable at any zoom because it is placed in pixels, not in model units.
 */
export function CanvasOverlays({
  view,
  bolts,
  holeRadiusMm,
  pitches,
  checks,
  units,
  highlightBoltIds,
}: OverlayProps) {
  const at = new Map(bolts.map((b) => [b.id, toScreen(view, b.p)]));
  const rPx = Math.max(holeRadiusMm * view.k, 3);
  const ox = view.ox,
    oy = view.oy;
  const showPitch = pitches.length > 0 && pitches.every((p) => p.chordMm * view.k > 44);
  const showNumbers = rPx >= 5 && bolts.length <= 128;
  const seen = new Map<string, number>();
  const markers = checks.filter((c) => (c.status === "fail" || c.status === "warn") && c.boltIds.length > 0);
  return (
    <Group listening={false}>
      {markers.map((c) => {
        const n = seen.get(c.id) ?? 0;
        seen.set(c.id, n + 1);
        const id = violationNodeId(c.id, n);
        // The Konva attributes every violation mark carries (its id and check, for the probes and the highlight).
        const mark = {
          id,
          name: "violation",
          checkId: c.id,
          stroke: COLOUR[c.status as "fail" | "warn"],
          strokeWidth: 2.5,
        };
        if (c.boltIds.length >= 2) {
          const a = at.get(c.boltIds[0]);
          const b = at.get(c.boltIds[1]);
          if (!a || !b) return null;
          // Bracket set outward (away from the flange centre) by a little more than the hole.
          const mx = (a.x + b.x) / 2 - ox,
            my = (a.y + b.y) / 2 - oy;
          const len = Math.hypot(mx, my) || 1;
          const d = rPx + 9;
          const nx = (mx / len) * d,
            ny = (my / len) * d;
          return (
            <Line
              key={id}
              {...mark}
              points={[a.x, a.y, a.x + nx, a.y + ny, b.x + nx, b.y + ny, b.x, b.y]}
              lineCap="round"
              lineJoin="round"
              dash={c.status === "warn" ? [6, 4] : undefined}
            />
          );
        }
        const p = at.get(c.boltIds[0]);
        if (!p) return null;
        return (
          <Circle
            key={id}
            {...mark}
            x={p.x}
            y={p.y}
            radius={rPx + 6}
            dash={c.status === "warn" ? [5, 3] : undefined}
          />
        );
      })}
      {[...highlightBoltIds].map((bid) => {
        const p = at.get(bid);
        return p ? (
          <Circle
            key={`hl-${bid}`}
            id={`highlight-${bid}`}
            x={p.x}
            y={p.y}
            radius={rPx + 11}
            stroke="#c98d2b"
            strokeWidth={3}
          />
        ) : null;
      })}
      {showPitch &&
        pitches.map((p) => {
          const s = toScreen(view, p.at);
          const dx = ox - s.x,
            dy = oy - s.y;
          const len = Math.hypot(dx, dy) || 1;
          return (
            <Text
              key={`pitch-${p.fromId}-${p.toId}`}
              id={`pitch-${p.fromId}-${p.toId}`}
              x={s.x + (dx / len) * 16 - 30}
              y={s.y + (dy / len) * 16 - 6}
              width={60}
              align="center"
              text={formatQuantity("length", p.pitchMm, units, 3)}
              fontSize={10}
              fontFamily="IBM Plex Mono, monospace"
              fill="#394864"
            />
          );
        })}
      {showNumbers &&
        bolts.map((b) => {
          const s = at.get(b.id)!;
          return (
            <Text
              key={`num-${b.id}`}
              x={s.x - 20}
              y={s.y - rPx - 14}
              width={40}
              align="center"
              text={b.id}
              fontSize={10}
              fill="#121a28"
            />
          );
        })}
    </Group>
  );
}
