import type { JointDesign } from "@/features/analysis/core/design";
import { CORE_VERSION } from "@/features/analysis/core/version";
import type { JointAnalysis } from "./workspace-contract";

// The one place the designs feature calls the engineering core, so saves, creates, the seed and
// the stateless API all store the same authoritative result with the version that produced it.
// analyzeJoint (features/analysis/core/analyze.ts) is not in the tree yet: until it lands the
// result is null (the DTO allows it) and the core version is still recorded.
// TODO(designs): call analyzeJoint here when the core publishes it.
export interface StoredAnalysis {
  result: JointAnalysis | null;
  coreVersion: string;
}

export function runAnalysis(document: JointDesign): StoredAnalysis {
  void document;
  return { result: null, coreVersion: CORE_VERSION };
}
