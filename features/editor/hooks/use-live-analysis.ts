"use client";
import { useMemo, useRef } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import { analyzeJoint, type JointAnalysis } from "@/features/analysis/core/analyze";
import { previewJoint } from "@/features/analysis/core/preview";
import { validateJointDesign, type DesignIssue } from "@/features/analysis/core/validate";
import { mergePreview } from "../model/merge-preview";

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
 * as the drag ends.
 */
export function useLiveAnalysis(
  design: JointDesign,
  stored: { document: JointDesign; result: JointAnalysis } | null,
  dragging = false,
): LiveAnalysis {
  const lastFull = useRef<JointAnalysis | null>(null);
  return useMemo(() => {
    if (stored && stored.document === design) {
      lastFull.current = stored.result;
      return { result: stored.result, issues: NO_ISSUES, computeMs: 0, stored: true };
    }
    const t0 = performance.now();
    try {
      if (dragging && lastFull.current) {
        const result = mergePreview(lastFull.current, previewJoint(design));
        return { result, issues: NO_ISSUES, computeMs: performance.now() - t0, stored: false };
      }
      // analyzeJoint validates first; the issues are listed only when it refuses (no second pass per frame).
      const result = analyzeJoint(design);
      lastFull.current = result;
      return { result, issues: NO_ISSUES, computeMs: performance.now() - t0, stored: false };
    } catch (err) {
      const issues = validateJointDesign(design);
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
  }, [design, stored, dragging]);
}
