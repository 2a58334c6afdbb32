/**
 * Calibration of the interface footprint (npm run calibrate): runs the axisymmetric CalculiX
 * model of features/fe-check over plate thickness t/d 0.5–4, bearing diameter/d, hole/d and two
 * material pairs (steel on steel, steel on grey cast iron), fits the loaded-zone radius and the
 * pressure shape, and writes both the FE table and the fitted coefficients into
 * features/analysis/core/catalogue/interface-calibration.ts (then formats it with Prettier).
 * Needs /usr/bin/ccx (Debian calculix-ccx). Takes a few minutes on one core.
 * `npm run calibrate -- --refit` refits the stored FE table without running the FE again.
 * Both print the accuracy table of README "Methods".
 */
import { execFileSync } from "node:child_process";
import { writeFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { solveInterface, type InterfaceStudy } from "@/features/fe-check/interface-study";
import type { BearingMode, PlateSpec } from "@/features/fe-check/axisym-model";
import {
  accuracyTable,
  flexibleBearingFactor,
  fitInterfaceCalibration,
  fitStiffnessCorrection,
  type InterfaceFeRow,
  type MeshConvergenceRow,
} from "@/features/fe-check/calibration-fit";

const D = 16; // M16; every result is written in ratios to d.
const STEEL: Omit<PlateSpec, "thicknessMm"> = { modulusMpa: 207_000, poisson: 0.3 };
// Grey cast iron (about ASTM A48 class 30–35) [practice]: E ≈ 100 GPa, ν ≈ 0.26.
const CAST_IRON: Omit<PlateSpec, "thicknessMm"> = { modulusMpa: 100_000, poisson: 0.26 };

interface Case {
  tOverD: number;
  bearingOverD: number;
  holeOverD: number;
  pair: "steel-steel" | "steel-cast-iron";
  bearing: BearingMode;
}

/** Element size: fine enough for ≥ 10 cells across the loaded zone of thin plates. */
export function elementSizeMm(tMm: number, d: number): number {
  return Math.max(tMm / 24, d / 32);
}

function run(c: Case, sizeMm?: number): InterfaceStudy {
  const t = c.tOverD * D;
  return solveInterface(
    {
      upper: { ...STEEL, thicknessMm: t },
      lower: { ...(c.pair === "steel-steel" ? STEEL : CAST_IRON), thicknessMm: t },
      holeDiameterMm: c.holeOverD * D,
      bearingDiameterMm: c.bearingOverD * D,
      outerRadiusMm: 8 * D + 4 * t,
      bearing: c.bearing,
      elementSizeMm: sizeMm ?? elementSizeMm(t, D),
    },
    10_000,
  );
}

function toRow(c: Case, s: InterfaceStudy): InterfaceFeRow {
  const ri = s.spec.holeDiameterMm / 2;
  const rc = s.loadedRadiusMm;
  const profile = s.cells
    .filter((x) => x.closed && x.rMid <= rc)
    .map(
      (x) => [round((x.rMid - ri) / (rc - ri), 4), round(x.pressureMpa / s.peakMpa, 4)] as [number, number],
    );
  return {
    ...c,
    loadedRadiusOverD: round(rc / D, 4),
    peakOverMean: round((s.peakMpa * Math.PI * (rc * rc - ri * ri)) / s.forceN, 4),
    peakRadiusOverD: round(s.peakAtMm / D, 4),
    stiffnessOverEd: round(s.memberStiffnessNPerMm / (STEEL.modulusMpa * D), 4),
    contactForceRatio: round(s.contactForceRatio, 5),
    elements: s.elements,
    profile,
  };
}

function round(x: number, digits: number): number {
  return Number(x.toFixed(digits));
}

async function main() {
  const target = fileURLToPath(
    new URL("../features/analysis/core/catalogue/interface-calibration.ts", import.meta.url),
  );
  if (process.argv.includes("--refit")) {
    const stored = await import("@/features/analysis/core/catalogue/interface-calibration");
    const rows = stored.FE_ROWS;
    finish(target, rows, stored.MESH_CONVERGENCE);
    return;
  }
  const cases: Case[] = [];
  const tds = [0.5, 0.75, 1, 1.5, 2, 3, 4];
  for (const t of tds)
    cases.push({ tOverD: t, bearingOverD: 1.5, holeOverD: 1.1, pair: "steel-steel", bearing: "flexible" });
  for (const t of tds)
    cases.push({ tOverD: t, bearingOverD: 1.5, holeOverD: 1.1, pair: "steel-steel", bearing: "rigid" });
  for (const t of tds)
    cases.push({
      tOverD: t,
      bearingOverD: 1.5,
      holeOverD: 1.1,
      pair: "steel-cast-iron",
      bearing: "flexible",
    });
  for (const t of [0.5, 1, 2, 4]) {
    cases.push({ tOverD: t, bearingOverD: 2.0, holeOverD: 1.1, pair: "steel-steel", bearing: "flexible" });
    cases.push({ tOverD: t, bearingOverD: 1.5, holeOverD: 1.0, pair: "steel-steel", bearing: "flexible" });
    cases.push({
      tOverD: t,
      bearingOverD: 1.8,
      holeOverD: 1.25,
      pair: "steel-cast-iron",
      bearing: "flexible",
    });
  }
  const rows: InterfaceFeRow[] = [];
  for (const c of cases) {
    const t0 = Date.now();
    const s = run(c);
    rows.push(toRow(c, s));
    console.log(
      `t/d ${c.tOverD} Dw/d ${c.bearingOverD} dh/d ${c.holeOverD} ${c.pair} ${c.bearing}: rc/d ${(s.loadedRadiusMm / D).toFixed(3)}, peak ${s.peakMpa.toFixed(2)} MPa, km ${s.memberStiffnessNPerMm.toExponential(4)} N/mm (${s.iterations} runs, ${s.elements} elements, ${Date.now() - t0} ms)`,
    );
  }
  const convergence: MeshConvergenceRow[] = [];
  for (const t of [1, 3]) {
    const base: Case = {
      tOverD: t,
      bearingOverD: 1.5,
      holeOverD: 1.1,
      pair: "steel-steel",
      bearing: "flexible",
    };
    const h0 = elementSizeMm(t * D, D);
    for (const f of [2, 1, 0.5]) {
      const s = run(base, h0 * f);
      convergence.push({
        tOverD: t,
        elementSizeOverD: round((h0 * f) / D, 5),
        elements: s.elements,
        loadedRadiusOverD: round(s.loadedRadiusMm / D, 4),
        peakMpaPer10kN: round(s.peakMpa, 4),
        stiffnessOverEd: round(s.memberStiffnessNPerMm / (STEEL.modulusMpa * D), 4),
      });
      console.log("convergence", convergence[convergence.length - 1]);
    }
  }
  finish(target, rows, convergence);
}

function pct(model: number, fe: number): string {
  const e = (model / fe - 1) * 100;
  return `${e >= 0 ? "+" : "−"}${Math.abs(e).toFixed(0)} %`;
}

function finish(target: string, rows: InterfaceFeRow[], convergence: MeshConvergenceRow[]) {
  const fit = fitInterfaceCalibration(rows);
  const flex = flexibleBearingFactor(rows);
  const stiff = fitStiffnessCorrection(rows, flex);
  console.log(
    "fit",
    JSON.stringify(fit.coefficients),
    "flexible factor",
    flex,
    "stiffness",
    JSON.stringify(stiff),
    "worst",
    JSON.stringify(fit.worst),
  );
  writeFileSync(target, renderCatalogue(rows, convergence, fit.coefficients, flex, stiff));
  execFileSync("npx", ["prettier", "--write", target], { stdio: "inherit" });
  console.log(`wrote ${target}\n`);
  console.log(
    "| t/d | pair, bearing | rc/d FE | previous | new | peak MPa FE | previous | new | km 1e6 N/mm FE | previous | new |",
  );
  console.log("| --- | --- | --- | --- | --- | --- | --- | --- | --- | --- | --- |");
  for (const a of accuracyTable(rows, fit.coefficients, flex, stiff))
    console.log(
      `| ${a.tOverD} | ${a.pair === "steel-steel" ? "steel/steel" : "steel/cast iron"}, ${a.bearing} | ${a.radius.fe.toFixed(2)} | ${a.radius.previous.toFixed(2)} (${pct(a.radius.previous, a.radius.fe)}) | ${a.radius.model.toFixed(2)} (${pct(a.radius.model, a.radius.fe)}) | ${a.peak.fe.toFixed(1)} | ${a.peak.previous.toFixed(1)} (${pct(a.peak.previous, a.peak.fe)}) | ${a.peak.model.toFixed(1)} (${pct(a.peak.model, a.peak.fe)}) | ${(a.stiffness.fe / 1e6).toFixed(2)} | ${(a.stiffness.previous / 1e6).toFixed(2)} (${pct(a.stiffness.previous, a.stiffness.fe)}) | ${(a.stiffness.model / 1e6).toFixed(2)} (${pct(a.stiffness.model, a.stiffness.fe)}) |`,
    );
}

function renderCatalogue(
  rows: InterfaceFeRow[],
  convergence: MeshConvergenceRow[],
  coefficients: ReturnType<typeof fitInterfaceCalibration>["coefficients"],
  flexFactor: number,
  stiffnessCorrection: number[],
): string {
  return `/**
 * GENERATED by scripts/calibrate-interface.ts (npm run calibrate) — do not edit by hand; rerun it.
 *
 * Interface footprint of one bolt clamping two plates, calibrated on the project's own
 * axisymmetric finite-element runs (CalculiX 2.20, CAX4, frictionless compression-only contact by
 * an active-set loop; features/fe-check). Coefficients [calc: least-squares fit to FE_ROWS]:
 * - loaded-zone radius rc = Dw/2 + h·tanφc, with
 *   tanφc = c0 + c1·ln(h/d) + c2·ln²(h/d) + c3·ln(Dw/(1.5 d)) + c4·(dh/d − 1.1) + c5·|ln(E1/E2)|
 * - pressure from the hole edge outwards p(ξ) = p0·(1 − ξ^a)^b, ξ = (r − dh/2)/(rc − dh/2),
 *   a = a0 + a1·ln(h/d), b = b0 + b1·ln(h/d), p0 from ∫ p dA = F.
 * Rows: d = 16 mm, F = 10 kN, plates of equal thickness t = h, outer radius 8 d + 4 t.
 */

import type { InterfaceCalibrationRow, MeshConvergenceRow } from "./interface-calibration-row";

export const INTERFACE_CALIBRATION = ${JSON.stringify(coefficients)} as const;

/** Member stiffness with a flexible (uniform-pressure) bearing over a rigid one, mean of the FE pairs [calc]. */
export const FLEXIBLE_BEARING_STIFFNESS_FACTOR = ${flexFactor};

/**
 * Frustum correction km_FE/km_frusta = s0 + s1·L + s2·L², L = ln(grip/(2d)) (real hole and bearing,
 * thickness-dependent substitute cone, bearing factor applied) [calc].
 */
export const FRUSTUM_STIFFNESS_CORRECTION = ${JSON.stringify(stiffnessCorrection)} as const;

export const INTERFACE_CALIBRATION_SOURCE =
  "interface footprint calibrated on axisymmetric FE (CalculiX, frictionless compression-only contact; scripts/calibrate-interface.ts) [calc]";

export const MESH_CONVERGENCE: MeshConvergenceRow[] = ${JSON.stringify(convergence)};

export const FE_ROWS: InterfaceCalibrationRow[] = ${JSON.stringify(rows)};
`;
}

void main();
