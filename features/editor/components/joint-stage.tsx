"use client";
// The Konva stage of the editor. Only this module (and its children) import Konva; it is mounted
// through next/dynamic with ssr: false from joint-canvas.tsx.
import { useEffect, useMemo, useRef, useState } from "react";
import { useLatest } from "../hooks/use-latest";
import type Konva from "konva";
import { Group, Layer, Line, Stage } from "react-konva";
import type { JointDesign, PointMm, UnitSystem } from "@/features/analysis/core/design";
import { projectOntoPath } from "@/features/analysis/core/path";
import { buildBoltScene, buildStaticScene } from "../model/canvas-scene";
import type { HeatQuad } from "../model/heat-band";
import type { CheckView } from "../model/readout-view";
import { fitView, panBy, toModel, zoomAt, type ViewTransform } from "../model/view-transform";
import { BoltNodes } from "./bolt-nodes";
import { CanvasOverlays } from "./canvas-overlays";
import { FlangeShapes } from "./gasket-shape";
import { HeatLayerShape } from "./heat-layer";
import { HeatGridNode, type HeatGridPicture } from "./heat-grid-node";
import { installStageProbe } from "./stage-probe";

export interface JointStageProps {
  design: JointDesign;
  checks: CheckView[];
  /** The grid picture when it is current, else the strip along the path (while dragging). */
  heat: { quads: HeatQuad[] | null; grid: HeatGridPicture | null; colour: (mpa: number) => string } | null;
  units: UnitSystem;
  width: number;
  height: number;
  selectedId: string | null;
  highlightBoltIds: string[];
  readOnly: boolean;
  /** Changes whenever the view should fit the drawing again (F key, Fit button). */
  fitToken: number;
  onSelect?: (boltId: string | null) => void;
  onDragStart?: (boltId: string) => void;
  onDragMove?: (boltId: string, point: PointMm, free: boolean, snapMm: number) => void;
  onDragEnd?: () => void;
  onAddBolt?: (sMm: number) => void;
  /** Time Konva spent drawing the scene layer, ms (for the drag benchmark). */
  onDrawn?: (drawMs: number) => void;
}

type Gesture =
  | { kind: "bolt"; id: string; x: number; y: number; moved: boolean }
  | { kind: "pan"; x: number; y: number; moved: boolean };

