import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import type { JointDesign } from "@/features/analysis/core/design";
import { runStackCheck } from "@/features/fe-check/joint-stack";
import { solveStack } from "@/features/fe-check/stack-study";
import { rectangularCover } from "@/tests/features/analysis/core/fixtures";

/**
 * The Bolt stack check's reported figures held to the values main gave on 2026-12-03 (84a9a39),
 * so that a faster contact search, fewer runs or a different mesh must keep them within 1 %
 * (internal: a regression guard, not a published check; the published ones are in stack-check).
 */
const example = (name: string): JointDesign =>
  JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;
const rel = (a: number, b: number) => Math.abs(a / b - 1);

const cases: [
  string,
  () => JointDesign,
  { loadedRadiusMm: number; peakMpa: number; memberStiffnessNPerMm: number },
][] = [
  [
    "NPS 6 example",
    () => example("pipe-flange-nps6-spiral-wound"),
    { loadedRadiusMm: 30.718125, peakMpa: 38.259993, memberStiffnessNPerMm: 3_168_556.1 },
  ],
  [
    "full-face rectangular cover example",
    () => example("rectangular-cover-full-face"),
    { loadedRadiusMm: 131.27237, peakMpa: 1.8318936, memberStiffnessNPerMm: 286_064.5 },
  ],
  [
    "48-bolt rectangular cover 1200×800",
    () => rectangularCover({ boltCount: 48, widthMm: 1200, heightMm: 800 }),
    { loadedRadiusMm: 131.27237, peakMpa: 1.8318936, memberStiffnessNPerMm: 286_064.5 },
  ],
];

describe("bolt stack figures stay within 1 % of today's (internal)", () => {
  it.each(cases)(
    "%s",
    async (_, design, want) => {
      const res = await runStackCheck(buildJointModel(design()), solveStack);
      expect(rel(res.fe.loadedRadiusMm, want.loadedRadiusMm)).toBeLessThan(0.01);
      expect(rel(res.fe.peakMpa, want.peakMpa)).toBeLessThan(0.01);
      expect(rel(res.fe.memberStiffnessNPerMm, want.memberStiffnessNPerMm)).toBeLessThan(0.01);
    },
    120_000,
  );
});
