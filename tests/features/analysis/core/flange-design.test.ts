/**
 * Appendix 2 flange design and UG-34 covers. Oracles, each named beside its values:
 * [GW] G. Woods, "ASME Section VIII Division 1 Appendix 2 Weld Neck Flange Analysis" (public worked
 *      spreadsheet calculation, studylib.net doc 26029669): NPS 12 Class 150 weld neck flange, US customary.
 * [SJ] "How to calculate blind flange thickness", steeljrv.com (public worked UG-34 calculation, 32 in blind).
 * No published metric-branch Appendix 2 example was found: the metric tests convert [GW] exactly (the
 * stress equations are homogeneous) and check the metric gasket-width rule on its own.
 */
import { describe, expect, it } from "vitest";
import {
  integralHubFactors,
  NO_TAPER_HUB,
  ringFactors,
} from "@/features/analysis/core/flange-design/shape-factors";
import {
  computeAppendix2Flange,
  flangeStresses,
  momentArms,
  stressLimits,
  type Appendix2FlangeInput,
} from "@/features/analysis/core/flange-design/appendix2-flange";
import { coverThicknessMm, nonCircularZ } from "@/features/analysis/core/flange-design/flat-cover";
import { asmeGasketGeometry } from "@/features/analysis/core/asme-gasket-width";
import { inToMm, lbfToN, psiToMpa, mpaToPsi } from "@/features/analysis/core/units";

const IN = inToMm;
const lbin = (v: number) => lbfToN(v) * 25.4; // lb·in → N·mm

// [GW] inputs: A 19.000, B 12.250, C 17.000, t 1.190, h 3.000, g0 0.250, g1 1.065 in; gasket 14.75 / 13.38 in,
// m 3, y 10000 psi; P 104 psi + equivalent 90 psi (printed rounded) = 194 psi; Sa = Sb = 25000 psi; 12 × 7/8 in.
const GW = { A: 19, B: 12.25, C: 17, t: 1.19, h: 3, g0: 0.25, g1: 1.065 };

describe("Appendix 2 shape factors from their equations ([GW] values)", () => {
  it("K = A/B = 1.55102 → T 1.68859, U 5.05244, Y 4.59773, Z 2.42281 [GW]", () => {
    const r = ringFactors(GW.A / GW.B);
    expect(r.K).toBeCloseTo(1.55102, 5);
    expect(r.T).toBeCloseTo(1.68859, 4);
    expect(r.U).toBeCloseTo(5.05244, 4);
    expect(r.Y).toBeCloseTo(4.59773, 4);
    expect(r.Z).toBeCloseTo(2.42281, 4);
  });
  it("g1/g0 = 4.26, h/h0 = 1.71429 → F 0.55138, V 0.02868, f 1.00 (0.12 before the f ≥ 1 rule) [GW, Table 2-7.1 equations]", () => {
    const h0 = Math.sqrt(GW.B * GW.g0);
    expect(h0).toBeCloseTo(1.75, 10);
    const hub = integralHubFactors(GW.g1 / GW.g0, GW.h / h0);
    expect(hub.F).toBeCloseTo(0.55138, 5);
    expect(hub.V).toBeCloseTo(0.02868, 5);
    expect(hub.fRaw).toBeCloseTo(0.12, 2);
    expect(hub.f).toBe(1);
  });
  it("e = F/h0 ≈ 0.32, d = U·h0·g0²/V = 19.27, L = 0.90 [GW]", () => {
    const r = computeAppendix2Flange(gwInput(1));
    expect(r.hub!.e).toBeCloseTo(0.315, 3);
    expect(r.hub!.d).toBeCloseTo(19.27, 1);
    expect(r.hub!.L).toBeCloseTo(0.9, 2);
  });
  it("as the taper vanishes the equations tend to the figures' no-taper values F 0.908920, V 0.550103 [mem]", () => {
    const near = integralHubFactors(1.000001, 1);
    expect(near.F).toBeCloseTo(NO_TAPER_HUB.F, 2);
    expect(near.V).toBeCloseTo(NO_TAPER_HUB.V, 2);
  });
});

