/**
 * Least-squares fit of the interface footprint (features/analysis/core/interface-footprint.ts)
 * to FE rows, and the model-versus-FE errors the calibration reports. Pure.
 */
import {
  footprintIntegralMm2,
  footprintShapeValue,
  interfaceFootprint,
  type FootprintCoefficients,
} from "@/features/analysis/core/interface-footprint";
import type {
  InterfaceCalibrationRow,
  MeshConvergenceRow,
} from "@/features/analysis/core/catalogue/interface-calibration-row";
import { coneFootprintIntegralMm2 } from "@/features/analysis/core/cone-superposition";
import { thicknessDependentConeAngleDeg } from "@/features/analysis/core/cone-angle";
import { computeMemberStiffness, frustumCorrection } from "@/features/analysis/core/member-stiffness";

export type InterfaceFeRow = InterfaceCalibrationRow;
export type { MeshConvergenceRow };

/** |ln(E1/E2)| of the material pairs used in the calibration. */
export function pairModulusLogRatio(pair: InterfaceFeRow["pair"]): number {
  return pair === "steel-steel" ? 0 : Math.abs(Math.log(207_000 / 100_000));
}

function solveLinear(A: number[][], y: number[]): number[] {
  const n = y.length;
  const M = A.map((r, i) => [...r, y[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r][c]) > Math.abs(M[p][c])) p = r;
    [M[c], M[p]] = [M[p], M[c]];
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = M[r][c] / M[c][c];
      for (let k = c; k <= n; k++) M[r][k] -= f * M[c][k];
    }
  }
  return M.map((r, i) => r[n] / r[i]);
}

/** Weighted least squares: minimise Σ w·(x·β − y)². */
export function leastSquares(X: number[][], y: number[], w: number[]): number[] {
  const m = X[0].length;
  const A = Array.from({ length: m }, () => new Array(m).fill(0));
  const b = new Array(m).fill(0);
  X.forEach((row, i) => {
    for (let p = 0; p < m; p++) {
      b[p] += w[i] * row[p] * y[i];
      for (let q = 0; q < m; q++) A[p][q] += w[i] * row[p] * row[q];
    }
  });
  return solveLinear(A, b);
}

/** Best (a, b) of (1 − ξ^a)^b for one row's profile, normalised at the FE peak's ξ. */
export function fitShape(row: InterfaceFeRow): { a: number; b: number } {
  const xi0 = row.profile[0]?.[0] ?? 0;
  let best = { a: 1, b: 1, e: Infinity };
  for (let a = 0.6; a <= 4.0001; a += 0.05)
    for (let b = 0.4; b <= 3.0001; b += 0.05) {
      const s0 = footprintShapeValue(xi0, a, b);
      if (s0 <= 0) continue;
      let e = 0;
      for (const [xi, p] of row.profile) e += (p - footprintShapeValue(xi, a, b) / s0) ** 2;
      if (e < best.e) best = { a, b, e };
    }
  return { a: best.a, b: best.b };
}

export interface RowError {
  tOverD: number;
  pair: string;
  bearing: string;
  bearingOverD: number;
  holeOverD: number;
  radiusFe: number;
  radiusModel: number;
  radiusError: number;
  peakError: number;
}

/** The model against one FE row: loaded-zone radius and peak pressure (at the FE peak's radius). */
export function compareRow(row: InterfaceFeRow, c: FootprintCoefficients, d = 16): RowError {
  const fp = interfaceFootprint(
    {
      depthMm: row.tOverD * d,
      nominalDiameterMm: d,
      bearingDiameterMm: row.bearingOverD * d,
      holeDiameterMm: row.holeOverD * d,
      modulusLogRatio: pairModulusLogRatio(row.pair),
    },
    c,
  );
  const ri = fp.innerRadiusMm;
  const rcFe = row.loadedRadiusOverD * d;
  const peakFe = row.peakOverMean / (Math.PI * (rcFe * rcFe - ri * ri));
  const xi = (row.peakRadiusOverD * d - ri) / (fp.outerRadiusMm - ri);
  const peakModel =
    footprintShapeValue(xi, fp.shapeA, fp.shapeB) /
    footprintIntegralMm2(ri, fp.outerRadiusMm, fp.shapeA, fp.shapeB);
  return {
    tOverD: row.tOverD,
    pair: row.pair,
    bearing: row.bearing,
    bearingOverD: row.bearingOverD,
    holeOverD: row.holeOverD,
    radiusFe: row.loadedRadiusOverD,
    radiusModel: fp.outerRadiusMm / d,
    radiusError: fp.outerRadiusMm / rcFe - 1,
    peakError: peakModel / peakFe - 1,
  };
}

