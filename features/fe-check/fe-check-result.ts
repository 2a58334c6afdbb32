/**
 * What an FE cross-check run stores and every screen, sheet and API reads: the models' results,
 * the comparison of estimate against FE, the run's cautions, and its live progress. Pure (no
 * server imports), so client components may read it too.
 */
import type { StackCheckResult } from "./joint-stack";

/** The models of the FE cross-check, in the order they run. */
export type FeModelKey = "stack" | "gasket-path";

export const FE_MODEL_NAMES: Record<FeModelKey, string> = {
  stack: "Bolt stack (axisymmetric, one bolt)",
  "gasket-path": "Gasket path (whole joint, between bolts)",
};

export interface FeProgress {
  model: FeModelKey | null;
  /** Linear solver runs so far (each is one CalculiX run of the active-set loop). */
  runs: number;
  elements: number;
  solverSeconds: number;
}

export interface FeComparisonRow {
  key: string;
  quantity: string;
  unit: string;
  estimate: number | null;
  fe: number | null;
  /** (FE − estimate) / estimate, or null when either side is missing or the estimate is 0. */
  difference: number | null;
  model: FeModelKey;
  note: string;
}

export interface FeCheckResult {
  /** sha-256 of the document the run solved (fe_checks.document_hash). */
  documentHash: string;
  stack: StackCheckResult | null;
  stackError: string | null;
  /** Whole-joint gasket stress between bolts; null when the model did not run (see the error). */
  gasketPath: GasketPathSummary | null;
  gasketPathError: string | null;
  comparison: FeComparisonRow[];
  cautions: string[];
  /** Total solver wall time over every model, s. */
  solverSeconds: number;
}

/** The part of the gasket-path model's result the comparison and the drawings read. */
export interface GasketPathSummary {
  modelKind: string;
  elements: number;
  /** CalculiX runs of the contact (active-set) loop. */
  linearRuns: number;
  pathKind: "gasket-centre-line" | "bolt-path";
  /** Along the gasket path: arc length (mm), FE gasket stress and the estimate (MPa), same s as the estimate's profile. */
  sMm: number[];
  stressMpa: number[];
  estimateMpa: number[];
  /** False inside a hole or the bore on a full-face gasket's bolt path (stress 0 there, not counted). */
  onGasket: boolean[];
  minStressMpa: number;
  maxStressMpa: number;
  liftedLengthMm: number;
  /** Over the whole meshed gasket: the share of its area in contact and the highest cell-centre stress, MPa. */
  closedAreaFraction: number;
  peakCellMpa: number;
  /** The governing estimate at the same minimum preload, the one the FE values are compared with. */
  estimate: { estimator: "cone" | "beam"; minMpa: number; maxMpa: number; liftedLengthMm: number };
  /** |gasket reaction / bolt loads − 1| over the modelled part. */
  forceBalanceError: number;
  assumptions: string[];
  warnings: string[];
}

export const FE_CAUTIONS = [
  "FE cross-check: a linear-elastic model of the stated assumptions, solved with CalculiX. It is not a substitute for an FE analysis qualified under the governing code.",
  "Like every Sealpitch result it is an engineering estimate: design to the governing code, the gasket maker's data supersede generic values, and a competent or licensed engineer reviews the joint.",
];

export function relativeDifference(estimate: number | null, fe: number | null): number | null {
  if (estimate === null || fe === null || estimate === 0) return null;
  return (fe - estimate) / estimate;
}

/** Estimate against FE, one row per compared quantity (a model that did not run gives FE null). */
export function compareWithEstimate(
  estimate: { minGasketStressMpa: number; maxGasketStressMpa: number; liftedLengthMm: number | null },
  stack: StackCheckResult | null,
  gasketPath: GasketPathSummary | null,
): FeComparisonRow[] {
  const row = (
    key: string,
    quantity: string,
    unit: string,
    model: FeModelKey,
    e: number | null,
    f: number | null,
    note: string,
  ): FeComparisonRow => ({
    key,
    quantity,
    unit,
    model,
    estimate: e,
    fe: f,
    difference: relativeDifference(e, f),
    note,
  });
  return [
    row(
      "min-gasket-stress",
      "Minimum gasket stress along the path",
      "MPa",
      "gasket-path",
      estimate.minGasketStressMpa,
      gasketPath?.minStressMpa ?? null,
      "at minimum preload",
    ),
    row(
      "max-gasket-stress",
      "Maximum gasket stress along the path",
      "MPa",
      "gasket-path",
      estimate.maxGasketStressMpa,
      gasketPath?.maxStressMpa ?? null,
      "at minimum preload",
    ),
    row(
      "lifted-length",
      "Lifted length of the gasket path",
      "mm",
      "gasket-path",
      estimate.liftedLengthMm,
      gasketPath?.liftedLengthMm ?? null,
      "gasket stress ≤ 0",
    ),
    row(
      "loaded-zone-radius",
      "Loaded-zone radius at the gasket plane",
      "mm",
      "stack",
      stack?.estimate.loadedRadiusMm ?? null,
      stack?.fe.loadedRadiusMm ?? null,
      "estimate: pressure-cone radius",
    ),
    row(
      "member-stiffness",
      "Clamped-stack stiffness",
      "N/mm",
      "stack",
      stack?.estimate.memberStiffnessNPerMm ?? null,
      stack?.fe.memberStiffnessNPerMm ?? null,
      "frusta in series, like for like",
    ),
    row(
      "peak-interface-pressure",
      "Peak interface pressure at the gasket plane",
      "MPa",
      "stack",
      stack?.estimate.peakMpa ?? null,
      stack?.fe.peakMpa ?? null,
      "one bolt alone",
    ),
  ];
}
