import type { JointDesign } from "@/features/analysis/core/design";
import type { GasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";
import type { SuggestionProgress, SuggestionResult } from "@/features/analysis/core/suggest/search";
import type { DesignIssue } from "@/features/analysis/core/validate";
import type { PackedFull, PackedPreview } from "./preview-transfer";

// Messages between the Layout desk and its core worker (core-worker.ts). One module, two uses:
// the Pattern finder starts a worker per search (and terminates it to cancel); the live analysis
// keeps one for the page's life and sends it the drag previews and the full analysis on release;
// the heat map keeps one for the full-area grid once edits settle (hooks/grid-in-worker.ts).

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
  | { ok: true; mode: "full"; full: PackedFull }
  | { ok: true; mode: "preview"; preview: PackedPreview }
  | { ok: false; mode: "preview" | "full"; issues: DesignIssue[] }
);

/** The full-area gasket-stress grid of a document (the settled heat map). */
export interface GridWorkerRequest {
  type: "grid";
  seq: number;
  design: JointDesign;
  nx: number;
  ny: number;
}

/** The grid (its values transferred), or the reason the core gave none. */
export type GridWorkerReply = { type: "grid"; seq: number } & (
  { ok: true; grid: GasketStressGrid } | { ok: false; message: string }
);

export type CoreWorkerRequest = SuggestWorkerRequest | AnalyseWorkerRequest | GridWorkerRequest;
