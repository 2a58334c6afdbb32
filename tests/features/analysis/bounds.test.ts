import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { INPUT_BOUNDS, WORK_LIMITS, boundMessage } from "@/features/analysis/core/bounds";
import type { JointDesign } from "@/features/analysis/core/design";
import { forceBalanceIssue, computeGasketStressProfiles } from "@/features/analysis/core/gasket-stress";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { DesignRefusedError, validateJointDesign } from "@/features/analysis/core/validate";
import { getDesignJsonSchema } from "@/features/analysis/json-schema";
import { formatDesignErrors, jointDesignSchema } from "@/features/analysis/schema";
import { FIELD_SPECS, layerThicknessSpec, parseNumberField } from "@/features/editor/model/field-specs";
import { circularFlange } from "./core/fixtures";

// Plausible ranges: one table (core/bounds.ts) read by the zod schema, the published JSON Schema,
// the editor and the core's validator; and the core's own force-balance refusal.
const withLayerThickness = (t: number): JointDesign => {
  const d = circularFlange();
  return { ...d, layers: d.layers.map((l) => (l.role === "gasket" ? l : { ...l, thicknessMm: t })) };
};
const withGasketModulus = (E: number): JointDesign => {
  const d = circularFlange();
  return { ...d, gasket: { ...d.gasket, material: { ...d.gasket.material, modulusMpa: E } } } as JointDesign;
};

function refusal(design: JointDesign): string[] {
  const parsed = jointDesignSchema.safeParse(design);
  expect(parsed.success).toBe(false);
  return parsed.success ? [] : formatDesignErrors(parsed.error);
}

describe("plausible ranges of the design inputs", () => {
  it("a 1e-320 mm flange is refused with the range and the reason, by the schema and by the core", () => {
    const design = withLayerThickness(1e-320);
    const message = boundMessage(INPUT_BOUNDS.plateThicknessMm);
    expect(message).toMatch(/^must be from 0\.5 mm to 2000 mm \(.+\)$/);
    expect(refusal(design)).toContain(`layers[0].thicknessMm: ${message}`);
    expect(validateJointDesign(design)).toContainEqual({ path: "layers[0].thicknessMm", message });
    expect(() => analyzeJoint(design)).toThrow(DesignRefusedError);
  });

  it("gasket moduli of 1e300 and 1e-300 MPa are refused; the ends of the range are accepted", () => {
    const b = INPUT_BOUNDS.gasketModulusMpa;
    for (const E of [1e300, 1e-300]) {
      expect(refusal(withGasketModulus(E)).join("\n")).toContain(
        `gasket.material.modulusMpa: ${boundMessage(b)}`,
      );
      expect(() => analyzeJoint(withGasketModulus(E))).toThrow(/gasket\.material\.modulusMpa: must be from/);
    }
    for (const E of [b.min, b.max])
      expect(jointDesignSchema.safeParse(withGasketModulus(E)).success).toBe(true);
  });

  it("one table: the editor, the schema, the JSON Schema and the validator agree on each bound", () => {
    // The nut factor maximum was 0.6 in the editor and 0.5 in the schema; the scatter limit was
    // 0.9 in the schema and "< 1" in the validator.
    expect(FIELD_SPECS.nutFactor.max).toBe(INPUT_BOUNDS.nutFactor.max);
    expect(parseNumberField(FIELD_SPECS.nutFactor, "0.55", "SI").ok).toBe(false);
    const d = circularFlange();
    const k055 = { ...d, assembly: { ...d.assembly, nutFactor: { ...d.assembly.nutFactor, value: 0.55 } } };
    expect(validateJointDesign(k055).map((i) => i.path)).toContain("assembly.nutFactor.value");
    expect(jointDesignSchema.safeParse(k055).success).toBe(false);
    const scatter95 = { ...d, assembly: { ...d.assembly, scatterOverride: 0.95 } };
    expect(validateJointDesign(scatter95).map((i) => i.path)).toContain("assembly.scatterOverride");
    expect(jointDesignSchema.safeParse(scatter95).success).toBe(false);
    expect(layerThicknessSpec(0).min).toBe(INPUT_BOUNDS.plateThicknessMm.min);

    const schema = JSON.stringify(getDesignJsonSchema());
    type Node = {
      properties: Record<string, Node>;
      minimum?: number;
      maximum?: number;
      description?: string;
    };
    const published = (getDesignJsonSchema() as unknown as Node).properties;
    const nut = published.assembly.properties.nutFactor.properties.value;
    expect(nut).toMatchObject({ minimum: 0.05, maximum: 0.5 });
    expect(nut.description).toContain(INPUT_BOUNDS.nutFactor.why);
    expect(schema).toContain(`"maximum":${INPUT_BOUNDS.gasketModulusMpa.max}`);
  });

  it("every valid example stays valid (the ranges bracket real joints)", () => {
    for (const design of [circularFlange(), circularFlange({ gasket: "full-face" })])
      expect(validateJointDesign(design)).toEqual([]);
  });
});

