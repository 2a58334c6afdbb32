"use client";
import { startTransition, useCallback, useEffect, useMemo, useRef, useState } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { DesignIssue } from "@/features/analysis/core/validate";
import { mergePreview } from "../model/merge-preview";
import { AnalysisChannel, type ChannelReply } from "./analysis-channel";
import { useEditorCore, type EditorCore } from "./use-editor-core";
import { useLatest } from "./use-latest";

// One shared empty list, so a memoised readout sees "no issues" as an unchanged prop.
const NO_ISSUES: DesignIssue[] = [];

export interface LiveAnalysis {
  result: JointAnalysis | null;
  issues: DesignIssue[];
  /** Time the page's thread spent in the core for this result, ms (0 for a worker's answer). */
  computeMs: number;
  /** The core worker's time for the shown result, ms (0 when computed on the page). */
  workerMs: number;
  /** True when `result` is the stored server result rather than the browser's preview. */
  stored: boolean;
  /** True after a release until the worker's full analysis has come: `result` is the last preview. */
  pending: boolean;
}

/** The drag loop's hold on the worker's previews (use-drag-loop.ts). */
export interface LiveFrames {
  /** Shows the newest preview that came since the last frame (false: none came); called inside the frame's update. */
  take: () => boolean;
  /** `onArrival` is called when a preview comes, so the drag loop schedules a frame for it. */
  listen: (onArrival: (() => void) | null) => void;
}

declare global {
  interface Window {
    /** The last full result the core worker gave after a release, with its document. */
    __sealpitchReleased?: { document: JointDesign; result: JointAnalysis | null };
  }
}

type Answer = { design: JointDesign; result: JointAnalysis | null; issues: DesignIssue[]; workerMs: number };

/**
 * Runs the core on every document change (the drag loop throttles changes to one per frame).
 * When the document is exactly the one the server stored, the stored result is shown instead:
 * it is the authoritative one, and the two must agree (see use-result-agreement.ts).
 *
 * While a bolt is dragged the core's `previewJoint` (about half the work of `analyzeJoint`) runs
 * in the core worker (workers/core-worker.ts, latest wins, hooks/analysis-channel.ts) and each
 * answer is laid over the last full result (model/merge-preview.ts) in the next drag frame
 * (`frames.take`), so the page's thread only moves the bolt and paints the newest strip that has
 * come. On release the full analysis goes to the worker too; until it answers, the last preview
 * stays on screen (`pending`), then the worker's `analyzeJoint` result is shown as it came (the
 * same core; structured clone keeps every double). Other edits (fields, undo, place, rotate) run
 * `analyzeJoint` on the page as before, and everything does when there is no worker. The core
 * itself arrives after the page shows (use-editor-core.ts); until then an edited document has no
 * result (the stored one needs no core).
 */
