/**
 * The pattern search ("Suggest pattern"): every suggestion passes every check when analysed
 * again; on small cases an exhaustive scan of the same search space finds no qualifying layout
 * with fewer bolts of the same size; keep-outs stay empty and fixed bolts stay put; an impossible
 * request names the rule that blocks it. The rules themselves are the core's (their sources are
 * beside each check); these tests pin the search, not the rules.
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { getBoltPoints, getBoltPath } from "@/features/analysis/core/geometry";
import { suggestPatterns, type PatternCandidate } from "@/features/analysis/core/suggest/search";
import { judge, ruleOf, type JudgeOptions } from "@/features/analysis/core/suggest/verdict";
import { layoutBolts } from "@/features/analysis/core/suggest/layout";
import {
  checkSuggestionRequest,
  fastenerFor,
  frameFor,
  keepOutsMm,
  type SuggestionRequest,
} from "@/features/analysis/core/suggest/request";
import { findThread } from "@/features/analysis/core/catalogue/threads";
import { circularFlange, rectangularCover } from "./fixtures";

const M = (...names: string[]) =>
  names.map((designation) => ({ designation, threadSeries: "metric-coarse" as const }));

function expectPassesEveryCheck(c: PatternCandidate, opts: JudgeOptions) {
  const a = analyzeJoint(c.design);
  expect(a.checks.filter((x) => x.status === "fail").map((x) => x.id)).toEqual([]);
  const v = judge(a.checks, opts);
  expect(v.blocking.map((x) => `${x.id} ${x.status}`)).toEqual([]);
  // What is not a pass is one of the carried rules, which no layout changes.
  for (const x of a.checks)
    if (x.status === "warn" || x.status === "accepted-by-rating") expect(c.carried).toContain(ruleOf(x.id));
  expect(a.bolts.length).toBe(c.boltCount);
  expect(a.fastener.threadId).toBe(findThread(c.designation, c.threadSeries)!.id);
}

/** Every count below the candidate's, same size, material and offset, laid out the same way: none qualifies. */
function expectNoFewer(req: SuggestionRequest, c: PatternCandidate, opts: JudgeOptions, from = 2) {
  const t = findThread(c.designation, c.threadSeries)!;
  const frame = frameFor(req, c.offsetMm);
  const hole = fastenerFor(req.design.fastener, t, c.materialId).holeDiameterMm;
  const layout = { pathLengthMm: frame.pathLengthMm, fixed: frame.fixed, keepOuts: keepOutsMm(frame, hole) };
  for (let n = from; n < c.boltCount; n++) {
    const bolts = layoutBolts(layout, n);
    if (!bolts) continue;
    const d = { ...c.design, bolts };
    expect(judge(analyzeJoint(d).checks, opts).ok, `${n} × ${c.designation} qualifies`).toBe(false);
  }
}

describe("suggestPatterns on a full-face rectangular cover", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  const req: SuggestionRequest = { design, sizes: M("M12", "M16", "M24") };
  const result = suggestPatterns(req);

  it("finds candidates, ranked by bolt count, then size", () => {
    expect(result.candidates.length).toBeGreaterThan(0);
    const counts = result.candidates.map((c) => c.boltCount);
    expect([...counts].sort((a, b) => a - b)).toEqual(counts);
    expect(result.candidates.map((c) => c.rank)).toEqual(result.candidates.map((_, i) => i + 1));
    expect(result.message).toBeNull();
    expect(result.policy).toMatch(/warning on a rule the layout decides/);
  });

  it("every suggestion passes every check when analysed again", () => {
    for (const c of result.candidates) expectPassesEveryCheck(c, { pipePattern: false });
  });

  it("each candidate carries its governing rule and margins, the seating margin among them", () => {
    for (const c of result.candidates) {
      expect(c.governing).not.toBeNull();
      expect(c.governing!.margin).toBeGreaterThanOrEqual(0);
      // The bolt length is sized by the search, so it is left out of the governing rule.
      for (const m of c.margins)
        if (m.margin !== null && m.status === "pass" && m.rule !== "bolt.length")
          expect(c.governing!.margin!).toBeLessThanOrEqual(m.margin);
      const seat = c.margins.find((m) => m.rule === "gasket.seating")!;
      expect(seat.margin).toBeCloseTo(c.seating.margin, 12);
      expect(c.seating.minMpa).toBeGreaterThanOrEqual(c.seating.limitMpa);
      expect(c.feCheck).toBeNull();
    }
  });

  it("exhaustive: no qualifying layout with fewer bolts of a suggested size", () => {
    for (const c of result.candidates)
      expectNoFewer(req, c, { pipePattern: false, allowLayoutWarnings: req.allowLayoutWarnings });
  });

  it("exhaustive: a size the search rules out has no qualifying count at all up to the tool's limit", () => {
    const ruledOut = result.blocked.filter(
      (b) => !result.candidates.some((c) => c.designation === b.designation),
    );
    expect(ruledOut.length).toBeGreaterThan(0);
    for (const b of ruledOut) {
      const t = findThread(b.designation, "metric-coarse")!;
      const fastener = { ...fastenerFor(design.fastener, t, design.fastener.materialId), lengthMm: 120 };
      const L = getBoltPath(design.outline, design.boltPath).lengthMm;
      for (let n = 4; n <= Math.floor(L / (3 * t.nominalDiameterMm)) + 2; n++) {
        const d = {
          ...design,
          fastener,
          bolts: layoutBolts({ pathLengthMm: L, fixed: [], keepOuts: [] }, n)!,
        };
        expect(judge(analyzeJoint(d).checks, { pipePattern: false }).ok, `${n} × ${b.designation}`).toBe(
          false,
        );
      }
    }
  });
});

