/**
 * Hydrostatic test case at the test pressure Pt the designer enters (never at the suggestion alone),
 * at ambient temperature, bolts at their bolt-up preload window. Loads by ASME VIII-1 Appendix 2
 * (2-5) evaluated at Pt [practice]: Ht = π/4·G²·Pt (enclosed area × Pt off Appendix 2 scope),
 * Hpt = 2b·πG·m·Pt (reaction line length off scope), Wm1t = Ht + Hpt. Checks:
 * - the bolts hold the joint closed at test: n·Fmin ≥ Wm1t, and no separation, Pt share < Fmin/(1 − C);
 * - bolt stress at test at maximum preload, (Fmax + C·Pt share)/As ≤ proof, as in service;
 * - flange (Appendix 2 stresses of the operating condition recomputed at Pt) and cover (UG-34 at Pt,
 *   W = Wm1t) against 90 % of the material's specified minimum yield at test temperature. UG-99(d)
 *   leaves the stress at test to the designer's judgement; 0.9·Sy is the common practice limit for
 *   membrane stress at hydrotest, used here for the flange and cover stresses too [practice].
 * The flange's rigidity index J is not applied at test (a temporary condition) [practice].
 * Units: mm, N, MPa.
 */
import type { JointModel } from "../joint-model";
import type { AsmeAppendix2Result } from "../checks/asme-appendix2";
import { makeCheck, type CheckRecord } from "../checks/check-record";
import type { FlangeMaterialRow } from "../catalogue/flange-materials";
import { computeAppendix2Flange, type Appendix2FlangeInput } from "./appendix2-flange";
import { coverThicknessMm, type CoverGeometry } from "./flat-cover";

/** Fraction of the specified minimum yield allowed at hydrotest [practice]. */
export const TEST_STRESS_FRACTION_OF_YIELD = 0.9;

export interface HydrotestCase {
  pressureMpa: number;
  /** Appendix 2 loads at the test pressure, N. */
  hN: number;
  hpN: number;
  wm1N: number;
  /** Total bolt load at minimum preload (n × Fmin), N. */
  minPreloadTotalN: number;
  /** Pressure load per bolt at Pt, N. */
  pressurePerBoltN: number;
  /** Largest bolt stress at test, (Fmax + C·Pt share)/As, and its limit (proof), MPa. */
  boltStressMpa: number;
  boltLimitMpa: number;
  flange: {
    momentNmm: number;
    shMpa: number;
    srMpa: number;
    stMpa: number;
    limitMpa: number;
    yieldSource: string;
  } | null;
  flangeReason: string | null;
  cover: {
    requiredThicknessMm: number;
    actualThicknessMm: number;
    allowableMpa: number;
    yieldSource: string;
  } | null;
  coverReason: string | null;
  source: string;
}

/** What the flange and cover checks used at design conditions, reused at the test pressure. */
export interface HydrotestContext {
  appendix2: { input: Appendix2FlangeInput; material: FlangeMaterialRow | null } | null;
  cover: { geometry: CoverGeometry; material: FlangeMaterialRow | null; actualThicknessMm: number } | null;
}

const LOADS_SOURCE = "ASME VIII-1 Appendix 2 (2-5) loads at the test pressure [practice]";
const YIELD_RULE = `${TEST_STRESS_FRACTION_OF_YIELD * 100} % of specified minimum yield at test [practice]`;
const kn = (n: number) => (n / 1000).toFixed(1);

function notApplicable(reason: string): CheckRecord {
  return makeCheck({
    id: "flange.test.bolt-load",
    title: "Hydrostatic test: total bolt load at minimum preload ≥ Wm1 at test pressure",
    value: null,
    limit: null,
    unit: "N",
    status: "not-applicable",
    source: LOADS_SOURCE,
    note: reason,
  });
}

