/**
 * The pattern search with optional keep-out edge anchors: a zone need not have a bolt at both of
 * its ends, and a span across zones may hold no bolt when it is bridged as one gap. Two zones
 * whose inner end bolts would stand closer than the smallest pitch, and a narrow zone beside a
 * fixed bolt, now yield candidates that pass every check with every zone free of holes; an
 * exhaustive scan over every edge choice and every bolt count per span finds no qualifying layout
 * with fewer bolts; a request no edge choice can meet still names the blocking rule. The rules
 * are the core's (sources beside each check); these tests pin the search [internal].
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { spacingLimits } from "@/features/analysis/core/checks/spacing";
import { getBoltPath } from "@/features/analysis/core/geometry";
import type { JointDesign } from "@/features/analysis/core/design";
import { suggestPatterns, type PatternCandidate } from "@/features/analysis/core/suggest/search";
import { judge, ruleOf } from "@/features/analysis/core/suggest/verdict";
import { countBounds, type PathInterval } from "@/features/analysis/core/suggest/layout";
import {
  fastenerFor,
  frameFor,
  keepOutsMm,
  type KeepOutZone,
  type SuggestionRequest,
} from "@/features/analysis/core/suggest/request";
import { findThread } from "@/features/analysis/core/catalogue/threads";
import { rectangularCover } from "./fixtures";

const M16 = [{ designation: "M16", threadSeries: "metric-coarse" as const }];
const wrap = (s: number, L: number) => ((s % L) + L) % L;

function expectQualifies(c: PatternCandidate, allowLayoutWarnings = false) {
  const a = analyzeJoint(c.design);
  expect(a.checks.filter((x) => x.status === "fail").map((x) => x.id)).toEqual([]);
  expect(judge(a.checks, { pipePattern: false, allowLayoutWarnings }).blocking.map((x) => x.id)).toEqual([]);
  for (const x of a.checks)
    if (x.status === "warn" || x.status === "accepted-by-rating") expect(c.carried).toContain(ruleOf(x.id));
}

/** No hole of the candidate reaches into a zone given in arc length on the design's own path. */
function expectZonesFree(
  design: JointDesign,
  c: PatternCandidate,
  zones: { fromMm: number; toMm: number }[],
) {
  const L = getBoltPath(design.outline, design.boltPath).lengthMm;
  const Lc = getBoltPath(c.design.outline, c.design.boltPath).lengthMm;
  const r = c.design.fastener.holeDiameterMm / 2;
  for (const b of c.design.bolts)
    for (const z of zones) {
      const a = (z.fromMm / L) * Lc;
      const e = (z.toMm / L) * Lc;
      const s = wrap(b.sMm, Lc);
      expect(s <= a - r + 1e-6 || s >= e + r - 1e-6, `${b.id} at s = ${s} near [${a}, ${e}]`).toBe(true);
    }
}

/** The search's pitch band for a size on the request's design (the same necessary limits as search.ts). */
function pitchBand(req: SuggestionRequest, c: PatternCandidate) {
  const lim = spacingLimits(buildJointModel(c.design));
  const d = c.nominalDiameterMm;
  const extra = req.minToolClearanceMm ?? 0;
  if (req.allowLayoutWarnings) return { max: lim.maxPitchMm, min: lim.minChordMm + extra };
  return {
    max: Math.min(lim.momentPitchMm, lim.maxPitchMm, 6 * d),
    min: Math.max(lim.minChordMm + extra, 3 * d),
  };
}

/**
 * Exhaustive over the search space, built here independently of layout.ts: every subset of the
 * widened keep-out edges as anchors (with the fixed bolts), every number of bolts in each span
 * between anchors (spaced equally, none inside a zone, the span's pitch within the size's band)
 * adding up to fewer bolts than the candidate: none of those layouts qualifies.
 */
