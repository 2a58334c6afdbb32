/**
 * ASME VIII-1 Appendix 2 flange design of one circular flange: loads and moment arms (2-3, Table
 * 2-6), moments for the operating and gasket-seating conditions (2-6), shape factors (2-7,
 * Table 2-7.1), stresses SH, SR, ST (2-7) with their allowable combinations (2-8), and the
 * rigidity index J (2-14). Units: mm, N, MPa, N·mm; every equation is dimensionally homogeneous,
 * so both unit branches share it (only the gasket width b has two branches, see asme-gasket-width.ts).
 *
 * Flange kinds covered: integral with a tapered hub (Fig. 2-4 sketches 5–7 style), integral
 * without a hub taper (g1 = g0), and loose ring flanges without a hub (Fig. 2-4 sketch 1-style
 * loose rings; ST = Y·Mo/(t²B), SH = SR = 0). Loose flanges with a hub (FL, VL) and reverse
 * flanges are not covered.
 */
import {
  integralHubFactors,
  NO_TAPER_HUB,
  ringFactors,
  type HubFactors,
  type RingFactors,
} from "./shape-factors";
import * as fm from "../fixed-math";

export type Appendix2FlangeKind = "integral-hub" | "integral-no-hub" | "ring-loose";

export interface Appendix2FlangeInput {
  kind: Appendix2FlangeKind;
  /** Flange outside diameter A, inside diameter B, bolt circle C, thickness t (mm). */
  aMm: number;
  bMm: number;
  cMm: number;
  tMm: number;
  /** Hub: thickness at the small end g0 and at the back of the flange g1, hub length h (mm). */
  g0Mm?: number;
  g1Mm?: number;
  hMm?: number;
  /** Gasket reaction diameter G (mm). */
  gMm: number;
  pressureMpa: number;
  /** Operating bolt load Wm1 and its parts H, Hp (N); flange design bolt load for seating W (N). */
  hN: number;
  hpN: number;
  wm1N: number;
  seatingBoltLoadN: number | null;
  /** Allowable flange stress at design and at ambient temperature (MPa); null when unknown. */
  sfDesignMpa: number | null;
  sfAmbientMpa: number | null;
  /** Modulus of the flange at design and ambient temperature (MPa). */
  eDesignMpa: number;
  eAmbientMpa: number;
}

export interface Appendix2Condition {
  condition: "operating" | "seating";
  momentNmm: number | null;
  shMpa: number | null;
  srMpa: number | null;
  stMpa: number | null;
  allowableMpa: number | null;
  /** Rigidity index J (≤ 1 passes). */
  rigidity: number | null;
}

export interface Appendix2FlangeResult {
  kind: Appendix2FlangeKind;
  hdN: number;
  htN: number;
  hgOperatingN: number;
  armDMm: number;
  armTMm: number;
  armGMm: number;
  /** R = (C − B)/2 − g1 for integral flanges (mm); null for loose rings. */
  rMm: number | null;
  ring: RingFactors;
  hub: (HubFactors & { h0Mm: number; e: number; d: number; L: number }) | null;
  rigidityFactor: { name: "KI" | "KL"; value: number };
  conditions: Appendix2Condition[];
}

/** KI for integral flanges and KL for loose flanges (2-14). */
export const RIGIDITY_FACTOR = { integral: 0.3, loose: 0.2 } as const;

/** Moment arms of Table 2-6. Integral: hD = R + g1/2, hT = (R + g1 + hG)/2; loose: hD = (C − B)/2, hT = (hD + hG)/2. */
export function momentArms(
  kind: Appendix2FlangeKind,
  bMm: number,
  cMm: number,
  gMm: number,
  g1Mm: number,
): { hD: number; hT: number; hG: number; R: number | null } {
  const hG = (cMm - gMm) / 2;
  if (kind === "ring-loose") {
    const hD = (cMm - bMm) / 2;
    return { hD, hT: (hD + hG) / 2, hG, R: null };
  }
  const R = (cMm - bMm) / 2 - g1Mm;
  return { hD: R + 0.5 * g1Mm, hT: (R + g1Mm + hG) / 2, hG, R };
}

/** SH, SR, ST (2-7) for a flange moment Mo (N·mm). */
export function flangeStresses(
  kind: Appendix2FlangeKind,
  momentNmm: number,
  tMm: number,
  bMm: number,
  g1Mm: number,
  ring: RingFactors,
  hub: { f: number; e: number; L: number } | null,
): { sh: number; sr: number; st: number } {
  if (kind === "ring-loose" || hub === null) {
    return { sh: 0, sr: 0, st: (ring.Y * momentNmm) / (tMm * tMm * bMm) };
  }
  const sh = (hub.f * momentNmm) / (hub.L * g1Mm * g1Mm * bMm);
  const sr = ((1.33 * tMm * hub.e + 1) * momentNmm) / (hub.L * tMm * tMm * bMm);
  const st = (ring.Y * momentNmm) / (tMm * tMm * bMm) - ring.Z * sr;
  return { sh, sr, st };
}

