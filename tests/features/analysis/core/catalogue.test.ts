import { describe, expect, it } from "vitest";
import { findThread, THREADS } from "@/features/analysis/core/catalogue/threads";
import { findNut, heavyHexAcrossFlatsIn, NUTS } from "@/features/analysis/core/catalogue/nuts";
import {
  inchBoltThreadLengthMm,
  metricBoltThreadLengthMm,
} from "@/features/analysis/core/catalogue/thread-length";
import {
  BOLT_MATERIALS,
  getBoltMaterialById,
  getStrengthForDiameter,
} from "@/features/analysis/core/catalogue/bolt-materials";
import { GASKET_TYPES, getGasketTypeById } from "@/features/analysis/core/catalogue/gaskets";
import { FLANGE_TEMPLATES, getFlangeTemplateById } from "@/features/analysis/core/catalogue/flange-templates";
import { TIGHTENING_METHODS } from "@/features/analysis/core/catalogue/tightening-methods";
import { WRENCH_CLEARANCES } from "@/features/analysis/core/catalogue/wrench-clearance";
import { mm2ToIn2, mmToIn, mpaToKsi, mpaToPsi } from "@/features/analysis/core/units";

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe("metric coarse tensile stress areas, As = π/4·(d − 0.9382P)² (ISO 898-1 table values [pub2])", () => {
  const table: [string, number][] = [
    ["M10", 58.0],
    ["M12", 84.3],
    ["M16", 157],
    ["M20", 245],
    ["M24", 353],
    ["M30", 561],
    ["M36", 817],
    ["M42", 1121],
    ["M48", 1473],
    ["M56", 2030],
    ["M64", 2676],
  ];
  for (const [des, area] of table) {
    it(`${des} coarse tensile stress area = ${area} mm² (ISO 898-1 table)`, () => {
      const t = findThread(des, "metric-coarse")!;
      expect(rel(t.tensileStressAreaMm2, area)).toBeLessThan(0.003);
    });
  }
});

describe("unified inch At and root area (ASME PCC-1 Table H-1 [pub])", () => {
  const table: [string, "unc" | "unified-8un", number, number][] = [
    ["1/2", "unc", 0.1419, 0.1257],
    ["5/8", "unc", 0.226, 0.2017],
    ["3/4", "unc", 0.3345, 0.3019],
    ["7/8", "unc", 0.4617, 0.4192],
    ["1", "unc", 0.6057, 0.5509],
    ["1-1/8", "unified-8un", 0.7905, 0.7276],
    ["1-1/4", "unified-8un", 0.9997, 0.9289],
    ["1-1/2", "unified-8un", 1.492, 1.405],
    ["2", "unified-8un", 2.771, 2.652],
    ["2-1/2", "unified-8un", 4.442, 4.291],
  ];
  for (const [des, series, at, ar] of table) {
    it(`${des} in At = ${at} in², root area = ${ar} in² (ASME PCC-1 Table H-1)`, () => {
      const t = findThread(des, series)!;
      expect(rel(mm2ToIn2(t.tensileStressAreaMm2), at)).toBeLessThan(0.002);
      expect(rel(mm2ToIn2(t.rootAreaMm2), ar)).toBeLessThan(0.002);
    });
  }
  it("UNC up to 1 in, 8UN above; 1-8 is accepted as either (ASME B1.1 series)", () => {
    expect(findThread("3/4", "unc")?.threadsPerInch).toBe(10);
    expect(findThread("1-1/4", "unified-8un")?.threadsPerInch).toBe(8);
    expect(findThread("1", "unified-8un")?.id).toBe("1-8UNC");
    expect(findThread("1-1/4", "unc")?.id).toBe("1-1/4-8UN");
    expect(findThread("M20", "unc")).toBeUndefined();
  });
});

