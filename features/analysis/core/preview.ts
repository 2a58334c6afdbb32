/**
 * The light entry point for live editing (a bolt being dragged at 60 frames a second):
 * `previewJoint(design)` computes only the gasket-stress profile, its summary, the governing
 * estimator, the per-pair spacing checks and the gasket-stress checks (seating, crush, operating).
 * Every value equals the
 * corresponding part of `analyzeJoint(design)` exactly (same code path, same JSON conversion),
 * so the editor can show the preview and later swap in the full result without a jump.
 * Units: mm, N, MPa. Deterministic, JSON-serialisable.
 *
 * Example: `previewJoint(design).summary.minGasketStressMpa === analyzeJoint(design).summary.minGasketStressMpa`.
 */
import type { JointDesign } from "./design";
import { CORE_VERSION } from "./version";
import { DesignRefusedError, validateJointDesign } from "./validate";
import { buildJointModel } from "./joint-model";
import { balancedProfiles, profileArrays } from "./gasket-stress";
import { checkGasketStress } from "./checks/gasket-stress-checks";
import { checkSpacing } from "./checks/spacing";
import type { CheckRecord } from "./checks/check-record";
import type { JointAnalysis } from "./analyze";
import { toFiniteJson, toFiniteRecords } from "./finite-json";

export type PreviewCheck = CheckRecord & { boltIds: string[] };

export interface JointPreview {
  coreVersion: string;
  governingEstimator: "cone" | "beam";
  /** Same values as `JointAnalysis.summary` min/max/mean. */
  summary: { minGasketStressMpa: number; maxGasketStressMpa: number; meanGasketStressMpa: number };
  /** Same arrays as `JointAnalysis.gasketStress.profile` (stress at target preload). */
  profile: JointAnalysis["gasketStress"]["profile"];
  /** Bolt positions projected onto the gasket path, mm (`JointAnalysis.gasketStress.boltSOnPathMm`). */
  boltSOnPathMm: number[];
  /** The "gasket.seating" record of `JointAnalysis.checks`. */
  seating: PreviewCheck;
  /** All "gasket.*" stress records (seating first, then crush and the operating checks), in order. */
  gasket: PreviewCheck[];
  /** The per-pair "spacing.*" records of `JointAnalysis.checks`, in the same order. */
  spacing: PreviewCheck[];
}

/**
 * Throws, like `analyzeJoint`, for a design that `validateJointDesign` rejects. Pass
 * `{ validate: false }` only for a design already validated in this state (saves ≈ 1 ms).
 */
export function previewJoint(design: JointDesign, options: { validate?: boolean } = {}): JointPreview {
  if (options.validate !== false) {
    const issues = validateJointDesign(design);
    if (issues.length > 0) throw new DesignRefusedError(issues);
  }
  const model = buildJointModel(design);
  const { profiles, gov } = balancedProfiles(model);
  const withIds = (c: CheckRecord): PreviewCheck => ({ ...c, boltIds: c.subject ?? [] });
  // Plain arrays with non-finite values as null: what toFiniteJson gives analyzeJoint, in one pass.
  const arr = (a: ArrayLike<number>): number[] => {
    const out = new Array<number>(a.length);
    for (let i = 0; i < a.length; i++) {
      const v = a[i];
      // null where JSON would write it: the type stays number[] as in the JSON result.
      out[i] = Number.isFinite(v) ? v : (null as unknown as number);
    }
    return out;
  };
  const preview: Omit<JointPreview, "seating"> = {
    coreVersion: CORE_VERSION,
    governingEstimator: gov.estimator,
    profile: profileArrays(profiles, arr),
    boltSOnPathMm: arr(profiles.boltSOnPathMm),
    // The records and the summary get the conversion analyzeJoint applies (flat records: the short form).
    summary: toFiniteJson({
      minGasketStressMpa: gov.summary.minMpa,
      maxGasketStressMpa: gov.summary.maxMpa,
      meanGasketStressMpa: gov.summary.meanMpa,
    }).value,
    gasket: toFiniteRecords(checkGasketStress(model, gov.summary, gov.estimator).map(withIds)).value,
    spacing: toFiniteRecords(checkSpacing(model, gov.estimator === "cone").map(withIds)).value,
  };
  return { ...preview, seating: preview.gasket[0] };
}
