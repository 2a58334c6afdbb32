/**
 * Operating case at design temperature: differential expansion and moduli by temperature change the
 * bolt load. Oracles: the springs-in-series arithmetic itself ([calc]); α and E are [mem] catalogue
 * values, so the tests check relations (signs, limits), never the remembered numbers.
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { circularFlange } from "./fixtures";

function hot(materialId: string, T: number): JointDesign {
  const d = circularFlange({ units: "SI", pressureMpa: 2 });
  d.loads.designTemperatureC = T;
  d.flangeDesign = { kind: "not-entered", flangeMaterialId: materialId };
  return d;
}

describe("operating case at design temperature", () => {
  it("at the bolt-up temperature nothing changes", () => {
    const t = analyzeJoint(hot("sa-105", 20)).flangeDesign.thermal!;
    expect(t.interferenceChangeMm).toBe(0);
    expect(t.stiffnessRatio).toBeCloseTo(1, 12);
    expect(t.minAtTemperatureN).toBeCloseTo(t.minPreloadN, 6);
  });
  it("F(T) = (F0/k0 + δth)·k(T) with δth = Σ αi·ti·ΔT − αb·grip·ΔT ([calc])", () => {
    const r = analyzeJoint(hot("sa-182-f316", 250));
    const t = r.flangeDesign.thermal!;
    const kb = r.stiffness.boltStiffnessNPerMm;
    const km = r.stiffness.memberStiffnessNPerMm;
    const k0 = 1 / (1 / kb + 1 / km);
    const kT = t.stiffnessRatio * k0;
    expect(t.minAtTemperatureN).toBeCloseTo((t.minPreloadN / k0 + t.interferenceChangeMm) * kT, 6);
    expect(t.interferenceChangeMm).toBeCloseTo(t.memberGrowthMm - t.boltGrowthMm, 12);
    expect(t.boltGrowthMm).toBeCloseTo(t.boltAlpha * r.stiffness.gripMm * 230, 9);
  });
  it("a stainless flange on alloy-steel bolts gains bolt load against a carbon-steel flange; moduli fall with temperature", () => {
    const ss = analyzeJoint(hot("sa-182-f316", 250)).flangeDesign.thermal!;
    const cs = analyzeJoint(hot("sa-105", 250)).flangeDesign.thermal!;
    expect(ss.interferenceChangeMm).toBeGreaterThan(cs.interferenceChangeMm);
    expect(ss.minAtTemperatureN).toBeGreaterThan(cs.minAtTemperatureN);
    expect(cs.stiffnessRatio).toBeLessThan(1);
  });
  it("the check compares n × F(T) at minimum preload with Wm1, and without a flange material says what is missing", () => {
    const r = analyzeJoint(hot("sa-105", 250));
    const c = r.checks.find((x) => x.id === "flange.thermal.bolt-load")!;
    expect(c.value!).toBeCloseTo(r.flangeDesign.thermal!.minAtTemperatureN * r.bolts.length, 6);
    expect(c.limit).toBeCloseTo(r.asmeAppendix2.wm1N, 6);
    expect(c.status).toBe(c.value! >= c.limit! ? "pass" : "fail");
    const none = analyzeJoint(circularFlange()).checks.find((x) => x.id === "flange.thermal.bolt-load")!;
    expect(none.status).toBe("not-applicable");
    expect(none.note).toMatch(/Pick the flange/);
  });
});
