import { describe, expect, it } from "vitest";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { computeMemberStiffness, frustumCorrection } from "@/features/analysis/core/member-stiffness";
import { periodicBeamCompliancePerN, hetenyiDeflectionMm } from "@/features/analysis/core/beam-foundation";
import {
  FLEXIBLE_BEARING_STIFFNESS_FACTOR,
  FRUSTUM_STIFFNESS_CORRECTION,
} from "@/features/analysis/core/catalogue/interface-calibration";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { circularFlange, ELASTOMER_INSERTION } from "./fixtures";

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const ring = { innerDiameterMm: 182.6, outerDiameterMm: 209.6 };

describe("member stiffness with the real hole and bearing (engineering model 5: the frustum with dh and D [calc])", () => {
  it("the model's frusta use the entered hole diameter: a larger clearance hole gives softer members", () => {
    const a = buildJointModel(circularFlange({ gasket: ring, holeDiameterMm: 20.6 }));
    const b = buildJointModel(circularFlange({ gasket: ring, holeDiameterMm: 23.8 }));
    expect(b.frusta[0].stiffnessNPerMm).toBeLessThan(a.frusta[0].stiffnessNPerMm);
    const f = a.frusta[0];
    const direct = computeMemberStiffness({
      layers: [{ thicknessMm: f.thicknessMm, modulusMpa: f.modulusMpa }],
      bearingDiameterMm: a.bearingDiameterMm,
      holeDiameterMm: 20.6,
      coneAngleDeg: a.coneAngleDeg,
    }).frusta[0];
    expect(direct.narrowDiameterMm).toBeCloseTo(f.narrowDiameterMm, 9);
  });
  it("a washer's OD is the bearing diameter; without one the nut face 1.5·d", () => {
    const base = circularFlange({ gasket: ring });
    expect(buildJointModel(base).bearingDiameterMm).toBeCloseTo(1.5 * 19.05, 9);
    const w = buildJointModel({
      ...base,
      fastener: { ...base.fastener, washer: { thicknessMm: 4, outerDiameterMm: 40 } },
    });
    expect(w.bearingDiameterMm).toBe(40);
  });
  it(`"washer acts as flexible" scales the frusta by the FE ratio ${FLEXIBLE_BEARING_STIFFNESS_FACTOR} and says so; rigid is the default`, () => {
    const base = circularFlange({ gasket: ring });
    const rigid = buildJointModel(base);
    const flex = buildJointModel({ ...base, fastener: { ...base.fastener, washerActsAs: "flexible" } });
    expect(rigid.washerActsAs).toBe("rigid");
    expect(flex.frusta[0].stiffnessNPerMm / rigid.frusta[0].stiffnessNPerMm).toBeCloseTo(
      FLEXIBLE_BEARING_STIFFNESS_FACTOR,
      9,
    );
    expect(flex.jointConstant).toBeGreaterThan(rigid.jointConstant);
    expect(flex.notes.join(" ")).toMatch(/flexible \(design input/);
  });
  it("thickness-dependent cone: frusta carry the FE correction for grip/2d; a fixed angle is left as the textbook model", () => {
    const cal = buildJointModel(circularFlange({ gasket: ring }));
    const fixed = buildJointModel(
      circularFlange({ gasket: ring, coneAngle: { mode: "fixed", degrees: 30 } }),
    );
    expect(cal.memberStiffnessBasis).toMatch(/FE correction/);
    expect(fixed.memberStiffnessBasis).not.toMatch(/FE correction/);
    const c = frustumCorrection(2 * 25.4, 19.05, FRUSTUM_STIFFNESS_CORRECTION);
    expect(c).toBeGreaterThan(0.95);
    expect(c).toBeLessThan(1.2);
  });
});

describe("clamped-part stiffness from the governing model", () => {
  const soft = circularFlange({
    gasket: "full-face",
    gasketMaterial: ELASTOMER_INSERTION,
    flangeThicknessMm: 40,
  });
  it("a soft full-face gasket under a thick flange: the beam governs and km = 1/(1/k_metal + w/F of the periodic beam), and the result says so", () => {
    const m = buildJointModel(soft);
    expect(m.memberStiffnessBasis).toMatch(/^beam on elastic foundation \(governing\)/);
    const pitch = m.region.path.lengthMm / m.boltPoints.length;
    const wf = periodicBeamCompliancePerN(m.lambdaPerMm, m.foundationModulusMpa, pitch);
    const metal = m.memberStiffnessBasis.match(/metal frusta ([0-9.e+]+) N\/mm/);
    expect(metal).not.toBeNull();
    expect(rel(1 / m.memberStiffnessNPerMm, 1 / Number(metal![1]) + wf)).toBeLessThan(1e-3);
    const a = analyzeJoint(soft);
    expect(a.estimator.governing).toBe("beam");
    expect(a.stiffness.memberStiffnessBasis).toMatch(/beam on elastic foundation \(governing\)/);
  });
  it("the beam gives stiffer clamped parts than the gasket as one frustum layer (the frustum spreads the gasket too little)", () => {
    const beam = buildJointModel(soft);
    const frustum = buildJointModel({ ...soft, estimator: { ...soft.estimator, estimator: "cone" } });
    expect(frustum.memberStiffnessBasis).toMatch(/one frustum layer/);
    expect(beam.memberStiffnessNPerMm).toBeGreaterThan(frustum.memberStiffnessNPerMm);
  });
  it("periodic beam compliance equals the sum of Hetényi's point-load deflections (Hetényi 1946) and has the right limits [calc]", () => {
    const lam = 0.02;
    const k = 2000;
    const p = 100;
    let sum = 0;
    for (let j = -200; j <= 200; j++) sum += hetenyiDeflectionMm(1, k, lam, j * p);
    expect(rel(periodicBeamCompliancePerN(lam, k, p), sum)).toBeLessThan(1e-9);
    expect(periodicBeamCompliancePerN(lam, k, p)).toBeCloseTo(5.43e-6, 8);
    expect(rel(periodicBeamCompliancePerN(1e-6, k, p), 1 / (k * p))).toBeLessThan(1e-3);
    expect(rel(periodicBeamCompliancePerN(1, k, p), 1 / (2 * k))).toBeLessThan(1e-9);
  });
});
