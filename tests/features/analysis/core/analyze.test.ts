import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { validateJointDesign } from "@/features/analysis/core/validate";
import type { JointDesign } from "@/features/analysis/core/design";
import { circularFlange, ELASTOMER_INSERTION, rectangularCover, SPIRAL_WOUND } from "./fixtures";

const example = (name: string) => JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;

function assertFiniteJson(value: unknown, path = "result"): void {
  if (typeof value === "number") {
    if (!Number.isFinite(value)) throw new Error(`${path} is not finite`);
    return;
  }
  if (value === null || typeof value !== "object") return;
  if (ArrayBuffer.isView(value)) throw new Error(`${path} is a typed array`);
  for (const [k, v] of Object.entries(value)) assertFiniteJson(v, `${path}.${k}`);
}

/** Mulberry32: a small seeded PRNG so the fuzz run is reproducible. */
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe("analyzeJoint on the three example designs", () => {
  for (const name of ["pipe-flange-nps6-spiral-wound", "rectangular-cover-full-face", "obround-manway"]) {
    it(`${name}: valid, JSON-serialisable, finite, deterministic`, () => {
      const d = example(name);
      expect(validateJointDesign(d)).toEqual([]);
      const r = analyzeJoint(d);
      assertFiniteJson(r);
      expect(JSON.parse(JSON.stringify(r))).toEqual(r);
      expect(analyzeJoint(d)).toEqual(r);
      expect(r.coreVersion).toBe(CORE_VERSION);
      expect(r.warnings.join(" ")).not.toMatch(/non-finite/);
      expect(r.gasketStress.profile.sMm.length).toBe(d.bolts.length * d.estimator.samplesPerPitch);
      expect(r.catalogueEditions.length).toBeGreaterThan(2);
      expect(r.assumptions.some((a) => a.includes("Cone half-angle"))).toBe(true);
    });
  }
  it("core version is 2.2.0", () => expect(CORE_VERSION).toBe("2.2.0"));
});

describe("check records", () => {
  const r = analyzeJoint(circularFlange({ boltCount: 8 }));
  it("each has the full record shape and a stable id; pair checks name both bolts in subject", () => {
    for (const c of r.checks) {
      expect(typeof c.id).toBe("string");
      expect(["pass", "warn", "fail", "not-applicable"]).toContain(c.status);
      expect(typeof c.source).toBe("string");
      expect(c).toHaveProperty("limit");
      expect(c).toHaveProperty("unit");
    }
    const pair = r.checks.find((c) => c.id === "spacing.max-pitch:b3-b4")!;
    expect(pair.subject).toEqual(["b3", "b4"]);
    for (const id of [
      "gasket.seating",
      "gasket.crush",
      "gasket.operating-m-p",
      "asme.app2.bolt-area",
      "bolt.assembly-stress-max",
      "spacing.min-pitch:b8-b1",
      "spacing.pitch-band:b1-b2",
      "spacing.cone-overlap:b1-b2",
      "edge.outline:b1",
      "edge.bore:b1",
      "pattern.bolt-count-multiple-of-4",
      "pattern.centre-line-straddle",
    ]) {
      expect(r.checks.map((c) => c.id)).toContain(id);
    }
    expect(new Set(r.checks.map((c) => c.id)).size).toBe(r.checks.length);
  });
  it("8 equally placed bolts straddle the centre lines and are a multiple of 4 (pipe-flange practice)", () => {
    expect(r.checks.find((c) => c.id === "pattern.centre-line-straddle")!.status).toBe("pass");
    expect(r.checks.find((c) => c.id === "pattern.bolt-count-multiple-of-4")!.status).toBe("pass");
    const d = circularFlange({ boltCount: 6 });
    d.bolts = d.bolts.map((b, i) => ({ ...b, sMm: (i * Math.PI * 241.3) / 6 }));
    const r6 = analyzeJoint(d);
    expect(r6.checks.find((c) => c.id === "pattern.bolt-count-multiple-of-4")!.status).toBe("warn");
    expect(r6.checks.find((c) => c.id === "pattern.centre-line-straddle")!.status).toBe("warn");
  });
  it("max pitch Bs,max = 2a + 6t/(m + 0.5) (ASME VIII-2 4.16.11 [pub])", () => {
    const c = r.checks.find((x) => x.id === "spacing.max-pitch:b1-b2")!;
    expect(c.limit!).toBeCloseTo(2 * 19.05 + (6 * 25.4) / 3.5, 6);
    expect(c.note).not.toMatch(/rating/);
  });
  it("on a standard B16.5 flange within its rating the max-pitch rule is accepted by that rating (ASME VIII-1 UG-44(a)), not a fail", () => {
    const nps6 = JSON.parse(
      readFileSync("examples/pipe-flange-nps6-spiral-wound.json", "utf8"),
    ) as JointDesign;
    const r6 = analyzeJoint(nps6);
    const c = r6.checks.find((x) => x.id.startsWith("spacing.max-pitch:"))!;
    expect(r6.checks.find((x) => x.id === "flange.rating")!.status).toBe("pass");
    expect(c.note).toMatch(/ASME B16\.5 Class 150 NPS 6, material group 1\.1: .* is within its rating/);
    expect(c.note).toMatch(/accepted by its rating \(ASME VIII-1 UG-44\(a\) \[mem\]\)/);
    // The NPS 6 pattern's pitch (about 94.8 mm) is above Bs,max (about 81.6 mm): the rule's own verdict would be a fail.
    expect(c.value!).toBeGreaterThan(c.limit!);
    expect(c.status).toBe("accepted-by-rating");
  });
  it("seating uses the minimum preload, crush the maximum (scatter of the tightening method)", () => {
    const seat = r.checks.find((c) => c.id === "gasket.seating")!;
    expect(seat.value!).toBeCloseTo(r.gasketStress.minMpa * (1 - r.preload.scatter), 6);
    const d = circularFlange();
    d.gasket.material = { ...SPIRAL_WOUND, qsMaxMpa: 50 };
    const crush = analyzeJoint(d).checks.find((c) => c.id === "gasket.crush")!;
    expect(crush.status).toBe("fail");
    expect(crush.value!).toBeGreaterThan(50);
  });
});

