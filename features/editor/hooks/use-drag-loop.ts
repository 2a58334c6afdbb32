"use client";
import { useCallback, useEffect, useRef } from "react";
import { useLatest } from "./use-latest";
import { flushSync } from "react-dom";
import type { JointDesign, PointMm } from "@/features/analysis/core/design";
import type { HistoryAction } from "../model/editor-action";
import { resolveMoveTarget } from "../model/move-bolt";
import type { LiveFrames } from "./use-live-analysis";

/**
 * One drag frame: the synchronous update (of which `computeMs` in the core), Konva's draw, and
 * their sum, ms; `analysed` is false when the core refused the layout (a hole over a neighbour's
 * or over the gasket), which makes a frame cheap and must not count as a fast one.
 */
export interface FrameTiming {
  reactMs: number;
  computeMs: number;
  /** The core worker's time for the preview this frame shows (off the page's thread), ms. */
  workerMs: number;
  drawMs: number;
  totalMs: number;
  analysed: boolean;
  /** True when the frame moved the bolt; false for a frame that only shows a preview that came. */
  moved: boolean;
}

/** What the workspace reports of the frame it just rendered. */
export interface FrameCompute {
  computeMs: number;
  workerMs: number;
  analysed: boolean;
}

declare global {
  interface Window {
    __sealpitchPerf?: {
      frames: FrameTiming[];
      /** The synchronous pointerup update of each release, ms. */
      releases?: number[];
      /** performance.now() when the full result after the last release was committed. */
      releaseShownAt?: number;
      /** Written by bench/editor-drag's release probe. */
      releaseProbe?: { blockMs: number; settleMs: number; shownMs: number }[];
    };
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
 * A frame also shows the newest preview the core worker has sent (`live.take`), in the same
 * update as the bolt's move; a preview that comes when no move is waiting gets a frame of its own.
 */
export function useDragLoop(
  design: JointDesign,
  dispatch: (a: HistoryAction) => void,
  compute: { current: FrameCompute },
  live: LiveFrames,
) {
  const designRef = useLatest(design);
  const pending = useRef<Move | null>(null);
  const raf = useRef(0);
  const frame = useRef<({ reactMs: number; moved: boolean } & FrameCompute) | null>(null);

  const flush = useCallback(() => {
    raf.current = 0;
    const m = pending.current;
    pending.current = null;
    const t0 = performance.now();
    let changed = false;
    flushSync(() => {
      changed = live.take();
      if (!m) return;
      const t = resolveMoveTarget(designRef.current, m.id, m.point, { free: m.free, snapMm: m.snapMm });
      dispatch({ type: "move-bolt", boltId: m.id, sMm: t.sMm, offPathMm: t.offPathMm });
      changed = true;
    });
    if (changed) frame.current = { reactMs: performance.now() - t0, moved: !!m, ...compute.current };
  }, [dispatch, compute, designRef, live]);
  useEffect(() => {
    live.listen(() => {
      if (!raf.current) raf.current = requestAnimationFrame(flush);
    });
    return () => live.listen(null);
  }, [live, flush]);

  const onDragStart = useCallback(() => dispatch({ type: "drag-start" }), [dispatch]);
  const onDragMove = useCallback(
    (id: string, point: PointMm, free: boolean, snapMm: number) => {
      pending.current = { id, point, free, snapMm };
      if (!raf.current) raf.current = requestAnimationFrame(flush);
    },
    [flush],
  );
  // Release: the last move lands and the drag ends in one synchronous update, timed too; the
  // full analysis follows from the core worker (use-live-analysis.ts), the Readout in a deferred
  // render (design-workspace.tsx).
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
      workerMs: f.workerMs,
      analysed: f.analysed,
      moved: f.moved,
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
