/**
 * The pattern search on stocked bolting: a Stockroom bolting row (its values as stored) is an
 * allowed material like a catalogue one. The physics the rules apply decide the outcome: the
 * assembly stress window is a fraction of the bolt's yield (ASME PCC-1 Appendix O style window,
 * the core's `bolt.assembly-stress-max`, above yield a failure), so a fixed target bolt stress
 * that a B7 stud carries fails on a grade of lower yield; and a preload set as a fraction of proof
 * (0.9·yield without a proof stress [practice]) is smaller on a weaker grade, so seating the same
 * gasket takes at least as many bolts. The stocked row's values are invented for the test (our
 * own Stockroom data, not a published grade). Every suggestion still passes every check.
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { StockedBoltMaterial } from "@/features/analysis/core/design";
import { suggestPatterns, type PatternCandidate } from "@/features/analysis/core/suggest/search";
import { checkSuggestionRequest, type SuggestionRequest } from "@/features/analysis/core/suggest/request";
import { judge, ruleOf } from "@/features/analysis/core/suggest/verdict";
import { circularFlange, rectangularCover } from "./fixtures";

/** Invented Stockroom row: a mild-steel stud stock of low yield, no proof stress, no allowable. */
const yardStock: StockedBoltMaterial = {
  name: "Halden Creek yard stud stock",
  modulusMpa: 200_000,
  ranges: [{ maxDiameterMm: 48, proofMpa: null, yieldMpa: 250, tensileMpa: 420, allowableMpa: null }],
  source: "Kestrel Ridge stores test certificate KR-0042 (demo data)",
  edition: "2026",
};
const YARD = "org:00000000-0000-4000-8000-000000000042";

function expectPassesEveryCheck(c: PatternCandidate, allowLayoutWarnings: boolean, pipePattern: boolean) {
  const a = analyzeJoint(c.design);
  expect(a.checks.filter((x) => x.status === "fail").map((x) => x.id)).toEqual([]);
  expect(judge(a.checks, { pipePattern, allowLayoutWarnings }).blocking.map((x) => x.id)).toEqual([]);
  for (const x of a.checks)
    if (x.status === "warn" || x.status === "accepted-by-rating") expect(c.carried).toContain(ruleOf(x.id));
}

describe("a fixed target bolt stress on a weaker stocked grade", () => {
  // 50 ksi on the root area (the fixture's preload) with ±scatter: within the window of B7
  // (yield 105 ksi) but above the yield of the stocked 250 MPa grade.
  const design = circularFlange({ boltCount: 8, flangeThicknessMm: 40 });
  const sizes = [{ designation: "3/4", threadSeries: "unc" as const }];
  const base: SuggestionRequest = { design, sizes, allowLayoutWarnings: true };
  const catalogue = suggestPatterns(base);
  const stocked = suggestPatterns({
    ...base,
    stockedBolting: [{ id: YARD, material: yardStock }],
    materialIds: [YARD],
  });

  it("the size qualifies with the catalogue grade (B7): its bolt stress stays below yield", () => {
    expect(catalogue.candidates.length).toBeGreaterThan(0);
    const a = analyzeJoint(catalogue.candidates[0].design);
    const check = a.checks.find((x) => x.id === "bolt.assembly-stress-max")!;
    // Above the window's upper limit but below yield: a warning no layout changes, carried.
    expect(["pass", "warn"]).toContain(check.status);
    expect(check.value!).toBeLessThan(a.fastener.yieldMpa);
    for (const c of catalogue.candidates) expectPassesEveryCheck(c, true, true);
  });

  it("and fails the bolt-stress check with the stocked grade, which the message names", () => {
    expect(stocked.candidates).toEqual([]);
    expect(stocked.blocked.map((b) => b.rule)).toEqual(["bolt.assembly-stress-max"]);
    expect(stocked.blocked[0].materialId).toBe(YARD);
    expect(stocked.message).toMatch(/Assembly bolt stress at maximum preload/);
    // The same layout with the stocked row copied in: the stress is above its yield, a failure.
    const d = {
      ...catalogue.candidates[0].design,
      fastener: { ...catalogue.candidates[0].design.fastener, materialId: YARD, stockedMaterial: yardStock },
    };
    const check = analyzeJoint(d).checks.find((x) => x.id === "bolt.assembly-stress-max")!;
    expect(check.status).toBe("fail");
    expect(check.value!).toBeGreaterThan(yardStock.ranges[0].yieldMpa);
  });

  it("both offered: only the catalogue grade is suggested", () => {
    const both = suggestPatterns({
      ...base,
      stockedBolting: [{ id: YARD, material: yardStock }],
      materialIds: [YARD, design.fastener.materialId],
    });
    expect(both.candidates.length).toBeGreaterThan(0);
    expect(new Set(both.candidates.map((c) => c.materialId))).toEqual(new Set([design.fastener.materialId]));
  });
});

describe("a preload from the grade's strength on a weaker stocked grade", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  const sizes = ["M16", "M20", "M24"].map((designation) => ({
    designation,
    threadSeries: "metric-coarse" as const,
  }));
  const catalogue = suggestPatterns({ design, sizes });
  // Without materialIds, every stocked row offered is tried.
  const stocked = suggestPatterns({ design, sizes, stockedBolting: [{ id: YARD, material: yardStock }] });

  it("suggests patterns of the stocked row that keep its values in the design", () => {
    expect(stocked.candidates.length).toBeGreaterThan(0);
    for (const c of stocked.candidates) {
      expect(c.materialId).toBe(YARD);
      expect(c.materialName).toBe(yardStock.name);
      expect(c.design.fastener.materialId).toBe(YARD);
      expect(c.design.fastener.stockedMaterial).toEqual(yardStock);
      const a = analyzeJoint(c.design);
      expect(a.fastener.materialName).toBe(yardStock.name);
      expect(a.fastener.yieldMpa).toBe(250);
      expectPassesEveryCheck(c, false, false);
    }
  });

  it("needs at least as many bolts of each size as the stronger catalogue grade, and seats the gasket less", () => {
    let compared = 0;
    for (const c of stocked.candidates) {
      const cat = catalogue.candidates.find((x) => x.designation === c.designation);
      if (!cat) continue;
      compared++;
      expect(c.boltCount, c.designation).toBeGreaterThanOrEqual(cat.boltCount);
      // 0.5 × 0.9 × 250 MPa against 0.5 × 600 MPa (ISO 898-1 8.8 proof) of preload stress.
      if (c.boltCount === cat.boltCount) expect(c.seating.minMpa).toBeLessThan(cat.seating.minMpa);
    }
    expect(compared).toBeGreaterThan(0);
  });

  it("the catalogue search carries no Stockroom copy", () => {
    for (const c of catalogue.candidates) expect("stockedMaterial" in c.design.fastener).toBe(false);
  });
});

describe("stocked rows in the request", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  it("an unknown material id, a catalogue id reused and a bad row are named", () => {
    const issues = checkSuggestionRequest({
      design,
      stockedBolting: [
        { id: "astm-a193-b7", material: yardStock },
        { id: YARD, material: { ...yardStock, ranges: [] } },
      ],
      materialIds: ["org:nowhere"],
    });
    expect(issues.map((i) => i.path)).toEqual([
      "stockedBolting[0].id",
      "stockedBolting[1].material.ranges",
      "materialIds[0]",
    ]);
    expect(issues[2].message).toBe('unknown bolt material "org:nowhere"');
  });
});