describe("suggestPatterns on a circular pipe flange", () => {
  const design = circularFlange({ boltCount: 8, flangeThicknessMm: 40 });
  const req: SuggestionRequest = {
    design,
    sizes: ["5/8", "3/4", "7/8"].map((designation) => ({ designation, threadSeries: "unc" as const })),
    allowLayoutWarnings: true,
  };
  const result = suggestPatterns(req);

  it("suggests counts that are multiples of 4 with the holes straddling the centre lines", () => {
    expect(result.candidates.length).toBeGreaterThan(0);
    for (const c of result.candidates) {
      expect(c.boltCount % 4).toBe(0);
      const a = analyzeJoint(c.design);
      expect(a.checks.find((x) => x.id === "pattern.centre-line-straddle")!.status).toBe("pass");
      expectPassesEveryCheck(c, { pipePattern: true, allowLayoutWarnings: true });
    }
  });

  it("exhaustive over multiples of 4: none fewer of the same size qualifies", () => {
    for (const c of result.candidates) {
      const t = findThread(c.designation, c.threadSeries)!;
      for (let n = 4; n < c.boltCount; n += 4) {
        const bolts = layoutBolts({ pathLengthMm: Math.PI * 241.3, fixed: [], keepOuts: [] }, n)!;
        expect(
          judge(analyzeJoint({ ...c.design, bolts }).checks, { pipePattern: true, allowLayoutWarnings: true })
            .ok,
          `${n} × ${t.designation}`,
        ).toBe(false);
      }
    }
  });
});

describe("constraints", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  const L = getBoltPath(design.outline, design.boltPath).lengthMm;
  const fixedId = design.bolts[5].id;
  const req: SuggestionRequest = {
    design,
    sizes: M("M12", "M16"),
    keepOuts: [
      { kind: "arc-length", fromMm: 40, toMm: 60, label: "nozzle N1" },
      { kind: "parameter", from: 0.97, to: 0.99, label: "hinge" },
    ],
    fixedBoltIds: [fixedId],
    offsetRangeMm: { fromMm: 22, toMm: 28, stepMm: 3 },
    allowLayoutWarnings: true,
  };
  const result = suggestPatterns(req);

  it("keep-out zones hold no bolt hole and fixed bolts keep their place", () => {
    expect(result.candidates.length).toBeGreaterThan(0);
    const fixedPoint = getBoltPoints(design)[5];
    for (const c of result.candidates) {
      const path = getBoltPath(c.design.outline, c.design.boltPath);
      const r = c.design.fastener.holeDiameterMm / 2;
      const Lc = path.lengthMm;
      const zones = [
        [(40 / L) * Lc, (60 / L) * Lc],
        [0.97 * Lc, 0.99 * Lc],
      ];
      for (const b of c.design.bolts)
        for (const [a, z] of zones) {
          const s = ((b.sMm % Lc) + Lc) % Lc;
          expect(s < a - r + 1e-6 || s > z + r - 1e-6, `${b.id} at s = ${s} in [${a}, ${z}]`).toBe(true);
        }
      const i = c.design.bolts.findIndex((b) => b.id === fixedId);
      expect(i).toBeGreaterThanOrEqual(0);
      const p = getBoltPoints(c.design)[i];
      expect(p.x).toBeCloseTo(fixedPoint.x, 6);
      expect(p.y).toBeCloseTo(fixedPoint.y, 6);
      expectPassesEveryCheck(c, { pipePattern: false, allowLayoutWarnings: true });
    }
  });

  it("exhaustive with the constraints: none fewer of the same size, material and offset qualifies", () => {
    for (const c of result.candidates)
      expectNoFewer(req, c, { pipePattern: false, allowLayoutWarnings: req.allowLayoutWarnings });
  });

  it("an extra tool clearance widens the smallest pitch", () => {
    const loose = suggestPatterns({ design, sizes: M("M12") });
    const tight = suggestPatterns({ design, sizes: M("M12"), minToolClearanceMm: 12 });
    if (loose.candidates.length > 0 && tight.candidates.length > 0)
      expect(tight.candidates[0].pitchMm.min).toBeGreaterThanOrEqual(loose.candidates[0].pitchMm.min);
    const ruled = tight.candidates.length === 0 ? tight.blocked : [];
    for (const b of ruled) expect(b.reason).toMatch(/pitch|spacing/);
  });
});