function expectNoFewerAnyEdges(req: SuggestionRequest, c: PatternCandidate) {
  const t = findThread(c.designation, c.threadSeries)!;
  const frame = frameFor(req, c.offsetMm);
  const zones = keepOutsMm(frame, fastenerFor(req.design.fastener, t, c.materialId).holeDiameterMm);
  const L = frame.pathLengthMm;
  const band = pitchBand(req, c);
  const inside = (s: number, z: PathInterval) => {
    const u = wrap(s - z.fromMm, L);
    return u > 1e-6 && u < wrap(z.toMm - z.fromMm, L) - 1e-6;
  };
  const edges = zones.flatMap((z) => [z.fromMm, z.toMm]);
  let layouts = 0;
  for (let mask = 0; mask < 1 << edges.length; mask++) {
    const anchors = [
      ...frame.fixed.map((b) => wrap(b.sMm, L)),
      ...edges.filter((_, i) => (mask & (1 << i)) === 0),
    ].sort((a, b) => a - b);
    if (anchors.length === 0) continue;
    const spans = anchors.map((a, i) => ({
      from: a,
      len: wrap(anchors[(i + 1) % anchors.length] - a, L) || L,
    }));
    // Per span, the bolt counts whose equal spacing keeps the zones free and the pitch in the band.
    const options = spans.map((sp) => {
      const ks: number[] = [];
      for (let k = 0; sp.len / (k + 1) >= band.min - 1e-9; k++) {
        if (sp.len / (k + 1) > band.max + 1e-9) continue;
        const pts = Array.from({ length: k }, (_, j) => sp.from + ((j + 1) * sp.len) / (k + 1));
        if (pts.every((s) => !zones.some((z) => inside(s, z)))) ks.push(k);
      }
      return ks;
    });
    if (options.some((o) => o.length === 0)) continue;
    const walk = (i: number, counts: number[]) => {
      const total = anchors.length + counts.reduce((x, y) => x + y, 0);
      if (total >= c.boltCount) return;
      if (i === spans.length) {
        const s: number[] = [];
        spans.forEach((sp, j) => {
          s.push(sp.from);
          for (let q = 1; q <= counts[j]; q++) s.push(wrap(sp.from + (q * sp.len) / (counts[j] + 1), L));
        });
        const fixedAt = new Map(frame.fixed.map((b) => [wrap(b.sMm, L).toFixed(6), b]));
        const bolts = s
          .sort((a, b) => a - b)
          .map((x, j) => fixedAt.get(x.toFixed(6)) ?? { id: `x${j + 1}`, sMm: x });
        layouts++;
        const opts = { pipePattern: false, allowLayoutWarnings: req.allowLayoutWarnings };
        const ok = judge(analyzeJoint({ ...c.design, bolts }).checks, opts).ok;
        expect(ok, `${bolts.length} × ${c.designation} with edges ${mask.toString(2)} qualifies`).toBe(false);
        return;
      }
      for (const k of options[i]) walk(i + 1, [...counts, k]);
    };
    walk(0, []);
  }
  return layouts;
}

describe("two keep-outs whose inner end bolts would stand closer than the smallest pitch", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  // On the right-hand side. M16: hole 18 mm, so each 16 mm zone grows by 9 mm at each end to
  // 34 mm; the 58 mm of free path between them leaves 40 mm between the inner end bolts. Layout
  // warnings allowed, the smallest pitch is the tool's chord plus the extra clearance, here set
  // to make it 50 mm: both spans are too short with a bolt at each end of each zone, while one
  // bolt midway stands 54 mm from the outer ends.
  const zones = [
    { fromMm: 350, toMm: 366 },
    { fromMm: 424, toMm: 440 },
  ];
  const keepOuts: KeepOutZone[] = zones.map((z) => ({ kind: "arc-length", ...z }));
  const probe = {
    ...design,
    fastener: fastenerFor(design.fastener, findThread("M16", "metric-coarse")!, design.fastener.materialId),
  };
  const chord = spacingLimits(buildJointModel(probe)).minChordMm;
  const req: SuggestionRequest = {
    design,
    sizes: M16,
    keepOuts,
    allowLayoutWarnings: true,
    minToolClearanceMm: 50 - chord,
  };
  const result = suggestPatterns(req);

  it("was refused with a bolt at both ends of every zone (the 40 mm span)", () => {
    const c = result.candidates[0];
    expect(c).toBeDefined();
    const frame = frameFor(req, c.offsetMm);
    const layout = { pathLengthMm: frame.pathLengthMm, fixed: frame.fixed, keepOuts: keepOutsMm(frame, 18) };
    const band = pitchBand(req, c);
    const b = countBounds(layout, band.max, band.min);
    expect(band.min).toBeCloseTo(50, 6);
    expect(b.short!.lengthMm).toBeLessThan(50);
    expect(b.lo).toBeGreaterThan(b.hi);
  });

  it("now yields candidates that pass every check with both zones free", () => {
    expect(result.candidates.length).toBeGreaterThan(0);
    expect(result.message).toBeNull();
    for (const c of result.candidates) {
      expectQualifies(c, true);
      expectZonesFree(design, c, zones);
    }
  });

  it("exhaustive over every edge choice and count per span: none fewer qualifies", () => {
    for (const c of result.candidates) expect(expectNoFewerAnyEdges(req, c)).toBeGreaterThan(0);
  });
});

