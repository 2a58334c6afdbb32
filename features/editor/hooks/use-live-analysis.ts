"use client";
import { useMemo, useState } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { DesignIssue } from "@/features/analysis/core/validate";
import { mergePreview } from "../model/merge-preview";
import { useEditorCore, type EditorCore } from "./use-editor-core";

// One shared empty list, so a memoised readout sees "no issues" as an unchanged prop.
const NO_ISSUES: DesignIssue[] = [];

export interface LiveAnalysis {
  result: JointAnalysis | null;
  issues: DesignIssue[];
  /** Time of the last recompute, ms. */
  computeMs: number;
  /** True when `result` is the stored server result rather than the browser's preview. */
  stored: boolean;
}

/**
 * Runs the core on every document change (the drag loop throttles changes to one per frame).
 * When the document is exactly the one the server stored, the stored result is shown instead:
 * it is the authoritative one, and the two must agree (see use-result-agreement.ts). While
 * dragging, the core's `previewJoint` (about half the work of `analyzeJoint`) runs instead and is
 * laid over the last full result (model/merge-preview.ts); the full analysis runs again as soon
 * as the drag ends. The core itself arrives after the page shows (use-editor-core.ts); until
 * then an edited document has no result (the stored one needs no core).
 */
export function useLiveAnalysis(
  design: JointDesign,
  stored: { document: JointDesign; result: JointAnalysis } | null,
  dragging = false,
): LiveAnalysis {
  // The last full result (stored or computed), laid under the previews while a bolt is dragged.
  const [lastFull, setLastFull] = useState<JointAnalysis | null>(null);
  const base = dragging ? lastFull : null;
  const core = useEditorCore();
  const live = useMemo(() => runCore(core, design, stored, base), [core, design, stored, base]);
  if (!dragging && live.result && live.result !== lastFull) setLastFull(live.result);
  return live;
}

/**
 * One run of the core for the Layout desk, timed (the drag benchmark reads `computeMs`): the
 * stored result when the document is the stored one, the preview over `base` when given, else
 * the full analysis; the validator's issues when the core refuses the layout; no result while
 * the core is still loading.
 */
function runCore(
  core: EditorCore | null,
  design: JointDesign,
  stored: { document: JointDesign; result: JointAnalysis } | null,
  base: JointAnalysis | null,
): LiveAnalysis {
  if (stored && stored.document === design)
    return { result: stored.result, issues: NO_ISSUES, computeMs: 0, stored: true };
  if (!core) return { result: null, issues: NO_ISSUES, computeMs: 0, stored: false };
  const t0 = performance.now();
  try {
    // analyzeJoint validates first; the issues are listed only when it refuses (no second pass per frame).
    const result = base ? mergePreview(base, core.previewJoint(design)) : core.analyzeJoint(design);
    return { result, issues: NO_ISSUES, computeMs: performance.now() - t0, stored: false };
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
    };
  }
}
