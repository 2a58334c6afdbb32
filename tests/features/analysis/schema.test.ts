import { describe, expect, it } from "vitest";
import { formatDesignErrors, jointDesignSchema } from "@/features/analysis/schema";
import { getDesignJsonSchema } from "@/features/analysis/json-schema";
import { placeBoltsEqually } from "@/features/analysis/core/geometry";
import { circularFlange } from "./core/fixtures";

function errors(design: unknown): string[] {
  const r = jointDesignSchema.safeParse(design);
  return r.success ? [] : formatDesignErrors(r.error);
}

describe("jointDesignSchema rejects bad designs with messages that name the field", () => {
  it("accepts a valid design", () => expect(errors(circularFlange())).toEqual([]));
  it("zero and negative dimensions", () => {
    const d = circularFlange();
    d.outline = { kind: "circle", diameterMm: 0 };
    expect(errors(d).some((e) => e.startsWith("outline.diameterMm:"))).toBe(true);
    const n = circularFlange();
    n.layers[0] = { role: "flange", thicknessMm: -3, materialName: "x", modulusMpa: 200_000 };
    expect(errors(n).some((e) => e.startsWith("layers[0].thicknessMm:"))).toBe(true);
    // One message per refused field: the core's own range check does not repeat zod's.
    expect(errors(n).filter((e) => e.startsWith("layers[0].thicknessMm:"))).toHaveLength(1);
    expect(errors(d).filter((e) => e.startsWith("outline.diameterMm:"))).toHaveLength(1);
  });
  it("NaN and Infinity", () => {
    const d = circularFlange();
    d.boltPath = { kind: "circle", diameterMm: Number.NaN };
    expect(errors(d).some((e) => e.startsWith("boltPath.diameterMm:"))).toBe(true);
    const i = circularFlange();
    i.loads.designPressureMpa = Number.POSITIVE_INFINITY;
    expect(errors(i).some((e) => e.startsWith("loads.designPressureMpa:"))).toBe(true);
  });
  it("a bolt outside the flange outline → bolts[3].position", () => {
    const d = circularFlange();
    d.bolts[3] = { ...d.bolts[3], offPathMm: 40 };
    expect(errors(d)).toContain("bolts[3].position: bolt hole lies outside the flange outline");
  });
  it("overlapping bolt holes", () => {
    const d = circularFlange();
    d.bolts[5] = { ...d.bolts[5], sMm: d.bolts[4].sMm + 10 };
    expect(
      errors(d).some((e) => e.startsWith("bolts[5].position: bolt hole overlaps the hole of bolt")),
    ).toBe(true);
  });
  it("a ring gasket that overlaps a bolt hole", () => {
    const d = circularFlange({ gasket: { innerDiameterMm: 182.6, outerDiameterMm: 240 } });
    expect(errors(d).some((e) => e.startsWith("gasket.geometry: ring gasket overlaps the hole"))).toBe(true);
  });
  it("bolt count 0 and 10 000", () => {
    const none = circularFlange();
    none.bolts = [];
    expect(errors(none).some((e) => e.startsWith("bolts:"))).toBe(true);
    const many = circularFlange();
    many.bolts = placeBoltsEqually(758, 10_000);
    expect(errors(many).some((e) => e.startsWith("bolts:"))).toBe(true);
  });
  it("unknown thread and material are named", () => {
    const d = circularFlange();
    d.fastener.designation = "M7";
    d.fastener.threadSeries = "metric-coarse";
    expect(errors(d).some((e) => e.startsWith("fastener.designation:"))).toBe(true);
  });
  it("publishes a JSON Schema", () => {
    const s = getDesignJsonSchema();
    expect(s.type).toBe("object");
    expect(JSON.stringify(s)).toContain("schemaVersion");
  });
});
