import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { DesignRefusedError } from "@/features/analysis/core/validate";
import warmUpDesign from "../../examples/pipe-flange-nps6-spiral-wound.json";
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import type { AnalysisTask, AnalysisTaskResult, SuggestionTask } from "./worker-protocol";

// One analysis worker thread of the pool (server/analysis/pool.ts). This file is not part of the
// Next bundle: scripts/build-workers.mjs bundles it with the core into .build/analysis-worker.mjs,
// which piscina loads in each thread. It imports only the core, so the numbers are the core's
// own, bit for bit the same as an analysis on the request thread.

// A new thread analyses one example first, so the JIT warm-up is not charged to the first
// request's time limit (a failure here is only a slower first request).
try {
  analyzeJoint(warmUpDesign as unknown as JointDesign);
} catch {
  // the example no longer validates: nothing to warm up
}

export default function analyze(task: AnalysisTask | SuggestionTask): AnalysisTaskResult {
  task.started.postMessage("started");
  task.started.close();
  try {
    const result = "suggestion" in task ? suggestPatterns(task.suggestion) : analyzeJoint(task.document);
    return { ok: true, json: JSON.stringify(result) };
  } catch (error) {
    if (!(error instanceof DesignRefusedError)) throw error;
    return { ok: false, prefix: error.message.slice(0, error.message.indexOf(":")), issues: error.issues };
  }
}