export function useLiveAnalysis(
  design: JointDesign,
  stored: { document: JointDesign; result: JointAnalysis } | null,
  dragging = false,
): LiveAnalysis & { frames: LiveFrames; channel: AnalysisChannel | null } {
  // The last full result (stored or computed), laid under the previews while a bolt is dragged.
  const [lastFull, setLastFull] = useState<JointAnalysis | null>(null);
  const core = useEditorCore();
  const [channel, setChannel] = useState<AnalysisChannel | null>(null);
  const [preview, setPreview] = useState<ChannelReply | null>(null);
  const [full, setFull] = useState<Answer | null>(null);
  // The document of the last release, whose full analysis the worker computes.
  const [released, setReleased] = useState<JointDesign | null>(null);
  const [wasDragging, setWasDragging] = useState(dragging);
  const latest = useLatest({ design, dragging });
  const arrived = useRef<ChannelReply | null>(null);
  const onArrival = useRef<(() => void) | null>(null);

  useEffect(() => {
    if (!core) return;
    const c = new AnalysisChannel((r) => {
      if (r.mode === "preview") {
        // A drag's preview; dropped once the drag has ended (its full analysis follows).
        if (!latest.current.dragging) return;
        arrived.current = r;
        onArrival.current?.();
        return;
      }
      if (r.design !== latest.current.design) return; // edited since: the page computes that one
      // A transition: React renders the Layout desk's catch-up (sections, checks, drawing) in
      // slices, so no single task blocks the page for its whole length.
      startTransition(() =>
        setFull({
          design: r.design,
          result: r.issues ? null : r.full,
          issues: r.issues ?? NO_ISSUES,
          workerMs: r.workerMs,
        }),
      );
    });
    // A worker that could not start or stopped: render again, computing on the page.
    c.onFail = () => setChannel(null);
    setChannel(c);
    return () => c.dispose();
  }, [core, latest]);

  // Adjusted during render, so the release's own render already holds the preview (no page-side
  // analyzeJoint in the pointerup task).
  let releasedNow = released;
  if (wasDragging !== dragging) {
    setWasDragging(dragging);
    if (dragging) {
      setPreview(null);
    } else {
      releasedNow = design;
      setReleased(design);
    }
  }
  const useWorker = !!channel && !channel.failed && lastFull !== null;
  const isStored = !!stored && stored.document === design;
  const mode: "page" | "drag" | "pending" | "full" =
    isStored || !useWorker
      ? "page"
      : dragging
        ? "drag"
        : full?.design === design
          ? "full"
          : releasedNow === design
            ? "pending"
            : "page";

  // One value across the release (drag → pending), so the held result keeps its identity.
  const onPreview = mode === "drag" || mode === "pending";
  const dragShown = useMemo(
    () => (onPreview ? showPreview(lastFull, preview) : null),
    [onPreview, lastFull, preview],
  );
  const base = dragging ? lastFull : null;
  const pageLive = useMemo(
    () => (mode === "page" ? runCore(core, design, stored, base) : null),
    [mode, core, design, stored, base],
  );
  const live: LiveAnalysis =
    mode === "page"
      ? pageLive!
      : mode === "full"
        ? {
            result: full!.result,
            issues: full!.issues,
            computeMs: 0,
            workerMs: full!.workerMs,
            stored: false,
            pending: false,
          }
        : { ...dragShown!, pending: mode === "pending" };
  const isFull = mode === "full" || (mode === "page" && !dragging);
  if (isFull && live.result && live.result !== lastFull) setLastFull(live.result);

  // Ask the worker: a preview for each drag frame's document, the full analysis once on release.
  const hasBase = lastFull !== null;
  useEffect(() => {
    if (!channel || !hasBase || isStored) return;
    if (dragging) channel.request(design, "preview");
    else if (released === design) channel.request(design, "full");
  }, [channel, hasBase, isStored, dragging, released, design]);

  // For the drag benchmark's release probe, when the worker's full result was committed; for the
  // end-to-end test, the result with its document (e2e/editor-canvas.spec.ts compares it with analyzeJoint).
  useEffect(() => {
    if (mode !== "full" || !full) return;
    (window.__sealpitchPerf ??= { frames: [] }).releaseShownAt = performance.now();
    window.__sealpitchReleased = { document: full.design, result: full.result };
  }, [mode, full]);

  const take = useCallback(() => {
    const r = arrived.current;
    arrived.current = null;
    if (r) setPreview(r);
    return r !== null;
  }, []);
  const listen = useCallback((cb: (() => void) | null) => {
    onArrival.current = cb;
  }, []);
  const frames = useMemo(() => ({ take, listen }), [take, listen]);
  return { ...live, frames, channel };
}

/** The newest preview over the last full result; the last full result before one has come. */
function showPreview(base: JointAnalysis | null, r: ChannelReply | null): LiveAnalysis {
  if (!r)
    return { result: base, issues: NO_ISSUES, computeMs: 0, workerMs: 0, stored: false, pending: false };
  if (r.issues)
    return {
      result: null,
      issues: r.issues,
      computeMs: 0,
      workerMs: r.workerMs,
      stored: false,
      pending: false,
    };
  const t0 = performance.now();
  const result = base && r.mode === "preview" ? mergePreview(base, r.preview) : base;
  return {
    result,
    issues: NO_ISSUES,
    computeMs: performance.now() - t0,
    workerMs: r.workerMs,
    stored: false,
    pending: false,
  };
}

/**
 * One run of the core on the page, timed (the drag benchmark reads `computeMs`): the stored
 * result when the document is the stored one, the preview over `base` when given, else the full
 * analysis; the validator's issues when the core refuses the layout; no result while the core
 * is still loading.
 */
function runCore(
  core: EditorCore | null,
  design: JointDesign,
  stored: { document: JointDesign; result: JointAnalysis } | null,
  base: JointAnalysis | null,
): LiveAnalysis {
  const none = { workerMs: 0, pending: false };
  if (stored && stored.document === design)
    return { result: stored.result, issues: NO_ISSUES, computeMs: 0, stored: true, ...none };
  if (!core) return { result: null, issues: NO_ISSUES, computeMs: 0, stored: false, ...none };
  const t0 = performance.now();
  try {
    // analyzeJoint validates first; the issues are listed only when it refuses (no second pass per frame).
    const result = base ? mergePreview(base, core.previewJoint(design)) : core.analyzeJoint(design);
    return { result, issues: NO_ISSUES, computeMs: performance.now() - t0, stored: false, ...none };
  } catch (err) {
    const issues = core.validateJointDesign(design);
    return {
      result: null,
      issues:
        issues.length > 0
          ? issues
          : [{ path: "design", message: err instanceof Error ? err.message : String(err) }],
      computeMs: performance.now() - t0,
      stored: false,
      ...none,
    };
  }
}