function gwInput(unitScale: 1 | 25.4): Appendix2FlangeInput {
  // unitScale 25.4: the same flange in mm/N/MPa (metric equations are the same equations).
  const L = (v: number) => (unitScale === 1 ? v : IN(v));
  const F = (v: number) => (unitScale === 1 ? v : lbfToN(v));
  const S = (v: number) => (unitScale === 1 ? v : psiToMpa(v));
  const G = 14.75 - 2 * 0.5 * Math.sqrt(0.3425); // inch branch: b0 = 0.685/2, b = 0.5·√b0
  const P = 194;
  const H = (Math.PI / 4) * G * G * P;
  const Hp = 2 * (0.5 * Math.sqrt(0.3425)) * Math.PI * G * 3 * P;
  return {
    kind: "integral-hub",
    aMm: L(GW.A),
    bMm: L(GW.B),
    cMm: L(GW.C),
    tMm: L(GW.t),
    g0Mm: L(GW.g0),
    g1Mm: L(GW.g1),
    hMm: L(GW.h),
    gMm: L(G),
    pressureMpa: S(P),
    hN: F(H),
    hpN: F(Hp),
    wm1N: F(H + Hp),
    seatingBoltLoadN: F(128109),
    sfDesignMpa: S(22600),
    sfAmbientMpa: S(22600),
    eDesignMpa: S(29.4e6),
    eAmbientMpa: S(29.4e6),
  };
}

describe("Appendix 2 moments and stresses, inch branch ([GW])", () => {
  const r = computeAppendix2Flange(gwInput(1));
  it("R = (C − B)/2 − g1 = 1.31 in; hG = (C − G)/2 [GW]", () => {
    expect(r.rMm).toBeCloseTo(1.31, 3);
    expect(r.armGMm).toBeCloseTo((17 - 14.165) / 2, 2);
  });
  it("operating moments MD 42034, MT 14575, MG 21485, Mo 78093 lb·in; seating Mo 181678 lb·in [GW; its P is printed rounded, so within 0.6 %]", () => {
    expect(r.hdN * r.armDMm).toBeGreaterThan(42034 * 0.994);
    expect(r.hdN * r.armDMm).toBeLessThan(42034 * 1.006);
    expect((r.htN * r.armTMm) / 14575).toBeCloseTo(1, 1);
    expect((r.hgOperatingN * r.armGMm) / 21485).toBeCloseTo(1, 2);
    expect(r.conditions[0].momentNmm! / 78093).toBeCloseTo(1, 2);
    expect(r.conditions[1].momentNmm! / 181678).toBeCloseTo(1, 2);
  });
  it("from the published moments: operating SH 6233, SR 7482, ST 2570 psi; seating SH 14501, SR 17407, ST 5979 psi [GW]", () => {
    const ring = r.ring;
    const hub = r.hub!;
    const op = flangeStresses("integral-hub", 78093, GW.t, GW.B, GW.g1, ring, hub);
    expect(op.sh).toBeCloseTo(6233, -1);
    expect(op.sr).toBeCloseTo(7482, -1);
    expect(op.st).toBeCloseTo(2570, -1);
    const seat = flangeStresses("integral-hub", 181678, GW.t, GW.B, GW.g1, ring, hub);
    expect(seat.sh).toBeCloseTo(14501, -1);
    expect(seat.sr).toBeCloseTo(17407, -1);
    expect(seat.st).toBeCloseTo(5979, -1);
  });
  it("allowable combinations of 2-8: SH ≤ 1.5 Sf, SR, ST, (SH+SR)/2, (SH+ST)/2 ≤ Sf; loose rings only ST", () => {
    const lim = stressLimits("integral-hub", r.conditions[1]);
    expect(lim.map((l) => l.key)).toEqual(["sh", "sr", "st", "sh-sr", "sh-st"]);
    expect(lim[0].limit).toBeCloseTo(1.5 * 22600, 6);
    expect(lim[3].value).toBeCloseTo((r.conditions[1].shMpa! + r.conditions[1].srMpa!) / 2, 9);
    expect(stressLimits("ring-loose", { ...r.conditions[1] }).map((l) => l.key)).toEqual(["st"]);
  });
});

