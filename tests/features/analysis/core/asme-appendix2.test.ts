import { describe, expect, it } from "vitest";
import { asmeGasketGeometryNative, effectiveGasketWidth } from "@/features/analysis/core/asme-gasket-width";
import { computeAsmeAppendix2 } from "@/features/analysis/core/checks/asme-appendix2";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { circularFlange } from "./fixtures";

describe("ASME VIII-1 Appendix 2 b0, b, G check table (B16.20 spiral-wound sealing elements, Class 150, sketch 1a [pub2])", () => {
  const rows: [string, number, number, number, number, number][] = [
    // NPS, OD, ID, b0, b, G (inches)
    ["4", 5.88, 5.0, 0.22, 0.22, 5.44],
    ["5", 7.0, 6.13, 0.2175, 0.2175, 6.565],
    ["6", 8.25, 7.19, 0.265, 0.2574, 7.735],
    ["12", 14.75, 13.38, 0.3425, 0.2926, 14.165],
    ["24", 27.0, 24.75, 0.5625, 0.375, 26.25],
  ];
  for (const [nps, od, id, b0, b, g] of rows) {
    it(`NPS ${nps}: OD ${od} / ID ${id} in → b0 ${b0}, b ${b}, G ${g} in (inch branch)`, () => {
      const r = asmeGasketGeometryNative(od, id, "inch");
      expect(r.b0).toBeCloseTo(b0, 4);
      expect(r.b).toBeCloseTo(b, 4);
      expect(r.g).toBeCloseTo(g, 3);
    });
  }
  it("NPS 5 and 6 straddle the 1/4 in switch: G is the mean diameter for NPS 5, OD − 2b for NPS 6", () => {
    expect(asmeGasketGeometryNative(7.0, 6.13, "inch").g).toBeCloseTo((7.0 + 6.13) / 2, 10);
    expect(asmeGasketGeometryNative(8.25, 7.19, "inch").g).toBeCloseTo(8.25 - 2 * 0.5 * Math.sqrt(0.265), 10);
  });
  it("metric branch is its own rule (b = 2.5·√b0 above 6 mm), never a conversion of the inch branch", () => {
    expect(effectiveGasketWidth(6, "metric")).toBe(6);
    expect(effectiveGasketWidth(8, "metric")).toBeCloseTo(2.5 * Math.sqrt(8), 12);
    expect(effectiveGasketWidth(0.25, "inch")).toBe(0.25);
  });
  it("H = π/4·G²·P, Hp = 2b·π·G·m·P, Wm2 = π·b·G·y, Ab on the ROOT area (ASME VIII-1 Appendix 2)", () => {
    const design = circularFlange({ units: "US", pressureMpa: 2 });
    const model = buildJointModel(design);
    const { result, checks } = computeAsmeAppendix2(model);
    const G = result.geometry.gMm,
      b = result.geometry.bMm;
    expect(result.scope).toBe("appendix-2");
    expect(result.hN).toBeCloseTo((Math.PI / 4) * G * G * 2, 6);
    expect(result.hpN).toBeCloseTo(2 * b * Math.PI * G * 3 * 2, 6);
    expect(result.wm2N).toBeCloseTo(Math.PI * b * G * design.gasket.material.yMpa, 6);
    expect(result.actualRootAreaMm2).toBeCloseTo(8 * model.thread.rootAreaMm2, 9);
    const S = result.allowableMpa!;
    expect(result.requiredAreaMm2!).toBeCloseTo(Math.max(result.wm1N, result.wm2N) / S, 6);
    expect(result.flangeDesignLoadN!).toBeCloseTo(
      ((result.requiredAreaMm2! + result.actualRootAreaMm2) * S) / 2,
      6,
    );
    expect(checks.find((c) => c.id === "asme.app2.bolt-area")!.status).toBe(
      result.actualRootAreaMm2 >= result.requiredAreaMm2! ? "pass" : "fail",
    );
  });
  it("full-face and non-circular joints are flagged as the [practice] generalisation", () => {
    const { result, checks } = computeAsmeAppendix2(buildJointModel(circularFlange({ gasket: "full-face" })));
    expect(result.scope).toBe("generalised-practice");
    expect(checks.find((c) => c.id === "asme.app2.scope")!.status).toBe("warn");
    expect(checks.find((c) => c.id === "asme.app2.scope")!.note).toMatch(/practice/);
  });
});