describe("an impossible request", () => {
  it("says which rule blocks it", () => {
    const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
    design.gasket.material = { ...design.gasket.material, qMinMpa: 150 };
    const result = suggestPatterns({ design, sizes: M("M20", "M24", "M30", "M36") });
    expect(result.candidates).toEqual([]);
    expect(result.message).toMatch(/^No size up to M36 seats the gasket at \d+(\.\d)? mm pitch/);
    expect(result.blocked.every((b) => b.rule === "gasket.seating")).toBe(true);
  });

  it("in US customary units says the same in inches, the numbers unchanged", () => {
    const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
    design.gasket.material = { ...design.gasket.material, qMinMpa: 150 };
    const req = { design, sizes: M("M20", "M24", "M30", "M36") };
    const si = suggestPatterns(req);
    const us = suggestPatterns({ ...req, units: "US" });
    expect(us.blocked.map((b) => b.pitchMm)).toEqual(si.blocked.map((b) => b.pitchMm));
    const pitch = si.blocked[si.blocked.length - 1].pitchMm!;
    // 25.4 mm = 1 in exactly (the core's units.ts).
    const inches = Math.round((pitch / 25.4) * 100) / 100;
    expect(us.message).toContain(`No size up to M36 seats the gasket at ${inches} in pitch`);
    expect(us.message).not.toMatch(/\d mm/);
    expect(us.message).toMatch(/pitch ≥ \d+(\.\d+)? in, spacing\.pitch-band/);
  });

  it("a keep-out longer than any allowed pitch is named", () => {
    const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
    const result = suggestPatterns({
      design,
      sizes: M("M12"),
      keepOuts: [{ kind: "arc-length", fromMm: 100, toMm: 400 }],
    });
    expect(result.candidates).toEqual([]);
    expect(result.message).toMatch(/keep-out leaves a \d+(\.\d)? mm gap/);
  });

  it("a keep-out shorter than the smallest pitch is bridged without a bolt at one of its ends", () => {
    // 10 mm keep-out + an 18 mm M16 hole: bolts at both its ends would stand 28 mm apart, under
    // 3·d = 48 mm, so the search drops one of them (the refusal that names the smallest-pitch rule
    // when no edge choice helps is in suggest-keepouts.test.ts).
    const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
    const keepOuts = [{ kind: "arc-length" as const, fromMm: 100, toMm: 110 }];
    for (const allowLayoutWarnings of [false, true]) {
      const result = suggestPatterns({ design, sizes: M("M16"), keepOuts, allowLayoutWarnings });
      expect(result.candidates.length).toBeGreaterThan(0);
      for (const c of result.candidates) {
        expectPassesEveryCheck(c, { pipePattern: false, allowLayoutWarnings });
        const r = c.design.fastener.holeDiameterMm / 2;
        for (const b of c.design.bolts) expect(b.sMm <= 100 - r + 1e-6 || b.sMm >= 110 + r - 1e-6).toBe(true);
        expect(
          c.design.bolts.filter(
            (b) => Math.abs(b.sMm - (100 - r)) < 1e-6 || Math.abs(b.sMm - (110 + r)) < 1e-6,
          ).length,
        ).toBeLessThan(2);
      }
    }
  });

  it("is refused with every problem named when it cannot run", () => {
    const design = rectangularCover();
    const issues = checkSuggestionRequest({
      design,
      sizes: [{ designation: "M17", threadSeries: "metric-coarse" }],
      materialIds: ["unobtainium"],
      keepOuts: [{ kind: "parameter", from: 0.1, to: 1.4 }],
      fixedBoltIds: ["b99"],
      offsetRangeMm: { fromMm: 10, toMm: 5, stepMm: 1 },
      maxAnalyses: 0,
    });
    expect(issues.map((i) => i.path).sort()).toEqual(
      [
        "fixedBoltIds[0]",
        "keepOuts[0].to",
        "materialIds[0]",
        "maxAnalyses",
        "offsetRangeMm.toMm",
        "sizes[0]",
      ].sort(),
    );
    expect(() => suggestPatterns({ design, fixedBoltIds: ["b99"] })).toThrow(/b99/);
  });
});

