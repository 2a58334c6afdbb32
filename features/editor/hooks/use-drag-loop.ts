"use client";
import { useCallback, useEffect, useRef } from "react";
import { useLatest } from "./use-latest";
import { flushSync } from "react-dom";
import type { JointDesign, PointMm } from "@/features/analysis/core/design";
import type { HistoryAction } from "../model/editor-action";
import { resolveMoveTarget } from "../model/move-bolt";

/**
 * One drag frame: the synchronous update (of which `computeMs` in the core), Konva's draw, and
 * their sum, ms; `analysed` is false when the core refused the layout (a hole over a neighbour's
 * or over the gasket), which makes a frame cheap and must not count as a fast one.
 */
export interface FrameTiming {
  reactMs: number;
  computeMs: number;
  drawMs: number;
  totalMs: number;
  analysed: boolean;
}

/** What the workspace reports of the frame it just rendered. */
export interface FrameCompute {
  computeMs: number;
  analysed: boolean;
}

declare global {
  interface Window {
    __sealpitchPerf?: { frames: FrameTiming[]; releases?: number[] };
  }
}

interface Move {
  id: string;
  point: PointMm;
  free: boolean;
  snapMm: number;
}

/**
 * Turns pointer moves into at most one document change per animation frame. Each frame is
 * rendered synchronously (flushSync) so the recompute + React work can be timed, and the Konva
 * draw that follows is added to it: `window.__sealpitchPerf.frames` (read by bench/editor-drag).
 */
export function useDragLoop(
  design: JointDesign,
  dispatch: (a: HistoryAction) => void,
  compute: { current: FrameCompute },
) {
  const designRef = useLatest(design);
  const pending = useRef<Move | null>(null);
  const raf = useRef(0);
  const frame = useRef<({ reactMs: number } & FrameCompute) | null>(null);

  const flush = useCallback(() => {
    raf.current = 0;
    const m = pending.current;
    pending.current = null;
    if (!m) return;
    const t0 = performance.now();
    const t = resolveMoveTarget(designRef.current, m.id, m.point, { free: m.free, snapMm: m.snapMm });
    flushSync(() => dispatch({ type: "move-bolt", boltId: m.id, sMm: t.sMm, offPathMm: t.offPathMm }));
    frame.current = { reactMs: performance.now() - t0, ...compute.current };
  }, [dispatch, compute, designRef]);

  const onDragStart = useCallback(() => dispatch({ type: "drag-start" }), [dispatch]);
  const onDragMove = useCallback(
    (id: string, point: PointMm, free: boolean, snapMm: number) => {
      pending.current = { id, point, free, snapMm };
      if (!raf.current) raf.current = requestAnimationFrame(flush);
    },
    [flush],
  );
  // Release: the full analysis and the drawing catch up in one synchronous update, timed too (the
  // Readout follows in a deferred render, see design-workspace.tsx).
  const onDragEnd = useCallback(() => {
    if (raf.current) cancelAnimationFrame(raf.current);
    flush();
    const t0 = performance.now();
    flushSync(() => dispatch({ type: "drag-end" }));
    const perf = (window.__sealpitchPerf ??= { frames: [] });
    (perf.releases ??= []).push(performance.now() - t0);
  }, [dispatch, flush]);
  const onDrawn = useCallback((drawMs: number) => {
    const f = frame.current;
    if (!f) return;
    frame.current = null;
    const perf = (window.__sealpitchPerf ??= { frames: [] });
    perf.frames.push({
      reactMs: f.reactMs,
      computeMs: f.computeMs,
      analysed: f.analysed,
      drawMs,
      totalMs: f.reactMs + drawMs,
    });
    if (perf.frames.length > 5000) perf.frames.splice(0, perf.frames.length - 5000);
  }, []);
  useEffect(
    () => () => {
      if (raf.current) cancelAnimationFrame(raf.current);
    },
    [],
  );
  return { onDragStart, onDragMove, onDragEnd, onDrawn };
}