describe("Appendix 2 flange, metric branch (same flange in mm, N, MPa)", () => {
  const us = computeAppendix2Flange(gwInput(1));
  const si = computeAppendix2Flange(gwInput(25.4));
  it("stresses in MPa equal the [GW]-checked psi values converted (the equations are homogeneous)", () => {
    for (let k = 0; k < 2; k++) {
      expect(mpaToPsi(si.conditions[k].shMpa!)).toBeCloseTo(us.conditions[k].shMpa!, 6);
      expect(mpaToPsi(si.conditions[k].srMpa!)).toBeCloseTo(us.conditions[k].srMpa!, 6);
      expect(mpaToPsi(si.conditions[k].stMpa!)).toBeCloseTo(us.conditions[k].stMpa!, 6);
      expect(si.conditions[k].rigidity!).toBeCloseTo(us.conditions[k].rigidity!, 9);
    }
    expect(si.conditions[0].momentNmm!).toBeCloseTo(lbin(us.conditions[0].momentNmm!), 3);
  });
  it("the metric branch takes b = 2.5·√b0 (mm), not the converted inch rule: G differs for the [GW] gasket", () => {
    const m = asmeGasketGeometry(IN(14.75), IN(13.38), "metric");
    const i = asmeGasketGeometry(IN(14.75), IN(13.38), "inch");
    expect(m.bMm).toBeCloseTo(2.5 * Math.sqrt(IN(0.3425)), 9);
    expect(i.g).toBeCloseTo(14.165, 3); // [GW] G 14.16
    expect(Math.abs(m.gMm - i.gMm)).toBeGreaterThan(0.05);
  });
});

describe("Appendix 2 rigidity index J (2-14)", () => {
  it("integral: J = 52.14·V·Mo/(L·E·g0²·KI·h0) with KI = 0.3; loose ring: J = 109.4·Mo/(E·t³·KL·ln K) with KL = 0.2", () => {
    const r = computeAppendix2Flange(gwInput(1));
    const c = r.conditions[0];
    expect(r.rigidityFactor).toEqual({ name: "KI", value: 0.3 });
    expect(c.rigidity!).toBeCloseTo(
      (52.14 * r.hub!.V * c.momentNmm!) / (r.hub!.L * 29.4e6 * GW.g0 ** 2 * 0.3 * r.hub!.h0Mm),
      12,
    );
    const loose = computeAppendix2Flange({ ...gwInput(1), kind: "ring-loose" });
    const lc = loose.conditions[0];
    expect(loose.rigidityFactor).toEqual({ name: "KL", value: 0.2 });
    expect(lc.rigidity!).toBeCloseTo(
      (109.4 * lc.momentNmm!) / (29.4e6 * GW.t ** 3 * 0.2 * Math.log(GW.A / GW.B)),
      12,
    );
    expect(lc.shMpa).toBe(0);
    expect(lc.stMpa!).toBeCloseTo((ringFactors(GW.A / GW.B).Y * lc.momentNmm!) / (GW.t ** 2 * GW.B), 9);
  });
  it("a stiffer flange (higher E) has a lower J", () => {
    const soft = computeAppendix2Flange(gwInput(1)).conditions[0].rigidity!;
    const stiff = computeAppendix2Flange({ ...gwInput(1), eDesignMpa: 2 * 29.4e6 }).conditions[0].rigidity!;
    expect(stiff).toBeCloseTo(soft / 2, 12);
  });
});

