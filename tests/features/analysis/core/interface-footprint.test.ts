import { describe, expect, it } from "vitest";
import {
  FE_ROWS,
  FLEXIBLE_BEARING_STIFFNESS_FACTOR,
  FRUSTUM_STIFFNESS_CORRECTION,
  INTERFACE_CALIBRATION,
  MESH_CONVERGENCE,
} from "@/features/analysis/core/catalogue/interface-calibration";
import {
  footprintIntegralMm2,
  footprintShapeValue,
  interfaceFootprint,
} from "@/features/analysis/core/interface-footprint";
import { coneFootprintIntegralMm2 } from "@/features/analysis/core/cone-superposition";
import {
  accuracyTable,
  compareRow,
  fitInterfaceCalibration,
  fitStiffnessCorrection,
  flexibleBearingFactor,
} from "@/features/fe-check/calibration-fit";
import { solveInterface } from "@/features/fe-check/interface-study";

describe("calibrated interface footprint against the project's FE table (catalogue/interface-calibration.ts)", () => {
  it("the table covers t/d 0.5–4, both material pairs, both bearings, three bearing and hole sizes", () => {
    const t = new Set(FE_ROWS.map((r) => r.tOverD));
    expect(Math.min(...t)).toBe(0.5);
    expect(Math.max(...t)).toBe(4);
    expect(new Set(FE_ROWS.map((r) => r.pair)).size).toBe(2);
    expect(new Set(FE_ROWS.map((r) => r.bearing)).size).toBe(2);
    expect(new Set(FE_ROWS.map((r) => r.bearingOverD)).size).toBe(3);
    expect(new Set(FE_ROWS.map((r) => r.holeOverD)).size).toBe(3);
  });
  it("every FE row satisfied force balance: ∫ p dA = F within 0.5 %", () => {
    for (const r of FE_ROWS) expect(Math.abs(r.contactForceRatio - 1)).toBeLessThan(5e-3);
  });
  for (const r of FE_ROWS) {
    it(`t/d ${r.tOverD}, Dw/d ${r.bearingOverD}, dh/d ${r.holeOverD}, ${r.pair}, ${r.bearing}: rc within 10 %, peak within 20 % of FE (target of the calibration)`, () => {
      const e = compareRow(r, INTERFACE_CALIBRATION);
      expect(Math.abs(e.radiusError)).toBeLessThan(0.1);
      expect(Math.abs(e.peakError)).toBeLessThan(0.2);
    });
  }
  it("the stored coefficients are the generator's fit of the stored table (rerun npm run calibrate -- --refit after a change)", () => {
    const fit = fitInterfaceCalibration(FE_ROWS);
    expect(fit.coefficients.radius).toEqual([...INTERFACE_CALIBRATION.radius]);
    expect(fit.coefficients.shapeA).toEqual([...INTERFACE_CALIBRATION.shapeA]);
    expect(fit.coefficients.shapeB).toEqual([...INTERFACE_CALIBRATION.shapeB]);
    expect(flexibleBearingFactor(FE_ROWS)).toBe(FLEXIBLE_BEARING_STIFFNESS_FACTOR);
    expect(fitStiffnessCorrection(FE_ROWS, FLEXIBLE_BEARING_STIFFNESS_FACTOR)).toEqual([
      ...FRUSTUM_STIFFNESS_CORRECTION,
    ]);
  });
  it("member stiffness from the corrected frusta within 5 % of FE for the 1.1 d hole and 1.5 d bearing rows (internal target)", () => {
    for (const a of accuracyTable(
      FE_ROWS,
      INTERFACE_CALIBRATION,
      FLEXIBLE_BEARING_STIFFNESS_FACTOR,
      FRUSTUM_STIFFNESS_CORRECTION,
    ))
      expect(Math.abs(a.stiffness.model / a.stiffness.fe - 1)).toBeLessThan(0.05);
  });
  it("mesh convergence of the FE: the production mesh is within 2 % of the finest (radius, peak, stiffness)", () => {
    for (const t of [1, 3]) {
      const rows = MESH_CONVERGENCE.filter((m) => m.tOverD === t);
      const [, mid, fine] = rows;
      expect(Math.abs(mid.loadedRadiusOverD / fine.loadedRadiusOverD - 1)).toBeLessThan(0.02);
      expect(Math.abs(mid.peakMpaPer10kN / fine.peakMpaPer10kN - 1)).toBeLessThan(0.02);
      expect(Math.abs(mid.stiffnessOverEd / fine.stiffnessOverEd - 1)).toBeLessThan(0.02);
    }
  });
});

