"use client";
import { memo } from "react";
import { Circle } from "react-konva";
import type { PointMm } from "@/features/analysis/core/design";
import { boltNodeId } from "./canvas-ids";

export interface BoltDot {
  id: string;
  p: PointMm;
  offPath: boolean;
}

type HoleProps = { bolt: BoltDot; r: number; selected: boolean; draggable: boolean };

/** Same hole, same place: the scene rebuilds its bolt objects every move, so compare the values. */
const sameHole = (a: HoleProps, b: HoleProps) =>
  a.r === b.r &&
  a.selected === b.selected &&
  a.draggable === b.draggable &&
  a.bolt.id === b.bolt.id &&
  a.bolt.p.x === b.bolt.p.x &&
  a.bolt.p.y === b.bolt.p.y &&
  a.bolt.offPath === b.bolt.offPath;

/** One bolt hole to scale, in model coordinates. */
const BoltHole = memo(function BoltHole({
  bolt,
  r,
  selected,
  draggable,
}: {
  bolt: BoltDot;
  r: number;
  selected: boolean;
  draggable: boolean;
}) {
  return (
    <Circle
      id={boltNodeId(bolt.id)}
      name="bolt"
      boltId={bolt.id}
      x={bolt.p.x}
      y={bolt.p.y}
      radius={r}
      fill={selected ? "#e7bd6e" : "#ffffff"}
      stroke={bolt.offPath ? "#a86a00" : "#1d2739"}
      strokeWidth={selected ? 2.5 : 1.5}
      dash={bolt.offPath ? [3, 2] : undefined}
      strokeScaleEnabled={false}
      hitStrokeWidth={10}
      perfectDrawEnabled={false}
      shadowForStrokeEnabled={false}
    />
  );
}, sameHole);

export function BoltNodes({
  bolts,
  r,
  selectedId,
  readOnly,
}: {
  bolts: BoltDot[];
  r: number;
  selectedId: string | null;
  readOnly: boolean;
}) {
  return (
    <>
      {bolts.map((b) => (
        <BoltHole key={b.id} bolt={b} r={r} selected={b.id === selectedId} draggable={!readOnly} />
      ))}
    </>
  );
}