describe("layout warnings", () => {
  it("allowing them never needs more bolts, and carries the warnings it accepts", () => {
    const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
    const strict = suggestPatterns({ design, sizes: M("M16") });
    const loose = suggestPatterns({ design, sizes: M("M16"), allowLayoutWarnings: true });
    expect(loose.candidates.length).toBe(1);
    if (strict.candidates.length > 0)
      expect(loose.candidates[0].boltCount).toBeLessThanOrEqual(strict.candidates[0].boltCount);
    const a = analyzeJoint(loose.candidates[0].design);
    expect(a.checks.some((x) => x.status === "fail")).toBe(false);
    for (const x of a.checks)
      if (x.status === "warn") expect(loose.candidates[0].carried).toContain(ruleOf(x.id));
  });
});

describe("search bookkeeping", () => {
  it("stops when asked and says so; the work cap truncates", () => {
    const design = rectangularCover();
    let calls = 0;
    const stopped = suggestPatterns({ design, sizes: M("M12", "M16") }, { shouldStop: () => ++calls > 1 });
    expect(stopped.cancelled).toBe(true);
    const capped = suggestPatterns({ design, sizes: M("M10", "M12", "M16"), maxAnalyses: 1 });
    expect(capped.truncated).toBe(true);
    expect(capped.analyses).toBe(1);
  });

  it("reports progress per combination", () => {
    const seen: number[] = [];
    suggestPatterns(
      { design: rectangularCover(), sizes: M("M12", "M16") },
      { onProgress: (p) => seen.push(p.done) },
    );
    expect(seen).toEqual([1, 2]);
  });
});

describe("layoutBolts", () => {
  it("places bolts straddling the top centre line without anchors", () => {
    expect(layoutBolts({ pathLengthMm: 400, fixed: [], keepOuts: [] }, 4)!.map((b) => b.sMm)).toEqual([
      50, 150, 250, 350,
    ]);
  });

  it("keeps fixed bolts and their ids, bridges a keep-out with one gap and spaces the rest equally", () => {
    const bolts = layoutBolts(
      { pathLengthMm: 1000, fixed: [{ id: "b2", sMm: 500 }], keepOuts: [{ fromMm: 100, toMm: 200 }] },
      8,
    )!;
    expect(bolts.find((b) => b.id === "b2")!.sMm).toBe(500);
    expect(bolts.map((b) => b.id).filter((id) => id === "b2")).toHaveLength(1);
    const s = bolts.map((b) => b.sMm);
    expect(s).toContain(100);
    expect(s).toContain(200);
    expect(s.some((x) => x > 100 && x < 200)).toBe(false);
    // Spans 200→500 (300 mm) and 500→1100 (600 mm) share five extra bolts, each to the widest
    // pitch at the time: two and three, so pitches 100 and 150 (the widest possible is 150 either way).
    const gaps = s.map((x, i) => ((s[(i + 1) % s.length] - x + 1000) % 1000).toFixed(3));
    expect(gaps.sort()).toEqual(
      ["100.000", "100.000", "100.000", "100.000", "150.000", "150.000", "150.000", "150.000"].sort(),
    );
  });
});
