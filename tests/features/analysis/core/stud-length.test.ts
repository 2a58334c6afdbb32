import { describe, expect, it } from "vitest";
import { findNutHeight, heavyHexNutThicknessIn } from "@/features/analysis/core/catalogue/nut-heights";
import { findThread } from "@/features/analysis/core/catalogue/threads";
import { computeStudLength, type StudLengthInput } from "@/features/analysis/core/stud-length";
import { inToMm, mmToIn } from "@/features/analysis/core/units";

// Stud and bolt lengths worked out by hand. The nut heights are table values taken from memory
// ([mem]: ISO 4032 m max, ASME B18.2.2 heavy hex H), so they are inputs here, never the oracle; the
// oracle is the sum below, written out term by term. Thread pitches: ISO 261 coarse (M20 × 2.5,
// M24 × 3, M16 × 2) and ASME B1.1 (3/4-10 UNC: P = 0.1 in), as in the thread catalogue.
/** The M20 case below; each test changes what it is about. */
const M20: StudLengthInput = {
  form: "stud",
  termination: "nut",
  clampedMm: 63,
  washerThicknessMm: 3,
  nutHeightMm: 18,
  pitchMm: 2.5,
  nominalDiameterMm: 20,
  engagementMm: null,
  metric: true,
  tensioner: false,
};
const stud = (change: Partial<StudLengthInput>) => computeStudLength({ ...M20, ...change });

describe("stud length = layers + washers + nuts + 2 threads beyond each nut, rounded up", () => {
  it("M20 stud, nuts both ends, washers: 63 + 2·3 + 2·18 + 2·5 = 115 mm, ordered as 115 mm", () => {
    // Layers 30 mm flange + 3 mm gasket + 30 mm flange = 63 mm; washers 3 mm; ISO 4032 M20 m = 18.0 mm
    // [mem]; projection 2 × 2.5 = 5 mm per nut [practice]. 63 + 6 + 36 + 10 = 115 mm, already on the 5 mm step.
    const s = stud({});
    expect(s.requiredMm).toBeCloseTo(115, 9);
    expect(s.orderMm).toBe(115);
    expect(s.nutsPerBolt).toBe(2);
    expect(s.washersPerBolt).toBe(2);
    expect(s.projectionMm).toBe(5);
    expect(s.terms.map((t) => [t.label, t.count, t.eachMm])).toEqual([
      ["clamped layers", 1, 63],
      ["washer", 2, 3],
      ["nut", 2, 18],
      ["2 threads beyond the nut", 2, 5],
    ]);
    expect(s.rule).toContain("[practice]");
  });

  it("one millimetre more goes up to the next 5 mm step: 116 → 120 mm", () => {
    const s = stud({ clampedMm: 64 });
    expect(s.requiredMm).toBeCloseTo(116, 9);
    expect(s.orderMm).toBe(120);
  });

  it("3/4-10 UNC stud on an NPS 6 Class 150 pair: 2.130 + 2·47/64 + 2·0.2 = 3.998 in, ordered as 4 in", () => {
    // Flanges 1 in each (25.4 mm) and a 3.3 mm gasket: 54.1 mm = 2.12992 in; no washers. Heavy hex
    // H = D − 1/64 = 47/64 in [mem]; projection 2 × 0.1 in. 2.12992 + 1.46875 + 0.4 = 3.99867 in,
    // rounded up to the 1/4 in step: 4.00 in.
    const s = stud({
      clampedMm: 25.4 + 3.3 + 25.4,
      washerThicknessMm: 0,
      nutHeightMm: inToMm(47 / 64),
      pitchMm: 2.54,
      nominalDiameterMm: 19.05,
      metric: false,
    });
    expect(mmToIn(s.requiredMm)).toBeCloseTo(3.99867, 4);
    expect(mmToIn(s.orderMm)).toBeCloseTo(4, 9);
    expect(s.washersPerBolt).toBe(0);
    expect(mmToIn(s.stepMm)).toBeCloseTo(0.25, 12);
  });

  it("a hex bolt counts one nut and is measured under the head: M16, 48 + 2·3 + 14.8 + 4 = 72.8 → 75 mm", () => {
    // Layers 20 + 3 + 25 mm; washers 3 mm under head and nut; ISO 4032 M16 m = 14.8 mm [mem]; P = 2 mm.
    const s = stud({ form: "hex-bolt", clampedMm: 48, nutHeightMm: 14.8, pitchMm: 2, nominalDiameterMm: 16 });
    expect(s.requiredMm).toBeCloseTo(72.8, 9);
    expect(s.orderMm).toBe(75);
    expect(s.nutsPerBolt).toBe(1);
    expect(s.rule).toContain("under the head");
  });

  it("a tensioned stud gets 1·d of free thread on one end: M24, 106.2 + 2·21.5 + 2·6 + (24 − 6) = 179.2 → 180 mm", () => {
    // Layers 45 + 3.2 + 50 mm, washers 4 mm: 106.2 mm including washers; ISO 4032 M24 m = 21.5 mm
    // [mem]; P = 3 mm, so 6 mm beyond each nut, and the tensioner end 24 mm, i.e. 18 mm more [practice].
    const s = stud({
      clampedMm: 98.2,
      washerThicknessMm: 4,
      nutHeightMm: 21.5,
      pitchMm: 3,
      nominalDiameterMm: 24,
      tensioner: true,
    });
    expect(s.requiredMm).toBeCloseTo(179.2, 9);
    expect(s.orderMm).toBe(180);
    expect(s.terms.at(-1)).toEqual({ label: "free thread for the tensioner (1·d)", count: 1, eachMm: 18 });
  });

  it("into a tapped hole: a stud adds the engagement and one nut; a cap screw only the engagement", () => {
    const tapped = { termination: "tapped-hole" as const, clampedMm: 40, engagementMm: 25 };
    // Stud: 40 + 3 (one washer) + 25 + 18 + 5 = 91 → 95 mm.
    const s = stud(tapped);
    expect(s.requiredMm).toBeCloseTo(91, 9);
    expect(s.orderMm).toBe(95);
    expect([s.nutsPerBolt, s.washersPerBolt]).toEqual([1, 1]);
    // Cap screw: 40 + 3 + 25 = 68 → 70 mm, no nut and no projection.
    const screw = stud({ ...tapped, form: "hex-bolt" });
    expect(screw.requiredMm).toBeCloseTo(68, 9);
    expect(screw.orderMm).toBe(70);
    expect(screw.nutsPerBolt).toBe(0);
    expect(screw.terms.some((t) => t.label.includes("threads beyond"))).toBe(false);
  });
});

