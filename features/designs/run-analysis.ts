import { analyzeJoint, type JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { timeAnalysis } from "@/server/metrics/registry";

// The one place the designs feature calls the engineering core, so saves, creates, the seed and
// the stateless API all store the same authoritative result with the version that produced it.
// Documents reach here validated (analyzeJoint throws only for a design its validator rejects).
export interface StoredAnalysis {
  result: JointAnalysis;
  coreVersion: string;
}

export function runAnalysis(document: JointDesign, kind: "stored" | "stateless" = "stored"): StoredAnalysis {
  return { result: timeAnalysis(kind, () => analyzeJoint(document)), coreVersion: CORE_VERSION };
}