export function fitInterfaceCalibration(rows: InterfaceFeRow[]): {
  coefficients: { radius: number[]; shapeA: number[]; shapeB: number[] };
  errors: RowError[];
  worst: { radius: number; peak: number };
} {
  const X: number[][] = [];
  const y: number[] = [];
  const w: number[] = [];
  for (const r of rows) {
    const L = Math.log(r.tOverD);
    X.push([1, L, L * L, Math.log(r.bearingOverD / 1.5), r.holeOverD - 1.1, pairModulusLogRatio(r.pair)]);
    y.push((r.loadedRadiusOverD - r.bearingOverD / 2) / r.tOverD);
    w.push((r.tOverD / r.loadedRadiusOverD) ** 2);
  }
  const radius = leastSquares(X, y, w).map((v) => Number(v.toFixed(5)));
  const shapes = rows.map(fitShape);
  const XL = rows.map((r) => [1, Math.log(r.tOverD)]);
  const ones = rows.map(() => 1);
  const shapeA = leastSquares(
    XL,
    shapes.map((s) => s.a),
    ones,
  ).map((v) => Number(v.toFixed(4)));
  const shapeB = leastSquares(
    XL,
    shapes.map((s) => s.b),
    ones,
  ).map((v) => Number(v.toFixed(4)));
  const coefficients = { radius, shapeA, shapeB };
  const errors = rows.map((r) => compareRow(r, coefficients));
  return {
    coefficients,
    errors,
    worst: {
      radius: Math.max(...errors.map((e) => Math.abs(e.radiusError))),
      peak: Math.max(...errors.map((e) => Math.abs(e.peakError))),
    },
  };
}

/**
 * Flexible over rigid bearing member stiffness, mean over the rows that have both (same t/d,
 * bearing, hole, materials) [calc from the FE table].
 */
export function flexibleBearingFactor(rows: InterfaceFeRow[]): number {
  const ratios: number[] = [];
  for (const r of rows) {
    if (r.bearing !== "rigid") continue;
    const f = rows.find(
      (x) =>
        x.bearing === "flexible" &&
        x.tOverD === r.tOverD &&
        x.bearingOverD === r.bearingOverD &&
        x.holeOverD === r.holeOverD &&
        x.pair === r.pair,
    );
    if (f) ratios.push(f.stiffnessOverEd / r.stiffnessOverEd);
  }
  return Number((ratios.reduce((a, v) => a + v, 0) / ratios.length).toFixed(3));
}

export interface AccuracyRow {
  tOverD: number;
  pair: InterfaceFeRow["pair"];
  bearing: InterfaceFeRow["bearing"];
  radius: { fe: number; previous: number; model: number };
  peak: { fe: number; previous: number; model: number };
  stiffness: { fe: number; previous: number; model: number };
}

const E_STEEL = 207_000;
const E_CAST_IRON = 100_000;

/**
 * FE against the previous model (VDI-style substitute cone for the footprint with a linear
 * falloff; frusta with hole = d and a rigid bearing) and the calibrated one, for the rows with a
 * 1.1·d hole and a 1.5·d bearing. Radii in d, peaks in MPa for F = 10 kN on M16, km in N/mm.
 */