describe("nuts and thread lengths", () => {
  it("heavy hex across flats F = 1.5D + 1/8 in (ASME B18.2.2 [pub2]): 3/4 → 1.25 in, 1 → 1.625 in", () => {
    expect(heavyHexAcrossFlatsIn(0.75)).toBeCloseTo(1.25, 10);
    expect(mmToIn(findNut("1")!.acrossFlatsMm)).toBeCloseTo(1.625, 10);
  });
  it("metric series carried separately: ISO 4032 vs old series differ at M10, M12, M22 ([mem]: plausibility only, not an oracle)", () => {
    // [mem] values: we only check that the two series are carried and differ where remembered.
    expect(findNut("M10", "iso-4032")!.acrossFlatsMm).not.toBe(findNut("M10", "iso-old")!.acrossFlatsMm);
    expect(findNut("M20", "iso-4032")!.acrossFlatsMm).toBe(findNut("M20", "iso-old")!.acrossFlatsMm);
    expect(NUTS.every((n) => n.acrossCornersMm > n.acrossFlatsMm)).toBe(true);
  });
  it("inch hex bolt thread length LT = 2D + 1/4 in (L ≤ 6 in), 2D + 1/2 in above (ASME B18.2.1 [pub2])", () => {
    expect(mmToIn(inchBoltThreadLengthMm(19.05, 4 * 25.4))).toBeCloseTo(1.75, 10);
    expect(mmToIn(inchBoltThreadLengthMm(19.05, 8 * 25.4))).toBeCloseTo(2.0, 10);
  });
  // [pub2]: ISO 888 rule as reproduced by a fastener distributor (andrewsfasteners.uk, "ISO 888 Thread
  // lengths for ISO metric fasteners"); M20 b = 46 / 52 / 65 mm also in the DIN 603 / ISO 8677 table
  // reproduced by torqbolt.com, and M20 46 / 52 in an ISO 4014 table reproduced by fabory.com.cn.
  it("metric hex bolt thread length b = 2d + 6 / 12 / 25 mm: M20 → 46 / 52 / 65 mm (ISO 888 / ISO 4014 as reproduced [pub2])", () => {
    expect(metricBoltThreadLengthMm(20, 100)).toBe(46);
    expect(metricBoltThreadLengthMm(20, 150)).toBe(52);
    expect(metricBoltThreadLengthMm(20, 250)).toBe(65);
  });
});

describe("bolt materials (ASTM A193/ISO 898-1 as reproduced [pub2]; II-D allowables)", () => {
  it("A193 B7 ≤ 2-1/2 in: 125 ksi tensile, 105 ksi yield, S = 25.0 ksi (172 MPa)", () => {
    const s = getStrengthForDiameter(getBoltMaterialById("astm-a193-b7")!, 25.4);
    expect(mpaToKsi(s.tensileMpa)).toBeCloseTo(125, 6);
    expect(mpaToKsi(s.yieldMpa)).toBeCloseTo(105, 6);
    expect(mpaToKsi(s.allowableMpa!)).toBeCloseTo(25, 6);
    expect(s.allowableMpa!).toBeCloseTo(172.4, 1);
  });
  it("A193 B7M: 100/80 ksi, S = 20.0 ksi", () => {
    const s = getStrengthForDiameter(getBoltMaterialById("astm-a193-b7m")!, 25.4);
    expect(mpaToKsi(s.tensileMpa)).toBeCloseTo(100, 6);
    expect(mpaToKsi(s.yieldMpa)).toBeCloseTo(80, 6);
    expect(mpaToKsi(s.allowableMpa!)).toBeCloseTo(20, 6);
  });
  it("B8 cl.1 and L7 allowables are tagged [mem], never pub", () => {
    expect(getStrengthForDiameter(getBoltMaterialById("astm-a193-b8-cl1")!, 20).allowableConfidence).toBe(
      "mem",
    );
    expect(getStrengthForDiameter(getBoltMaterialById("astm-a320-l7")!, 20).allowableConfidence).toBe("mem");
  });
  it("every catalogue row carries source, edition and a confidence tag", () => {
    const rows = [
      ...THREADS,
      ...NUTS,
      ...BOLT_MATERIALS,
      ...GASKET_TYPES,
      ...FLANGE_TEMPLATES,
      ...TIGHTENING_METHODS,
      ...WRENCH_CLEARANCES,
    ];
    for (const r of rows) {
      expect(r.source.length).toBeGreaterThan(0);
      expect(r.edition.length).toBeGreaterThan(0);
      expect(["pub", "pub2", "mem", "calc", "practice"]).toContain(r.confidence);
    }
  });
});