export default function JointStage(props: JointStageProps) {
  const { design, width, height, readOnly, onDrawn } = props;
  const stageRef = useRef<Konva.Stage>(null);
  const layerRef = useRef<Konva.Layer>(null);
  const baseLayerRef = useRef<Konva.Layer>(null);
  const lineLayerRef = useRef<Konva.Layer>(null);
  // The plate, gasket and bolt path: rebuilt only when one of them changes, not on a bolt move.
  const { outline, bore, gasket, boltPath } = design;
  const staticScene = useMemo(
    () => buildStaticScene({ outline, bore, gasket, boltPath }),
    [outline, bore, gasket, boltPath],
  );
  const boltScene = useMemo(
    () => buildBoltScene(design, staticScene.boltPath),
    [design, staticScene.boltPath],
  );
  const [view, setView] = useState<ViewTransform>(() => fitView(staticScene.bounds, width, height));
  const gesture = useRef<Gesture | null>(null);
  const space = useRef(false);
  const viewRef = useLatest(view);
  // Fit again when asked (Fit, F) or when the stage or the outline changes: state adjusted
  // during render, so the first paint after the change is already fitted.
  const fitFor = { token: props.fitToken, width, height, bounds: staticScene.bounds };
  const [fittedFor, setFittedFor] = useState(fitFor);
  if (
    fittedFor.token !== fitFor.token ||
    fittedFor.width !== width ||
    fittedFor.height !== height ||
    fittedFor.bounds !== fitFor.bounds
  ) {
    setFittedFor(fitFor);
    setView(fitView(staticScene.bounds, width, height));
  }

  useEffect(() => {
    const down = (e: KeyboardEvent) => {
      if (e.key === " " && !isTyping(e)) space.current = true;
    };
    const up = (e: KeyboardEvent) => {
      if (e.key === " ") space.current = false;
    };
    window.addEventListener("keydown", down);
    window.addEventListener("keyup", up);
    return () => {
      window.removeEventListener("keydown", down);
      window.removeEventListener("keyup", up);
    };
  }, []);

  // Draw time for the drag benchmark: the moving layer's draw, plus any draw of the still layers
  // since the last report (they redraw only when the view or the outline changes).
  useEffect(() => {
    const layer = layerRef.current;
    const still = [baseLayerRef.current, lineLayerRef.current].filter((l): l is Konva.Layer => !!l);
    if (!layer || !onDrawn) return;
    let t0 = 0,
      s0 = 0,
      stillMs = 0;
    const before = () => {
      t0 = performance.now();
    };
    const after = () => {
      onDrawn(performance.now() - t0 + stillMs);
      stillMs = 0;
    };
    const stillBefore = () => {
      s0 = performance.now();
    };
    const stillAfter = () => {
      stillMs += performance.now() - s0;
    };
    layer.on("beforeDraw", before);
    layer.on("draw", after);
    for (const l of still) {
      l.on("beforeDraw", stillBefore);
      l.on("draw", stillAfter);
    }
    return () => {
      layer.off("beforeDraw", before);
      layer.off("draw", after);
      for (const l of still) {
        l.off("beforeDraw", stillBefore);
        l.off("draw", stillAfter);
      }
    };
  }, [onDrawn]);

  useEffect(
    () => (stageRef.current ? installStageProbe(stageRef.current, () => viewRef.current) : undefined),
    [viewRef],
  );

  const pointer = () => stageRef.current?.getPointerPosition() ?? { x: 0, y: 0 };

  function onPointerDown(e: Konva.KonvaEventObject<PointerEvent>) {
    const p = pointer();
    const target = e.target as Konva.Node;
    if (target.name() === "bolt" && !space.current) {
      const id = target.getAttr("boltId") as string;
      props.onSelect?.(id);
      gesture.current = readOnly ? null : { kind: "bolt", id, x: p.x, y: p.y, moved: false };
      return;
    }
    gesture.current = { kind: "pan", x: p.x, y: p.y, moved: false };
  }

  function onPointerMove(e: Konva.KonvaEventObject<PointerEvent>) {
    const g = gesture.current;
    if (!g) return;
    const p = pointer();
    // A press that moves less than 3 px is a click (select), not a drag.
    if (!g.moved && Math.hypot(p.x - g.x, p.y - g.y) < 3) return;
    if (g.kind === "bolt") {
      if (!g.moved) props.onDragStart?.(g.id);
      g.moved = true;
      const free = e.evt.altKey || e.evt.shiftKey;
      props.onDragMove?.(g.id, toModel(viewRef.current, p.x, p.y), free, 8 / viewRef.current.k);
      return;
    }
    g.moved = true;
    const dx = p.x - g.x,
      dy = p.y - g.y;
    g.x = p.x;
    g.y = p.y;
    setView((v) => panBy(v, dx, dy));
  }

  function onPointerUp() {
    const g = gesture.current;
    gesture.current = null;
    if (!g) return;
    if (g.kind === "bolt" && g.moved) props.onDragEnd?.();
    if (g.kind === "pan" && !g.moved) props.onSelect?.(null);
  }

  // A press released outside the canvas still ends its gesture: one window listener for the
  // stage's life, calling the newest onPointerUp (it reads this render's props).
  const pointerUp = useLatest(onPointerUp);
  useEffect(() => {
    const up = () => {
      if (gesture.current) pointerUp.current();
    };
    window.addEventListener("pointerup", up);
    return () => window.removeEventListener("pointerup", up);
  }, [pointerUp]);

  function onDblClick(e: Konva.KonvaEventObject<MouseEvent>) {
    if (readOnly || (e.target as Konva.Node).name() !== "bolt-path-hit") return;
    const p = pointer();
    props.onAddBolt?.(projectOntoPath(staticScene.boltPath, toModel(viewRef.current, p.x, p.y)).sMm);
  }

  function onWheel(e: Konva.KonvaEventObject<WheelEvent>) {
    e.evt.preventDefault();
    const p = pointer();
    setView((v) => zoomAt(v, p.x, p.y, e.evt.deltaY < 0 ? 1.12 : 1 / 1.12));
  }

  const highlight = useMemo(() => new Set(props.highlightBoltIds), [props.highlightBoltIds]);
  const pathPoints = useMemo(
    () => staticScene.boltPathLine.flatMap((q) => [q.x, q.y]),
    [staticScene.boltPathLine],
  );

  return (
    <Stage
      ref={stageRef}
      width={width}
      height={height}
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onDblClick={onDblClick}
      onWheel={onWheel}
      style={{ touchAction: "none", cursor: readOnly ? "default" : "crosshair" }}
    >
      {/* Three canvases, so a drag frame redraws only what moves: the plate and the hit line for
          adding bolts below; heat map, bolts and marks in the middle; the bolt path drawn as a
          centre line through the holes on top (it takes no pointer events). */}
      <Layer ref={baseLayerRef}>
        <Group x={view.ox} y={view.oy} scaleX={view.k} scaleY={-view.k}>
          <FlangeShapes
            outline={staticScene.outline}
            bore={staticScene.bore}
            gasketOuter={staticScene.gasketOuter}
            gasketInner={staticScene.gasketInner}
          />
          <Line
            name="bolt-path-hit"
            points={pathPoints}
            closed
            stroke="transparent"
            strokeWidth={1}
            hitStrokeWidth={14}
            strokeScaleEnabled={false}
          />
        </Group>
      </Layer>
      <Layer ref={layerRef}>
        <Group x={view.ox} y={view.oy} scaleX={view.k} scaleY={-view.k}>
          {props.heat?.grid ? (
            <HeatGridNode picture={props.heat.grid} />
          ) : props.heat?.quads ? (
            <HeatLayerShape quads={props.heat.quads} colour={props.heat.colour} />
          ) : null}
          <BoltNodes
            bolts={boltScene.bolts}
            r={boltScene.holeRadiusMm}
            selectedId={props.selectedId}
            readOnly={readOnly}
          />
        </Group>
        <CanvasOverlays
          view={view}
          bolts={boltScene.bolts}
          holeRadiusMm={boltScene.holeRadiusMm}
          pitches={boltScene.pitches}
          checks={props.checks}
          units={props.units}
          highlightBoltIds={highlight}
        />
      </Layer>
      <Layer ref={lineLayerRef} listening={false}>
        <Group x={view.ox} y={view.oy} scaleX={view.k} scaleY={-view.k}>
          <Line
            id="path-of-bolts"
            points={pathPoints}
            closed
            stroke="#6b7c9c"
            strokeWidth={1}
            dash={[4, 4]}
            strokeScaleEnabled={false}
            listening={false}
          />
        </Group>
      </Layer>
    </Stage>
  );
}

function isTyping(e: KeyboardEvent): boolean {
  const t = e.target as HTMLElement | null;
  return (
    !!t &&
    (t.tagName === "INPUT" || t.tagName === "TEXTAREA" || t.tagName === "SELECT" || t.isContentEditable)
  );
}