describe("the core never returns NaN or Infinity (seeded fuzz over random valid designs)", () => {
  it("300 random designs", () => {
    const rnd = prng(20240611);
    let analysed = 0;
    for (let k = 0; k < 300; k++) {
      const kind = Math.floor(rnd() * 3);
      let d: JointDesign;
      if (kind === 0) {
        const bc = 150 + rnd() * 1500;
        d = circularFlange({
          boltCount: 4 + Math.floor(rnd() * 40),
          boltCircleMm: bc,
          outsideDiameterMm: bc + 40 + rnd() * 40,
          boreMm: rnd() < 0.2 ? null : bc - 120 - rnd() * 20,
          gasket:
            rnd() < 0.3 ? "full-face" : { innerDiameterMm: bc - 100, outerDiameterMm: bc - 60 - rnd() * 10 },
          designation: "M16",
          threadSeries: "metric-coarse",
          holeDiameterMm: 18,
          flangeThicknessMm: 5 + rnd() * 100,
          gasketMaterial: {
            ...ELASTOMER_INSERTION,
            modulusMpa: 5 + rnd() * 200_000,
            thicknessMm: 0.1 + rnd() * 6,
          },
          estimator: (["auto", "cone", "beam"] as const)[Math.floor(rnd() * 3)],
          pressureMpa: rnd() * 5,
          coneAngle:
            rnd() < 0.5 ? { mode: "thickness-dependent" } : { mode: "fixed", degrees: 10 + rnd() * 40 },
          samplesPerPitch: 8 + Math.floor(rnd() * 60),
        });
      } else {
        d = rectangularCover({
          boltCount: 4 + Math.floor(rnd() * 60),
          widthMm: 300 + rnd() * 900,
          heightMm: 200 + rnd() * 500,
          cornerRadiusMm: rnd() * 60,
          coverThicknessMm: 3 + rnd() * 80,
          gasketMaterial: {
            ...ELASTOMER_INSERTION,
            modulusMpa: 5 + rnd() * 200_000,
            thicknessMm: 0.1 + rnd() * 6,
          },
          estimator: (["auto", "cone", "beam"] as const)[Math.floor(rnd() * 3)],
        });
        if (kind === 2)
          d.outline = {
            kind: "obround",
            lengthMm: (d.outline as { widthMm: number }).widthMm,
            widthMm: (d.outline as { heightMm: number }).heightMm,
          };
        if (kind === 2)
          d.bore = {
            kind: "obround",
            lengthMm: (d.outline as { lengthMm: number }).lengthMm - 120,
            widthMm: (d.outline as { widthMm: number }).widthMm - 120,
          };
      }
      d.bolts = d.bolts.map((b) => ({
        ...b,
        sMm: b.sMm + (rnd() - 0.5) * 4,
        offPathMm: rnd() < 0.1 ? (rnd() - 0.5) * 4 : undefined,
      }));
      if (rnd() < 0.3) d.loads = { ...d.loads, axialLoadN: rnd() * 1e5, momentNmm: rnd() * 1e8 };
      if (validateJointDesign(d).length > 0) continue;
      const r = analyzeJoint(d);
      assertFiniteJson(r);
      expect(r.warnings.join(" ")).not.toMatch(/non-finite/);
      expect(Math.min(...r.gasketStress.profile.stressMpa)).toBeGreaterThanOrEqual(0);
      analysed++;
    }
    expect(analysed).toBeGreaterThan(150);
  }, 120_000);
});