describe("Appendix 2 properties", () => {
  it("thicker flange → lower stresses (every kind, both conditions)", () => {
    for (const kind of ["integral-hub", "integral-no-hub", "ring-loose"] as const) {
      let prev = Infinity;
      for (const t of [0.8, 1.0, 1.19, 1.5, 2.0, 3.0]) {
        const r = computeAppendix2Flange({ ...gwInput(1), kind, tMm: t });
        const worst = Math.max(...r.conditions.map((c) => Math.max(c.shMpa!, c.srMpa!, c.stMpa!)));
        expect(worst).toBeLessThan(prev);
        prev = worst;
      }
    }
  });
  it("larger gasket moment arm hG (bolt circle moved out) → higher moment", () => {
    let prev = -Infinity;
    for (const C of [16.5, 17, 17.5, 18]) {
      const r = computeAppendix2Flange({ ...gwInput(1), cMm: C });
      expect(r.armGMm).toBeGreaterThan(0);
      expect(r.conditions[1].momentNmm!).toBeGreaterThan(prev);
      prev = r.conditions[1].momentNmm!;
    }
  });
  it("moment arms of Table 2-6: integral hD = R + g1/2, hT = (R + g1 + hG)/2; loose hD = (C − B)/2, hT = (hD + hG)/2", () => {
    const i = momentArms("integral-hub", 12.25, 17, 14.165, 1.065);
    expect(i.hD).toBeCloseTo(1.31 + 0.5325, 9);
    expect(i.hT).toBeCloseTo((1.31 + 1.065 + i.hG) / 2, 9);
    const l = momentArms("ring-loose", 12.25, 17, 14.165, 0);
    expect(l.hD).toBeCloseTo(2.375, 9);
    expect(l.hT).toBeCloseTo((2.375 + l.hG) / 2, 9);
  });
});

describe("UG-34 bolted flat covers", () => {
  it("circular, pressure term: d 876.5 mm, C 0.3, P 13.76, S 1757 kg/cm², E 1 → t = 42.48 mm [SJ] (its bolting term is negligible there and not checked)", () => {
    const t = coverThicknessMm(
      { shape: "circular", dMm: 876.5, hGMm: 50.75, c: 0.3, jointEfficiency: 1 },
      { pressureMpa: 13.76, allowableMpa: 1757, boltLoadN: 0 },
    );
    expect(t).toBeCloseTo(42.48, 1);
  });
  it("circular: the bolting term is 1.9·W·hG/(S·E·d³) under the root, in any consistent unit system", () => {
    const g = { shape: "circular" as const, dMm: 15.043, hGMm: 3.7285, c: 0.3, jointEfficiency: 1 };
    const us = coverThicknessMm(g, { pressureMpa: 0, allowableMpa: 17500, boltLoadN: 700800 });
    expect(us).toBeCloseTo(15.043 * Math.sqrt((1.9 * 700800 * 3.7285) / (17500 * 15.043 ** 3)), 12);
    const si = coverThicknessMm(
      { ...g, dMm: IN(15.043), hGMm: IN(3.7285) },
      { pressureMpa: 0, allowableMpa: psiToMpa(17500), boltLoadN: lbfToN(700800) },
    );
    expect(si).toBeCloseTo(IN(us), 9);
  });
  it("Z = 3.4 − 2.4·d/D, at most 2.5; a square cover gives Z = 1", () => {
    expect(nonCircularZ(1, 1)).toBeCloseTo(1, 12);
    expect(nonCircularZ(1, 2)).toBeCloseTo(2.2, 12);
    expect(nonCircularZ(1, 100)).toBe(2.5);
  });
  it("non-circular cover: longer cover (higher Z) needs more thickness; larger hG needs more", () => {
    const base = {
      shape: "non-circular" as const,
      dMm: 400,
      longSpanMm: 400,
      perimeterMm: 1800,
      hGMm: 30,
      c: 0.3,
      jointEfficiency: 1,
    };
    const k = { pressureMpa: 1, allowableMpa: 138, boltLoadN: 300000 };
    const sq = coverThicknessMm(base, k);
    expect(coverThicknessMm({ ...base, longSpanMm: 800, perimeterMm: 2600 }, k)).toBeGreaterThan(sq);
    expect(coverThicknessMm({ ...base, hGMm: 45 }, k)).toBeGreaterThan(sq);
    expect(sq).toBeCloseTo(
      400 * Math.sqrt((1 * 0.3 * 1) / 138 + (6 * 300000 * 30) / (138 * 1800 * 400 * 400)),
      12,
    );
  });
});
