"use client";
import { useEffect, useRef } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import { previewJoint } from "@/features/analysis/core/preview";
import { moveBolt } from "../model/move-bolt";

/** Preview runs done in idle time after the Layout desk opens. */
export const WARMUP_RUNS = 16;

/**
 * Runs the core's drag-time preview a few times while the browser is idle after the page opens,
 * one run per idle slice, results discarded. The page shows the stored result, so without this
 * the first drag runs the core's loops unoptimised: on a 96-bolt flange the first drag's frames
 * took 10–60 ms in the core against 2–3 ms once the JavaScript engine had compiled them. Every
 * other run moves the first bolt a little, along and off the path, through the editor's own
 * moveBolt, so the engine also sees the bolt objects a drag produces (with an off-path offset).
 */
export function useCoreWarmup(design: JointDesign, enabled: boolean): void {
  const latest = useRef(design);
  latest.current = design;
  useEffect(() => {
    if (!enabled) return;
    let left = WARMUP_RUNS;
    let handle = 0;
    const idle = (cb: () => void) =>
      typeof window.requestIdleCallback === "function" ? window.requestIdleCallback(cb, { timeout: 2000 }) : window.setTimeout(cb, 50);
    const cancel = (h: number) => (typeof window.cancelIdleCallback === "function" ? window.cancelIdleCallback(h) : window.clearTimeout(h));
    const step = () => {
      try {
        const d = latest.current;
        const b = d.bolts[0];
        previewJoint(left % 2 === 0 || !b ? d : moveBolt(d, b.id, { sMm: b.sMm + 0.1, offPathMm: (b.offPathMm ?? 0) + 0.1 }));
      } catch {
        return; // a layout the core refuses: nothing to warm up on
      }
      if (--left > 0) handle = idle(step);
    };
    handle = idle(step);
    return () => cancel(handle);
  }, [enabled]);
}