describe("gasket factors m, y (ASME VIII-1 Table 2-5.1)", () => {
  const pub: [string, number, number][] = [
    // [pub] rows, as printed in ASME VIII-2 2010 Table 4.16.1
    ["jacketed-soft-al", 3.25, 5500],
    ["jacketed-soft-cu", 3.5, 6500],
    ["jacketed-iron", 3.75, 7600],
    ["jacketed-monel", 3.5, 8000],
    ["jacketed-cr", 3.75, 9000],
    ["jacketed-ss", 3.75, 9000],
    ["grooved-soft-al", 3.25, 5500],
    ["grooved-soft-cu", 3.5, 6500],
    ["grooved-iron", 3.75, 7600],
    ["grooved-monel-cr", 3.75, 9000],
    ["grooved-ss", 4.25, 10100],
    ["solid-soft-al", 4.0, 8800],
    ["solid-soft-cu", 4.75, 13000],
    ["solid-iron", 5.5, 18000],
    ["solid-monel-cr", 6.0, 21800],
    ["solid-ss", 6.5, 26000],
    ["ring-joint-iron", 5.5, 18000],
    ["ring-joint-monel-cr", 6.0, 21800],
    ["ring-joint-ss", 6.5, 26000],
    // [pub2] rows
    ["elastomer-below-75a", 0.5, 0],
    ["elastomer-75a-and-above", 1.0, 200],
    ["spiral-wound-ss-fibre", 3.0, 10000],
    ["vegetable-fibre", 1.75, 1100],
    ["elastomer-cotton-insertion", 1.25, 400],
  ];
  for (const [id, m, y] of pub) {
    it(`${id}: m = ${m}, y = ${y} psi (ASME VIII-1 Table 2-5.1 / VIII-2 2010 Table 4.16.1)`, () => {
      const g = getGasketTypeById(id)!;
      expect(g.m).toBe(m);
      expect(mpaToPsi(g.yMpa)).toBeCloseTo(y, 6);
      expect(g.confidence).not.toBe("mem");
    });
  }
  it("rows not in the reference are tagged [mem]", () => {
    expect(getGasketTypeById("compressed-fibre-1-16")!.confidence).toBe("mem");
  });
});

describe("flange templates (ASME B16.5 Class 150 [pub2])", () => {
  const rows: [string, number, number, number, string][] = [
    ["2", 6.0, 4.75, 4, "5/8"],
    ["4", 9.0, 7.5, 8, "5/8"],
    ["6", 11.0, 9.5, 8, "3/4"],
    ["8", 13.5, 11.75, 8, "3/4"],
    ["10", 16.0, 14.25, 12, "7/8"],
    ["12", 19.0, 17.0, 12, "7/8"],
    ["16", 23.5, 21.25, 16, "1"],
    ["24", 32.0, 29.5, 20, "1-1/4"],
  ];
  for (const [nps, od, bc, n, bolt] of rows) {
    it(`NPS ${nps}: OD ${od} in, bolt circle ${bc} in, ${n} × ${bolt} in (ASME B16.5 Class 150)`, () => {
      const t = getFlangeTemplateById(`asme-b16.5-cl150-nps${nps}`)!;
      expect(mmToIn(t.outsideDiameterMm)).toBeCloseTo(od, 10);
      expect(mmToIn(t.boltCircleDiameterMm)).toBeCloseTo(bc, 10);
      expect(t.boltCount).toBe(n);
      expect(t.boltDesignation).toBe(bolt);
      expect(t.confidence).toBe("pub2");
    });
  }
  it("Class 150 pitch spans about 3.7–7.5 bolt diameters ([calc] from B16.5 dimensions)", () => {
    for (const t of FLANGE_TEMPLATES.filter((x) => x.pressureClass === 150)) {
      const ratio = (Math.PI * t.boltCircleDiameterMm) / t.boltCount / t.boltDiameterMm;
      expect(ratio).toBeGreaterThan(3.69);
      expect(ratio).toBeLessThan(7.5);
    }
  });
});

describe("tightening-method scatter (Machinery's Handbook / NASA tables [pub2]; midpoints used)", () => {
  it("torque wrench ±30 %, turn-of-nut ±15 %, tensioner ±15 %, LIW ±10 %, elongation ±4 %, ultrasonic ±5.5 %", () => {
    const s = Object.fromEntries(TIGHTENING_METHODS.map((m) => [m.id, m.scatter]));
    expect(s["torque-wrench"]).toBeCloseTo(0.3, 10);
    expect(s["turn-of-nut"]).toBeCloseTo(0.15, 10);
    expect(s["hydraulic-tensioner"]).toBeCloseTo(0.15, 10);
    expect(s["load-indicating-washer"]).toBeCloseTo(0.1, 10);
    expect(s["bolt-elongation"]).toBeCloseTo(0.04, 10);
    expect(s["ultrasonic"]).toBeCloseTo(0.055, 10);
  });
  it("TEMA D-5 1/2 in row: spacing 1-1/4, hub 13/16, edge 5/8 in ([pub2]); other rows tagged [mem]", () => {
    const r = WRENCH_CLEARANCES.find((w) => w.designation === "1/2")!;
    expect(mmToIn(r.minSpacingMm)).toBeCloseTo(1.25, 10);
    expect(mmToIn(r.boltToHubMm)).toBeCloseTo(13 / 16, 10);
    expect(mmToIn(r.boltToEdgeMm)).toBeCloseTo(5 / 8, 10);
    expect(
      WRENCH_CLEARANCES.filter((w) => w.designation !== "1/2").every((w) => w.confidence === "mem"),
    ).toBe(true);
  });
});
