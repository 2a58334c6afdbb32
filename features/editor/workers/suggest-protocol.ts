import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";
import type { SuggestionProgress, SuggestionResult } from "@/features/analysis/core/suggest/search";

// Messages between the Layout desk and its pattern-search worker (suggest-worker.ts).
export interface SuggestWorkerRequest {
  request: SuggestionRequest;
}

export type SuggestWorkerReply =
  | ({ type: "progress" } & SuggestionProgress)
  | { type: "done"; result: SuggestionResult }
  | { type: "error"; message: string };
