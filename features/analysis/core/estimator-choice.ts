/**
 * Which gasket-stress estimate governs. It is a matter of relative stiffness, not only of gasket
 * type: compare how far the flange, as a beam on the gasket foundation, spreads one bolt's load
 * along the path (to the first zero of Hetényi's solution, 3π/(4λ)) with the radius of the bolt's
 * pressure-cone footprint at the gasket plane, rc. Spread ≥ rc (soft gasket, stiff flange): the
 * beam governs, even for a full-face gasket. Spread < rc (metal-to-metal, thin hard gaskets):
 * the cone governs. A gasket that no cone footprint reaches (a raised-face ring inside the bolt
 * circle) is loaded through flange bending: the beam governs.
 */
export type EstimatorName = "cone" | "beam";

export interface EstimatorChoice {
  estimator: EstimatorName;
  requested: "auto" | EstimatorName;
  reason: string;
  /** 3π/(4λ), mm. */
  beamSpreadMm: number;
  coneRadiusMm: number;
  /** beamSpreadMm / coneRadiusMm. */
  spreadRatio: number;
}

/** Example: λ = 0.01 /mm → spread 235.6 mm; rc = 25 mm → ratio 9.4 → beam. */
export function chooseEstimator(input: {
  requested: "auto" | EstimatorName;
  lambdaPerMm: number;
  coneRadiusMm: number;
  coneMissesGasket: boolean;
}): EstimatorChoice {
  const beamSpreadMm = (3 * Math.PI) / (4 * input.lambdaPerMm);
  const spreadRatio = beamSpreadMm / input.coneRadiusMm;
  const base = { requested: input.requested, beamSpreadMm, coneRadiusMm: input.coneRadiusMm, spreadRatio };
  const spread = `beam spread 3π/(4λ) = ${beamSpreadMm.toFixed(1)} mm, cone footprint radius rc = ${input.coneRadiusMm.toFixed(1)} mm`;
  if (input.requested !== "auto") {
    const miss =
      input.requested === "cone" && input.coneMissesGasket
        ? "; note: no cone footprint reaches the gasket, so the cone estimate is zero"
        : "";
    return {
      ...base,
      estimator: input.requested,
      reason: `${input.requested} estimate requested in the design (${spread})${miss}`,
    };
  }
  if (input.coneMissesGasket) {
    return {
      ...base,
      estimator: "beam",
      reason: `no bolt's pressure-cone footprint reaches the gasket; the load reaches it through flange bending, so the beam on elastic foundation governs (${spread})`,
    };
  }
  if (spreadRatio >= 1) {
    return {
      ...base,
      estimator: "beam",
      reason: `the flange spreads each bolt's load further than its pressure cone (${spread}, ratio ${spreadRatio.toFixed(2)} ≥ 1): soft gasket relative to the flange, beam on elastic foundation governs`,
    };
  }
  return {
    ...base,
    estimator: "cone",
    reason: `the contact is stiff relative to the flange, so the load stays within each bolt's cone (${spread}, ratio ${spreadRatio.toFixed(2)} < 1): cone superposition governs`,
  };
}
