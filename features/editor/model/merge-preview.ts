/**
 * While a bolt is dragged the editor runs the core's light `previewJoint` (profile, summary,
 * gasket-stress and spacing checks) instead of the full `analyzeJoint`, and lays it over the last full
 * result. The parts the preview computes are exact; the rest (bolt table, torque, Appendix 2,
 * edge checks) is the last full result's and is refreshed when the bolt is released.
 */
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import { countChecks } from "@/features/analysis/core/checks/check-record";
import type { JointPreview } from "@/features/analysis/core/preview";

type Check = JointAnalysis["checks"][number];

const isSpacing = (c: Check) => c.id.startsWith("spacing.");

/**
 * The full result `base` with the preview's profile, summary, gasket-stress and spacing records
 * put in place (spacing records where the base had its first one, so the list keeps its order).
 * Example: after dragging b2 next to b1, `mergePreview(base, previewJoint(d)).checks` holds
 * "spacing.min-pitch:b1-b2" with status "fail" even though `base` said "pass".
 */
export function mergePreview(base: JointAnalysis, preview: JointPreview): JointAnalysis {
  const checks: Check[] = [];
  const gasket = new Map(preview.gasket.map((c) => [c.id, c]));
  let spacingPlaced = false;
  for (const c of base.checks) {
    if (isSpacing(c)) {
      if (!spacingPlaced) checks.push(...preview.spacing);
      spacingPlaced = true;
    } else {
      checks.push(gasket.get(c.id) ?? c);
    }
  }
  if (!spacingPlaced) checks.push(...preview.spacing);
  const { summary, profile, boltSOnPathMm } = preview;
  return {
    ...base,
    summary: {
      ...base.summary,
      governingEstimator: preview.governingEstimator,
      minGasketStressMpa: summary.minGasketStressMpa,
      maxGasketStressMpa: summary.maxGasketStressMpa,
      meanGasketStressMpa: summary.meanGasketStressMpa,
      ...countChecks(checks),
    },
    gasketStress: {
      ...base.gasketStress,
      governing: preview.governingEstimator,
      minMpa: summary.minGasketStressMpa,
      maxMpa: summary.maxGasketStressMpa,
      meanMpa: summary.meanGasketStressMpa,
      boltSOnPathMm,
      profile,
    },
    checks,
  };
}
