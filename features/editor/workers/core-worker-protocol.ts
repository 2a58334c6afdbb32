import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";
import type { SuggestionProgress, SuggestionResult } from "@/features/analysis/core/suggest/search";
import type { DesignIssue } from "@/features/analysis/core/validate";
import type { PackedPreview } from "./preview-transfer";

// Messages between the Layout desk and its core worker (core-worker.ts). One module, two uses:
// the Pattern finder starts a worker per search (and terminates it to cancel); the live analysis
// keeps one for the page's life and sends it the drag previews and the full analysis on release.

/** A pattern search. */
export interface SuggestWorkerRequest {
  type: "suggest";
  request: SuggestionRequest;
}

export type SuggestWorkerReply =
  | ({ type: "progress" } & SuggestionProgress)
  | { type: "done"; result: SuggestionResult }
  | { type: "error"; message: string };

/** One run of the core on a document: the drag preview or the full analysis. */
export interface AnalyseWorkerRequest {
  type: "analyse";
  seq: number;
  mode: "preview" | "full";
  design: JointDesign;
}

/**
 * The run's outcome: the result (`preview` for mode "preview", `full` for "full"), or the
 * validator's issues when the core refused the layout; `ms` is the worker's time in the core.
 * The preview's profile arrays travel as Float64Arrays (transferred, not copied; NaN where the
 * result holds null) and are turned back into plain arrays on the page (workers/preview-transfer.ts).
 */
export type AnalyseWorkerReply = {
  type: "analysis";
  seq: number;
  ms: number;
} & (
  | { ok: true; mode: "full"; full: JointAnalysis }
  | { ok: true; mode: "preview"; preview: PackedPreview }
  | { ok: false; mode: "preview" | "full"; issues: DesignIssue[] }
);

export type CoreWorkerRequest = SuggestWorkerRequest | AnalyseWorkerRequest;