export function computeHydrotestCase(
  model: JointModel,
  asme: AsmeAppendix2Result,
  testPressureMpa: number | null,
  context: HydrotestContext,
): { result: HydrotestCase | null; reason: string | null; checks: CheckRecord[] } {
  if (testPressureMpa === null || !(testPressureMpa > 0)) {
    const reason = "No test pressure entered: the hydrostatic test case is not computed.";
    return { result: null, reason, checks: [notApplicable(reason)] };
  }
  const Pt = testPressureMpa;
  const m = model.design.gasket.material.m;
  const hN = asme.enclosedAreaMm2 * Pt;
  const hpN = 2 * asme.geometry.bMm * asme.reactionLengthMm * m * Pt;
  const wm1N = hN + hpN;
  const n = model.boltPoints.length;
  const p = model.preload;
  const C = model.jointConstant;
  const As = model.thread.tensileStressAreaMm2;
  const pressurePerBoltN = (model.pressureAreaMm2 * Pt) / n;
  const minPreloadTotalN = n * p.minN;
  const boltStressMpa = (p.maxN + C * pressurePerBoltN) / As;
  const sy = model.strength.yieldMpa;
  const checks: CheckRecord[] = [
    makeCheck({
      id: "flange.test.bolt-load",
      title: "Hydrostatic test: total bolt load at minimum preload ≥ Wm1 at test pressure",
      value: minPreloadTotalN,
      limit: wm1N,
      unit: "N",
      status: minPreloadTotalN >= wm1N ? "pass" : "fail",
      source: `${LOADS_SOURCE}; m = ${m} from the gasket`,
      note: `Pt = ${Pt.toFixed(3)} MPa: Ht = ${kn(hN)} kN, Hpt = ${kn(hpN)} kN, Wm1t = ${kn(wm1N)} kN against ${n} × ${kn(p.minN)} kN at minimum preload.`,
    }),
    makeCheck({
      id: "flange.test.separation",
      title: "Hydrostatic test: no joint separation at minimum preload",
      value: pressurePerBoltN,
      limit: p.minN / (1 - C),
      unit: "N",
      status: pressurePerBoltN < p.minN / (1 - C) ? "pass" : "fail",
      source: "separation load of the joint diagram P0 = Fi/(1 − C) (VDI 2230 Part 1; Bickford), at Pt",
      note: `Pressure load ${kn(pressurePerBoltN)} kN per bolt at Pt (end force on ${model.pressureAreaBasis}).`,
    }),
    makeCheck({
      id: "flange.test.bolt-stress",
      title: "Hydrostatic test: bolt stress at maximum preload (Fi + C·Pt share) ≤ proof",
      value: boltStressMpa,
      limit: p.proofMpa,
      unit: "MPa",
      status: boltStressMpa <= p.proofMpa ? "pass" : boltStressMpa <= sy ? "warn" : "fail",
      source:
        "load sharing by the joint constant Fb = Fi + C·P (VDI 2230 Part 1 load factor) at Pt; ISO 898-1 proof stress or 0.9·yield [practice]",
      note: `C = ${C.toFixed(3)}, maximum preload ${kn(p.maxN)} kN + ${kn(C * pressurePerBoltN)} kN from the test pressure.`,
    }),
  ];

  let flange: HydrotestCase["flange"] = null;
  let flangeReason: string | null = null;
  const a2 = context.appendix2;
  if (!a2) flangeReason = "No Appendix 2 flange in this design: no flange stresses at test.";
  else if (!a2.material)
    flangeReason =
      "The flange's specified minimum yield is needed for the stresses at test: pick the flange material.";
  else {
    const r = computeAppendix2Flange({ ...a2.input, pressureMpa: Pt, hN, hpN, wm1N, seatingBoltLoadN: null });
    const c = r.conditions[0];
    const limit = TEST_STRESS_FRACTION_OF_YIELD * a2.material.yieldMpa;
    flange = {
      momentNmm: c.momentNmm!,
      shMpa: c.shMpa!,
      srMpa: c.srMpa!,
      stMpa: c.stMpa!,
      limitMpa: limit,
      yieldSource: a2.material.yieldSource,
    };
    const worst = Math.max(
      flange.shMpa,
      flange.srMpa,
      flange.stMpa,
      (flange.shMpa + flange.srMpa) / 2,
      (flange.shMpa + flange.stMpa) / 2,
    );
    checks.push(
      makeCheck({
        id: "flange.test.flange-stress",
        title: "Hydrostatic test: Appendix 2 flange stresses ≤ 0.9·Sy",
        value: worst,
        limit,
        unit: "MPa",
        status: worst <= limit ? "pass" : "fail",
        source: `ASME VIII-1 Appendix 2 (2-6, 2-7) at Pt; ${YIELD_RULE}; Sy ${a2.material.yieldSource}`,
        note: `Mo = ${(flange.momentNmm / 1e6).toFixed(2)} kN·m; SH = ${flange.shMpa.toFixed(1)}, SR = ${flange.srMpa.toFixed(1)}, ST = ${flange.stMpa.toFixed(1)} MPa (the largest of these and their two means governs).`,
      }),
    );
  }

  let cover: HydrotestCase["cover"] = null;
  let coverReason: string | null = null;
  const cv = context.cover;
  if (!cv) coverReason = "No sized cover in this design: no cover thickness at test.";
  else if (!cv.material)
    coverReason = "The cover's specified minimum yield is needed at test: pick the cover material.";
  else {
    const allowable = TEST_STRESS_FRACTION_OF_YIELD * cv.material.yieldMpa;
    const required = coverThicknessMm(cv.geometry, {
      pressureMpa: Pt,
      allowableMpa: allowable,
      boltLoadN: wm1N,
    });
    cover = {
      requiredThicknessMm: required,
      actualThicknessMm: cv.actualThicknessMm,
      allowableMpa: allowable,
      yieldSource: cv.material.yieldSource,
    };
    checks.push(
      makeCheck({
        id: "flange.test.cover-thickness",
        title: "Hydrostatic test: UG-34 cover thickness ≥ required at Pt",
        value: cv.actualThicknessMm,
        limit: required,
        unit: "mm",
        status: cv.actualThicknessMm >= required ? "pass" : "fail",
        source: `ASME VIII-1 UG-34 at Pt with W = Wm1t and S = 0.9·Sy; ${YIELD_RULE}; Sy ${cv.material.yieldSource}`,
        note: `S = ${allowable.toFixed(1)} MPa, W = ${kn(wm1N)} kN: t = ${required.toFixed(1)} mm required.`,
      }),
    );
  }
  return {
    result: {
      pressureMpa: Pt,
      hN,
      hpN,
      wm1N,
      minPreloadTotalN,
      pressurePerBoltN,
      boltStressMpa,
      boltLimitMpa: p.proofMpa,
      flange,
      flangeReason,
      cover,
      coverReason,
      source: `${LOADS_SOURCE}; stresses at test ${YIELD_RULE}`,
    },
    reason: null,
    checks,
  };
}
