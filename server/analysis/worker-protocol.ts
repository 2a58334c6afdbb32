import type { MessagePort } from "node:worker_threads";
import type { JointDesign } from "@/features/analysis/core/design";
import type { DesignIssue } from "@/features/analysis/core/validate";
import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";

// What the request thread sends to an analysis worker and what comes back (structured clone).
// Shared by the pool (server/analysis/pool.ts) and the worker (analysis-worker.ts), which is
// bundled on its own by scripts/build-workers.mjs and so imports nothing but the core and this.

export interface AnalysisTask {
  document: JointDesign;
  /** The worker posts one message here when it starts on the task: the time limit runs from then. */
  started: MessagePort;
}

/** A pattern search ("Suggest pattern"): the same worker runs `suggestPatterns` instead. */
export interface SuggestionTask {
  suggestion: SuggestionRequest;
  started: MessagePort;
}

/** Both kinds answer alike: the core's result as JSON text, or the core's refusal. */
export type AnalysisTaskResult =
  /** The result as JSON text, exactly `JSON.stringify(analyzeJoint(document))`. */
  | { ok: true; json: string }
  /** The core refused the design (its DesignRefusedError, rebuilt on the request thread). */
  | { ok: false; prefix: string; issues: DesignIssue[] };