export function computeAppendix2Flange(i: Appendix2FlangeInput): Appendix2FlangeResult {
  const g0 = i.g0Mm ?? 0;
  const g1 = i.kind === "integral-hub" ? (i.g1Mm ?? g0) : g0;
  const arms = momentArms(i.kind, i.bMm, i.cMm, i.gMm, g1);
  const hdN = (Math.PI / 4) * i.bMm * i.bMm * i.pressureMpa;
  const htN = i.hN - hdN;
  const hgOperatingN = i.wm1N - i.hN;
  const ring = ringFactors(i.aMm / i.bMm);
  let hub: Appendix2FlangeResult["hub"] = null;
  if (i.kind !== "ring-loose") {
    const h0 = Math.sqrt(i.bMm * g0);
    const factors =
      i.kind === "integral-hub" && (i.hMm ?? 0) > 0
        ? integralHubFactors(g1 / g0, (i.hMm ?? 0) / h0)
        : NO_TAPER_HUB;
    const e = factors.F / h0;
    const d = (ring.U / factors.V) * h0 * g0 * g0;
    const L = (i.tMm * e + 1) / ring.T + (i.tMm * i.tMm * i.tMm) / d;
    hub = { ...factors, h0Mm: h0, e, d, L };
  }
  const operatingMoment = hdN * arms.hD + htN * arms.hT + hgOperatingN * arms.hG;
  const seatingMoment = i.seatingBoltLoadN === null ? null : i.seatingBoltLoadN * arms.hG;
  const rigidityFactor =
    i.kind === "ring-loose"
      ? { name: "KL" as const, value: RIGIDITY_FACTOR.loose }
      : { name: "KI" as const, value: RIGIDITY_FACTOR.integral };
  const rigidity = (mo: number, E: number): number =>
    hub === null
      ? (109.4 * mo) / (E * i.tMm * i.tMm * i.tMm * rigidityFactor.value * fm.log(ring.K))
      : (52.14 * hub.V * mo) / (hub.L * E * g0 * g0 * rigidityFactor.value * hub.h0Mm);
  const condition = (
    name: Appendix2Condition["condition"],
    mo: number | null,
    sf: number | null,
    E: number,
  ): Appendix2Condition => {
    if (mo === null)
      return {
        condition: name,
        momentNmm: null,
        shMpa: null,
        srMpa: null,
        stMpa: null,
        allowableMpa: sf,
        rigidity: null,
      };
    const s = flangeStresses(i.kind, mo, i.tMm, i.bMm, g1, ring, hub);
    return {
      condition: name,
      momentNmm: mo,
      shMpa: s.sh,
      srMpa: s.sr,
      stMpa: s.st,
      allowableMpa: sf,
      rigidity: rigidity(mo, E),
    };
  };
  return {
    kind: i.kind,
    hdN,
    htN,
    hgOperatingN,
    armDMm: arms.hD,
    armTMm: arms.hT,
    armGMm: arms.hG,
    rMm: arms.R,
    ring,
    hub,
    rigidityFactor,
    conditions: [
      condition("operating", operatingMoment, i.sfDesignMpa, i.eDesignMpa),
      condition("seating", seatingMoment, i.sfAmbientMpa, i.eAmbientMpa),
    ],
  };
}

export interface StressLimit {
  key: "sh" | "sr" | "st" | "sh-sr" | "sh-st";
  label: string;
  value: number;
  limit: number;
}

/** The allowable combinations of 2-8 for one condition (integral: five; loose ring: ST ≤ Sf). */
export function stressLimits(kind: Appendix2FlangeKind, c: Appendix2Condition): StressLimit[] {
  if (c.shMpa === null || c.srMpa === null || c.stMpa === null || c.allowableMpa === null) return [];
  const sf = c.allowableMpa;
  if (kind === "ring-loose") return [{ key: "st", label: "ST ≤ Sf", value: c.stMpa, limit: sf }];
  return [
    { key: "sh", label: "SH ≤ 1.5 Sf", value: c.shMpa, limit: 1.5 * sf },
    { key: "sr", label: "SR ≤ Sf", value: c.srMpa, limit: sf },
    { key: "st", label: "ST ≤ Sf", value: c.stMpa, limit: sf },
    { key: "sh-sr", label: "(SH + SR)/2 ≤ Sf", value: (c.shMpa + c.srMpa) / 2, limit: sf },
    { key: "sh-st", label: "(SH + ST)/2 ≤ Sf", value: (c.shMpa + c.stMpa) / 2, limit: sf },
  ];
}
