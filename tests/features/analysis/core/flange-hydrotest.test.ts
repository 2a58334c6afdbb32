/**
 * The hydrostatic test case at the test pressure the designer enters. Oracles: the Appendix 2 load
 * equations (ASME VIII-1 2-5(c)(1): H = π/4·G²·P, Hp = 2b·πG·m·P, Wm1 = H + Hp) written out here at Pt;
 * the Appendix 2 operating condition of the same joint analysed at P = Pt and ambient temperature
 * (the test case must reproduce it); UG-34 formula (3)/(5) against S = 0.9·Sy. The 0.9·Sy limit is
 * common practice, and the catalogue's yield values are [mem]: they are only read back from their rows.
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { getFlangeMaterialById } from "@/features/analysis/core/catalogue/flange-materials";
import { flangeSummaryLines } from "@/features/analysis/flange-summary";
import type { JointDesign } from "@/features/analysis/core/design";
import { circularFlange, rectangularCover } from "./fixtures";

function weldNeck(testPressureMpa?: number, pressureMpa = 2): JointDesign {
  return {
    ...circularFlange({ units: "US", pressureMpa }),
    flangeDesign: {
      kind: "integral-hub",
      hub: { g0Mm: 7.1, g1Mm: 14.2, hMm: 44 },
      flangeMaterialId: "sa-105",
      ...(testPressureMpa === undefined ? {} : { testPressureMpa }),
    },
  };
}

const testChecks = (d: JointDesign) => analyzeJoint(d).checks.filter((c) => c.id.startsWith("flange.test."));

describe("hydrostatic test case", () => {
  it("without an entered test pressure it is not computed, and the one rule says why", () => {
    const r = analyzeJoint(weldNeck());
    const checks = r.checks.filter((c) => c.id.startsWith("flange.test."));
    expect(checks.map((c) => c.id)).toEqual(["flange.test.bolt-load"]);
    expect(checks[0].status).toBe("not-applicable");
    expect(checks[0].note).toMatch(/No test pressure entered/);
    expect(r.flangeDesign.hydrotest.testCase).toBeNull();
  });

  it("Wm1 at the test pressure follows the Appendix 2 load equations at Pt", () => {
    const Pt = 3.9;
    const r = analyzeJoint(weldNeck(Pt));
    const tc = r.flangeDesign.hydrotest.testCase!;
    const G = r.asmeAppendix2.geometry.gMm;
    const b = r.asmeAppendix2.geometry.bMm;
    const m = weldNeck().gasket.material.m;
    expect(tc.hN).toBeCloseTo((Math.PI / 4) * G * G * Pt, 6);
    expect(tc.hpN).toBeCloseTo(2 * b * Math.PI * G * m * Pt, 6);
    expect(tc.wm1N).toBeCloseTo(tc.hN + tc.hpN, 6);
    const load = r.checks.find((c) => c.id === "flange.test.bolt-load")!;
    expect(load.limit).toBeCloseTo(tc.wm1N, 6);
    expect(load.status).toBe(load.value! >= load.limit! ? "pass" : "fail");
  });

  it("the flange stresses at test equal the operating condition of the same joint at P = Pt and ambient temperature", () => {
    const Pt = 3.9;
    const test = analyzeJoint(weldNeck(Pt)).flangeDesign.hydrotest.testCase!.flange!;
    const d = weldNeck(undefined, Pt);
    d.loads.designTemperatureC = 20;
    const op = analyzeJoint(d).flangeDesign.appendix2!.conditions.find((c) => c.condition === "operating")!;
    expect(test.shMpa).toBeCloseTo(op.shMpa!, 6);
    expect(test.srMpa).toBeCloseTo(op.srMpa!, 6);
    expect(test.stMpa).toBeCloseTo(op.stMpa!, 6);
    expect(test.limitMpa).toBeCloseTo(0.9 * getFlangeMaterialById("sa-105")!.yieldMpa, 9);
  });

  it("doubling Pt doubles Wm1 and the flange stresses at test (all loads are linear in pressure)", () => {
    const a = analyzeJoint(weldNeck(2)).flangeDesign.hydrotest.testCase!;
    const b = analyzeJoint(weldNeck(4)).flangeDesign.hydrotest.testCase!;
    expect(b.wm1N / a.wm1N).toBeCloseTo(2, 9);
    expect(b.flange!.stMpa / a.flange!.stMpa).toBeCloseTo(2, 9);
  });

  it("a test pressure far above the bolts' capacity fails the bolt-load rule and the flange stress rule", () => {
    const byId = Object.fromEntries(testChecks(weldNeck(60)).map((c) => [c.id, c]));
    expect(byId["flange.test.bolt-load"].status).toBe("fail");
    expect(byId["flange.test.flange-stress"].status).toBe("fail");
    expect(byId["flange.test.separation"].status).toBe("fail");
    const low = Object.fromEntries(testChecks(weldNeck(0.2)).map((c) => [c.id, c]));
    expect(low["flange.test.flange-stress"].status).toBe("pass");
    expect(low["flange.test.separation"].status).toBe("pass");
  });

  it("a sized cover gets the UG-34 thickness at Pt with W = Wm1t and S = 0.9·Sy: the operating thickness of the same cover at P = Pt, S = 0.9·Sy", () => {
    const cover = (
      flangeDesign: NonNullable<JointDesign["flangeDesign"]>,
      pressureMpa?: number,
    ): JointDesign => {
      const d = rectangularCover({ coverThicknessMm: 40 });
      if (pressureMpa !== undefined) d.loads.designPressureMpa = pressureMpa;
      return { ...d, flangeDesign };
    };
    const sketch = { kind: "catalogue", id: "ug34-j" } as const;
    const S = 0.9 * getFlangeMaterialById("sa-516-70")!.yieldMpa;
    const r = analyzeJoint(
      cover({ kind: "not-entered", coverSketch: sketch, coverMaterialId: "sa-516-70", testPressureMpa: 0.5 }),
    );
    const tc = r.flangeDesign.hydrotest.testCase!;
    expect(tc.cover!.allowableMpa).toBeCloseTo(S, 9);
    const atPt = analyzeJoint(
      cover(
        {
          kind: "not-entered",
          coverSketch: sketch,
          coverAllowable: { designMpa: S, ambientMpa: S, source: "0.9·Sy for this check" },
        },
        0.5,
      ),
    ).flangeDesign.cover!;
    expect(tc.cover!.requiredThicknessMm).toBeCloseTo(atPt.operatingThicknessMm!, 6);
    const check = r.checks.find((c) => c.id === "flange.test.cover-thickness")!;
    expect(check.value).toBe(40);
    expect(check.limit).toBeCloseTo(tc.cover!.requiredThicknessMm, 9);
    expect(check.status).toBe(40 >= check.limit! ? "pass" : "fail");
  });

  it("the Flange section lists the test case, and an older result without it says so", () => {
    const r = analyzeJoint(weldNeck(3.9));
    const lines = flangeSummaryLines(r, "US").map((l) => l.label);
    expect(lines).toContain("Test case: Wm1 at Pt / bolts at min preload");
    expect(lines).toContain("Test case: flange SH, SR, ST (0.9·Sy)");
    const old = structuredClone(r);
    delete old.flangeDesign.hydrotest.testCase;
    const oldLines = flangeSummaryLines(old, "US");
    expect(oldLines.find((l) => l.label === "Test case")!.value).toMatch(/core 2.2.0/);
  });
});