describe("calibrated footprint on a case outside the table: fresh CalculiX run, t/d = 2.5, M20, hole 1.1 d, nut face 1.5 d", () => {
  const d = 20;
  const t = 2.5 * d;
  const fe = solveInterface(
    {
      upper: { thicknessMm: t, modulusMpa: 207_000, poisson: 0.3 },
      lower: { thicknessMm: t, modulusMpa: 207_000, poisson: 0.3 },
      holeDiameterMm: 1.1 * d,
      bearingDiameterMm: 1.5 * d,
      outerRadiusMm: 8 * d + 4 * t,
      bearing: "flexible",
      elementSizeMm: t / 16,
    },
    10_000,
  );
  const fp = interfaceFootprint({
    depthMm: t,
    nominalDiameterMm: d,
    bearingDiameterMm: 1.5 * d,
    holeDiameterMm: 1.1 * d,
    modulusLogRatio: 0,
  });
  it("loaded-zone radius within 10 % of the FE", () =>
    expect(Math.abs(fp.outerRadiusMm / fe.loadedRadiusMm - 1)).toBeLessThan(0.1));
  it("peak pressure within 20 % of the FE", () => {
    const xi = (fe.peakAtMm - fp.innerRadiusMm) / (fp.outerRadiusMm - fp.innerRadiusMm);
    const model =
      (10_000 * footprintShapeValue(xi, fp.shapeA, fp.shapeB)) /
      footprintIntegralMm2(fp.innerRadiusMm, fp.outerRadiusMm, fp.shapeA, fp.shapeB);
    expect(Math.abs(model / fe.peakMpa - 1)).toBeLessThan(0.2);
  });
});

describe("published findings on interface pressure under a bolt", () => {
  // Cullimore & Upton, Int. J. Mech. Sci. 6 (1964) 13–25, measured and computed: "the pressure is
  // highest at the edge of the hole, but falls off rapidly to zero at a point whose distance from
  // the edge of the hole depends upon the thickness of the plates". Gould & Mikic, NASA CR
  // (NTRS 19700032666, 1970) and Trans. ASME 1972, 864–870: contact near the bolt, separation
  // beyond it, the radius of separation growing with plate thickness (FE and two experiments).
  const fp = (tOverD: number) =>
    interfaceFootprint({
      depthMm: tOverD * 16,
      nominalDiameterMm: 16,
      bearingDiameterMm: 24,
      holeDiameterMm: 17.6,
      modulusLogRatio: 0,
    });
  it("pressure is highest at the hole edge and falls to zero at rc (Cullimore & Upton 1964)", () => {
    for (const t of [0.5, 1, 2, 4]) {
      const f = fp(t);
      let prev = Infinity;
      for (let xi = 0; xi < 1; xi += 0.05) {
        const v = footprintShapeValue(xi, f.shapeA, f.shapeB);
        expect(v).toBeLessThanOrEqual(prev + 1e-12);
        prev = v;
      }
      expect(footprintShapeValue(1, f.shapeA, f.shapeB)).toBe(0);
    }
  });
  it("the loaded zone grows with plate thickness, and faster than the stiffness cone's footprint (Gould & Mikic 1970/1972)", () => {
    const r = [0.5, 1, 2, 3, 4].map((t) => fp(t).outerRadiusMm);
    for (let i = 1; i < r.length; i++) expect(r[i]).toBeGreaterThan(r[i - 1]);
    // The contact angle grows with t/d: the zone is not a cone of fixed angle.
    expect(fp(4).contactTangent).toBeGreaterThan(fp(1).contactTangent);
  });
  it("the FE table itself shows both findings (project FE, internal)", () => {
    const base = FE_ROWS.filter(
      (r) =>
        r.pair === "steel-steel" && r.bearing === "flexible" && r.bearingOverD === 1.5 && r.holeOverD === 1.1,
    ).sort((a, b) => a.tOverD - b.tOverD);
    for (let i = 1; i < base.length; i++)
      expect(base[i].loadedRadiusOverD).toBeGreaterThan(base[i - 1].loadedRadiusOverD);
    // Highest at the hole edge: the first interface cell carries ≥ 97 % of the peak (thick plates
    // are flat there, the maximum may sit a cell or two further out).
    for (const r of base) expect(r.profile[0][1]).toBeGreaterThan(0.97);
  });
});

describe("footprint integrals (internal)", () => {
  it("a = b = 1 is the linear falloff: ∫ = π(rc − ri)(rc + 2ri)/3, ri = 9, rc = 24 → 659.7 mm² [calc]", () => {
    expect(coneFootprintIntegralMm2(9, 24)).toBeCloseTo(659.73, 1);
    expect(footprintIntegralMm2(9, 24, 1, 1) / coneFootprintIntegralMm2(9, 24)).toBeCloseTo(1, 5);
  });
  it("b = 0 is a uniform annulus π(rc² − ri²)", () =>
    expect(footprintIntegralMm2(9, 24, 1, 0) / (Math.PI * (24 ** 2 - 81))).toBeCloseTo(1, 9));
});