export function accuracyTable(
  rows: InterfaceFeRow[],
  c: FootprintCoefficients,
  flexFactor: number,
  stiffnessCorrection: readonly number[],
  d = 16,
): AccuracyRow[] {
  const F = 10_000;
  return rows
    .filter((r) => r.bearingOverD === 1.5 && r.holeOverD === 1.1)
    .map((r) => {
      const t = r.tOverD * d;
      const Dw = r.bearingOverD * d;
      const dh = r.holeOverD * d;
      const ri = dh / 2;
      const e2 = r.pair === "steel-steel" ? E_STEEL : E_CAST_IRON;
      const layers = [
        { thicknessMm: t, modulusMpa: E_STEEL },
        { thicknessMm: t, modulusMpa: e2 },
      ];
      const phi = thicknessDependentConeAngleDeg(2 * t, Dw, 3 * Dw);
      const rcPrev = Dw / 2 + t * Math.tan((phi * Math.PI) / 180);
      const peakPrev = F / coneFootprintIntegralMm2(ri, rcPrev);
      const fp = interfaceFootprint(
        {
          depthMm: t,
          nominalDiameterMm: d,
          bearingDiameterMm: Dw,
          holeDiameterMm: dh,
          modulusLogRatio: pairModulusLogRatio(r.pair),
        },
        c,
      );
      const rcFe = r.loadedRadiusOverD * d;
      const peakFe = (r.peakOverMean * F) / (Math.PI * (rcFe * rcFe - ri * ri));
      const xi = (r.peakRadiusOverD * d - ri) / (fp.outerRadiusMm - ri);
      const peakModel =
        (F * footprintShapeValue(xi, fp.shapeA, fp.shapeB)) /
        footprintIntegralMm2(ri, fp.outerRadiusMm, fp.shapeA, fp.shapeB);
      const kPrev = computeMemberStiffness({
        layers,
        bearingDiameterMm: Dw,
        holeDiameterMm: d,
        coneAngleDeg: phi,
      }).stiffnessNPerMm;
      const kNew =
        computeMemberStiffness({ layers, bearingDiameterMm: Dw, holeDiameterMm: dh, coneAngleDeg: phi })
          .stiffnessNPerMm *
        (r.bearing === "flexible" ? flexFactor : 1) *
        frustumCorrection(2 * t, d, stiffnessCorrection);
      return {
        tOverD: r.tOverD,
        pair: r.pair,
        bearing: r.bearing,
        radius: { fe: r.loadedRadiusOverD, previous: rcPrev / d, model: fp.outerRadiusMm / d },
        peak: { fe: peakFe, previous: peakPrev, model: peakModel },
        stiffness: { fe: r.stiffnessOverEd * E_STEEL * d, previous: kPrev, model: kNew },
      };
    });
}

/**
 * Correction of the frustum stiffness (real hole and bearing, thickness-dependent substitute
 * cone, bearing factor) to the FE: km_FE / km_frusta = s0 + s1·L + s2·L², L = ln(grip/(2d)).
 */
export function fitStiffnessCorrection(rows: InterfaceFeRow[], flexFactor: number, d = 16): number[] {
  const X: number[][] = [];
  const y: number[] = [];
  for (const r of rows) {
    const t = r.tOverD * d;
    const Dw = r.bearingOverD * d;
    const layers = [
      { thicknessMm: t, modulusMpa: E_STEEL },
      { thicknessMm: t, modulusMpa: r.pair === "steel-steel" ? E_STEEL : E_CAST_IRON },
    ];
    const phi = thicknessDependentConeAngleDeg(2 * t, Dw, 3 * Dw);
    const k =
      computeMemberStiffness({
        layers,
        bearingDiameterMm: Dw,
        holeDiameterMm: r.holeOverD * d,
        coneAngleDeg: phi,
      }).stiffnessNPerMm * (r.bearing === "flexible" ? flexFactor : 1);
    const L = Math.log(r.tOverD);
    X.push([1, L, L * L]);
    y.push((r.stiffnessOverEd * E_STEEL * d) / k);
  }
  return leastSquares(
    X,
    y,
    y.map(() => 1),
  ).map((v) => Number(v.toFixed(4)));
}
