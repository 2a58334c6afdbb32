"use client";
import { useEffect } from "react";
import { useEditorCore } from "./use-editor-core";
import { useLatest } from "./use-latest";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { buildHeatQuads } from "../model/heat-band";
import { mergePreview } from "../model/merge-preview";
import { moveBolt } from "../model/move-bolt";
import { toReadoutView } from "../model/readout-view";
import type { AnalysisChannel } from "./analysis-channel";

/** Drag frames computed, and thrown away, in idle time after the Layout desk opens. */
export const WARMUP_RUNS = 24;

/**
 * Computes what a drag frame computes (the core's preview laid over the full result, the
 * Readout view, the heat strip) a few times while the browser is idle after the page opens, one
 * run per idle slice, results discarded. The page shows the stored result, so without this the
 * first drag would run that code cold, before the JavaScript engine has compiled it. Every other
 * run moves the first bolt a little, along and off the path, through the editor's own moveBolt,
 * so the engine also sees the bolt objects a drag produces. Starts once the browser's core has come.
 * The same documents go to the core worker (`channel`), previews and full analyses in turn, which
 * computes them in its own engine while the page is idle; their answers are dropped.
 */
export function useCoreWarmup(
  design: JointDesign,
  base: JointAnalysis | null,
  enabled: boolean,
  channel: AnalysisChannel | null,
): void {
  const latest = useLatest({ design, base });
  const core = useEditorCore();
  useEffect(() => {
    if (!enabled || !core) return;
    const { previewJoint } = core;
    let left = WARMUP_RUNS;
    let handle = 0;
    const idle = (cb: () => void) =>
      typeof window.requestIdleCallback === "function"
        ? window.requestIdleCallback(cb, { timeout: 2000 })
        : window.setTimeout(cb, 50);
    const cancel = (h: number) =>
      typeof window.cancelIdleCallback === "function" ? window.cancelIdleCallback(h) : window.clearTimeout(h);
    const step = () => {
      const { design: d, base: full } = latest.current;
      const b = d.bolts[0];
      const moved =
        left % 2 === 0 || !b
          ? d
          : moveBolt(d, b.id, { sMm: b.sMm + 0.1, offPathMm: (b.offPathMm ?? 0) + 0.1 });
      channel?.request(moved, left % 4 < 2 ? "preview" : "full", true);
      try {
        const preview = previewJoint(moved);
        if (full) {
          const view = toReadoutView(mergePreview(full, preview));
          buildHeatQuads(moved, view.profile.sMm, view.profile.stressMpa, view.profile.minFactor);
        }
      } catch {
        return; // a layout the core refuses: nothing to warm up on
      }
      if (--left > 0) handle = idle(step);
    };
    handle = idle(step);
    return () => cancel(handle);
  }, [enabled, latest, core, channel]);
}
