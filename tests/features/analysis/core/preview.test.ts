import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { previewJoint } from "@/features/analysis/core/preview";
import type { JointDesign } from "@/features/analysis/core/design";
import { girthFlange96 } from "./fixtures";

const example = (name: string) => JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;

/** The 96-bolt girth flange with one bolt dragged 7 mm along the path (irregular pattern). */
function draggedGirth(): JointDesign {
  const d = girthFlange96();
  d.bolts[3] = { ...d.bolts[3], sMm: d.bolts[3].sMm + 7 };
  return d;
}

const cases: [string, () => JointDesign][] = [
  ["pipe flange NPS 6 example", () => example("pipe-flange-nps6-spiral-wound")],
  ["rectangular full-face cover example", () => example("rectangular-cover-full-face")],
  ["obround manway example", () => example("obround-manway")],
  ["96-bolt girth flange", girthFlange96],
  ["96-bolt girth flange with one bolt dragged", draggedGirth],
];

describe("previewJoint equals the corresponding parts of analyzeJoint exactly", () => {
  for (const [name, make] of cases) {
    it(name, () => {
      const design = make();
      const full = analyzeJoint(design);
      const preview = previewJoint(design);
      expect(preview.governingEstimator).toBe(full.summary.governingEstimator);
      expect(preview.summary).toStrictEqual({
        minGasketStressMpa: full.summary.minGasketStressMpa,
        maxGasketStressMpa: full.summary.maxGasketStressMpa,
        meanGasketStressMpa: full.summary.meanGasketStressMpa,
      });
      expect(preview.profile).toStrictEqual(full.gasketStress.profile);
      expect(preview.boltSOnPathMm).toStrictEqual(full.gasketStress.boltSOnPathMm);
      expect(preview.seating).toStrictEqual(full.checks.find((c) => c.id === "gasket.seating"));
      expect(preview.gasket).toStrictEqual(full.checks.filter((c) => c.id.startsWith("gasket.")));
      const spacing = full.checks.filter((c) => c.id.startsWith("spacing."));
      expect(spacing.length).toBe(4 * design.bolts.length);
      expect(preview.spacing).toStrictEqual(spacing);
    });
  }

  it("the same preview twice in a row (memoised pieces) is identical, and an invalid design is refused", () => {
    const d = draggedGirth();
    expect(previewJoint(d)).toStrictEqual(previewJoint(structuredClone(d)));
    const bad = girthFlange96();
    bad.fastener.holeDiameterMm = Number.NaN;
    expect(() => previewJoint(bad)).toThrow(/fastener\.holeDiameterMm/);
  });
});