describe("work limits (bolts × samples per pitch, heat-map cells)", () => {
  it("512 bolts at 1024 samples per pitch and a 2048² grid are refused naming the limits", () => {
    const d = circularFlange({ boltCount: 64, boltCircleMm: 2400 });
    const heavy = {
      ...d,
      estimator: { ...d.estimator, samplesPerPitch: 1024 + 0, grid: { nx: 2048, ny: 2048 } },
    };
    const issues = validateJointDesign(heavy);
    expect(issues.find((i) => i.path === "estimator.grid")?.message).toContain(
      `over the work limit of ${WORK_LIMITS.gridCells.max}`,
    );
    const samples = { ...d, estimator: { ...d.estimator, samplesPerPitch: 2048 } };
    expect(validateJointDesign(samples).map((i) => i.path)).toContain("estimator.samplesPerPitch");
    const within = {
      ...d,
      estimator: { ...d.estimator, samplesPerPitch: 1024, grid: { nx: 1024, ny: 1024 } },
    };
    expect(validateJointDesign(within)).toEqual([]);
    const tooMany = { ...d, estimator: { ...d.estimator, samplesPerPitch: 1025 } };
    expect(validateJointDesign(tooMany).length).toBeGreaterThan(0);
  });

  it("bolts × samples over the limit: the message names the product and the limit", () => {
    const d = circularFlange({ boltCount: 128, boltCircleMm: 4800 });
    const heavy = { ...d, estimator: { ...d.estimator, samplesPerPitch: 1024 } };
    const message = validateJointDesign(heavy).find((i) => i.path === "estimator.samplesPerPitch")?.message;
    expect(message).toContain(
      `128 bolts × 1024 samples per pitch = 131072 gasket-path samples, over the work limit of ${WORK_LIMITS.pathSamples.max}`,
    );
  });
});

describe("the core refuses numbers whose own force balance is off by more than 0.5 %", () => {
  it("a 1e300 MPa gasket (past the validator) gives a beam force far off Σ F; the core refuses it", () => {
    // Straight to the solver, as if the range check were not there: the balance is hundreds of times off.
    const profiles = computeGasketStressProfiles(buildJointModel(withGasketModulus(1e300)));
    expect(Math.abs(profiles.beamInfo.forceBalanceRatio - 1)).toBeGreaterThan(0.005);
    const issue = forceBalanceIssue(profiles);
    expect(issue?.message).toMatch(/more than 0\.5 % off.*no numbers are returned/);
    const sound = computeGasketStressProfiles(buildJointModel(circularFlange()));
    expect(Math.abs(sound.beamInfo.forceBalanceRatio - 1)).toBeLessThan(1e-5);
    expect(forceBalanceIssue(sound)).toBeNull();
    expect(
      forceBalanceIssue({ ...sound, beamInfo: { ...sound.beamInfo, forceBalanceRatio: 1.006 } }),
    ).not.toBeNull();
    expect(
      forceBalanceIssue({ ...sound, beamInfo: { ...sound.beamInfo, forceBalanceRatio: 0.996 } }),
    ).toBeNull();
  });
});
