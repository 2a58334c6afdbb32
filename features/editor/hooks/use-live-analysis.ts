"use client";
import { useMemo, useRef } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import { analyzeJoint, type JointAnalysis } from "@/features/analysis/core/analyze";
import { validateJointDesign, type DesignIssue } from "@/features/analysis/core/validate";

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
 * it is the authoritative one, and the two must agree (see use-result-agreement.ts).
 */
export function useLiveAnalysis(design: JointDesign, stored: { document: JointDesign; result: JointAnalysis } | null): LiveAnalysis {
  const last = useRef<JointAnalysis | null>(null);
  return useMemo(() => {
    if (stored && stored.document === design) {
      last.current = stored.result;
      return { result: stored.result, issues: [], computeMs: 0, stored: true };
    }
    const t0 = performance.now();
    try {
      // analyzeJoint validates first; the issues are listed only when it refuses (no second pass per frame).
      const result = analyzeJoint(design);
      last.current = result;
      return { result, issues: [], computeMs: performance.now() - t0, stored: false };
    } catch (err) {
      const issues = validateJointDesign(design);
      return {
        result: null,
        issues: issues.length > 0 ? issues : [{ path: "design", message: err instanceof Error ? err.message : String(err) }],
        computeMs: performance.now() - t0,
        stored: false,
      };
    }
  }, [design, stored]);
}