describe("a narrow keep-out (a hinge pin) beside a fixed bolt", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  const fixed = design.bolts[5];
  // The zone, grown by the 9 mm hole radius, starts 6 mm after the fixed bolt.
  const zones = [{ fromMm: fixed.sMm + 15, toMm: fixed.sMm + 20 }];
  const req: SuggestionRequest = {
    design,
    sizes: M16,
    fixedBoltIds: [fixed.id],
    keepOuts: zones.map((z) => ({ kind: "arc-length", ...z })),
  };
  const result = suggestPatterns(req);

  it("now yields candidates that pass every check, the pin free and the fixed bolt in place", () => {
    expect(result.candidates.length).toBeGreaterThan(0);
    for (const c of result.candidates) {
      expectQualifies(c);
      expectZonesFree(design, c, zones);
      expect(c.design.bolts.find((b) => b.id === fixed.id)?.sMm).toBe(fixed.sMm);
    }
  });

  it("exhaustive over every edge choice and count per span, layout warnings allowed: none fewer qualifies", () => {
    const loose = { ...req, allowLayoutWarnings: true };
    const found = suggestPatterns(loose);
    expect(found.candidates.length).toBeGreaterThan(0);
    for (const c of found.candidates) {
      expectQualifies(c, true);
      expectZonesFree(design, c, zones);
      // The wider band leaves smaller counts to scan: the scan is not empty.
      expect(expectNoFewerAnyEdges(loose, c)).toBeGreaterThan(0);
    }
  });
});

describe("a keep-out pinned between two fixed bolts closer than the smallest pitch", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  const [b0, b1] = design.bolts;
  design.bolts[1] = { ...b1, sMm: b0.sMm + 20 };
  // A 1 mm zone midway; grown by the 9 mm hole radius it ends 0.5 mm short of each bolt.
  const keepOuts: KeepOutZone[] = [{ kind: "arc-length", fromMm: b0.sMm + 9.5, toMm: b0.sMm + 10.5 }];
  const base: SuggestionRequest = { design, sizes: M16, keepOuts, fixedBoltIds: [b0.id, b1.id] };

  it("no edge choice helps: the smallest-pitch rule is named with the 20 mm span", () => {
    const strict = suggestPatterns(base);
    expect(strict.candidates).toEqual([]);
    expect(strict.blocked.map((b) => [b.rule, b.pitchMm])).toEqual([["spacing.pitch-band", 20]]);
    expect(strict.message).toMatch(/ends of a keep-out stand 20 mm apart, under the 48 mm smallest pitch/);
    const loose = suggestPatterns({ ...base, allowLayoutWarnings: true });
    expect(loose.candidates).toEqual([]);
    expect(loose.blocked.map((b) => b.rule)).toEqual(["spacing.min-pitch"]);
    expect(loose.message).toMatch(/^No size up to M16 leaves room for the tool at 20 mm pitch/);
  });
});