describe("nut heights for the stud length (all [mem]: inputs, tagged, never an oracle of a check)", () => {
  it("are tagged as remembered and name their standard", () => {
    for (const [des, series] of [
      ["M20", "iso-4032"],
      ["M20", "iso-old"],
      ["3/4", "iso-4032"],
    ] as const) {
      const t = findThread(des, des.startsWith("M") ? "metric-coarse" : "unc")!;
      const row = findNutHeight(des, t.nominalDiameterMm, series)!;
      expect(row.confidence).toBe("mem");
      expect(row.edition).toContain("from memory; verify");
    }
    expect(findNutHeight("M20", 20)!.source).toContain("ISO 4032");
    expect(findNutHeight("3/4", 19.05)!.source).toContain("ASME B18.2.2");
    expect(findNutHeight("M21", 21)).toBeUndefined();
  });

  it("apply the older series' rule m = 0.8·d to the millimetre: M20 → 16, M24 → 19 (19.2), M36 → 29 (28.8)", () => {
    expect(findNutHeight("M20", 20, "iso-old")!.heightMm).toBe(16);
    expect(findNutHeight("M24", 24, "iso-old")!.heightMm).toBe(19);
    expect(findNutHeight("M36", 36, "iso-old")!.heightMm).toBe(29);
  });

  it("apply the heavy hex thickness steps: 3/4 → 47/64, 1-1/8 → 1-7/64, 1-1/4 → 1-7/32, 2-1/2 → 2-29/64 in", () => {
    expect(heavyHexNutThicknessIn(0.75)).toBe(47 / 64);
    expect(heavyHexNutThicknessIn(1.125)).toBe(1 + 7 / 64);
    expect(heavyHexNutThicknessIn(1.25)).toBe(1 + 7 / 32);
    expect(heavyHexNutThicknessIn(2.5)).toBe(2 + 29 / 64);
    expect(mmToIn(findNutHeight("3/4", 19.05)!.heightMm)).toBeCloseTo(47 / 64, 12);
  });
});
