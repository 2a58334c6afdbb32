/** One FE run of the interface calibration (rows of interface-calibration.ts; d = 16 mm, F = 10 kN). */
export interface InterfaceCalibrationRow {
  tOverD: number;
  bearingOverD: number;
  holeOverD: number;
  pair: "steel-steel" | "steel-cast-iron";
  bearing: "flexible" | "rigid";
  loadedRadiusOverD: number;
  /** Peak pressure over the mean pressure F/(π(rc² − ri²)). */
  peakOverMean: number;
  peakRadiusOverD: number;
  /** Member stiffness of the two plates km/(E_steel·d). */
  stiffnessOverEd: number;
  contactForceRatio: number;
  elements: number;
  /** (ξ, p/peak) at the closed interface cells. */
  profile: [number, number][];
}

/** One level of the mesh-convergence study. */
export interface MeshConvergenceRow {
  tOverD: number;
  elementSizeOverD: number;
  elements: number;
  loadedRadiusOverD: number;
  peakMpaPer10kN: number;
  stiffnessOverEd: number;
}
