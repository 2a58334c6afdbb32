import "server-only";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { analyzeInWorker } from "@/server/analysis/pool";
import { timeAnalysis } from "@/server/metrics/registry";

// The one place the designs feature calls the engineering core, so saves, creates, the seed and
// the stateless API all store the same authoritative result with the version that produced it.
// The core runs in the analysis pool's worker threads (server/analysis/pool.ts), never on the
// request thread. Documents reach here validated (the core throws only for a design its
// validator rejects); past the pool's time limit this throws AnalysisUnavailableError.
export interface StoredAnalysis {
  /** The result as JSON text, as stored in `design_revisions.result` and sent by the API. */
  json: string;
  coreVersion: string;
}

export async function runAnalysis(
  document: JointDesign,
  kind: "stored" | "stateless" = "stored",
): Promise<StoredAnalysis> {
  return { json: await timeAnalysis(kind, () => analyzeInWorker(document)), coreVersion: CORE_VERSION };
}

/** The parsed result, for callers that hand the object on (the editor's save). */
export function parseAnalysis(stored: StoredAnalysis): JointAnalysis {
  return JSON.parse(stored.json) as JointAnalysis;
}
