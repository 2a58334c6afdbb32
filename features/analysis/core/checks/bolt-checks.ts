/**
 * Bolt checks: assembly stress window in the style of ASME PCC-1 Appendix O (minimum typically
 * 20–40 % and maximum 40–70 % of yield [pub2]; the midpoints 30 % and 55 % are used), bolt stress
 * in service at maximum preload, joint separation at minimum preload, and bolt length.
 * Stresses on the tensile stress area. Units: N, MPa, mm.
 */
import type { JointModel } from "../joint-model";
import { makeCheck, type CheckRecord } from "./check-record";
import { percent } from "../units";

export const ASSEMBLY_STRESS_MIN_FRACTION_OF_YIELD = 0.3;
export const ASSEMBLY_STRESS_MAX_FRACTION_OF_YIELD = 0.55;

/** Length that covers the grip and full nut engagement (the bolt-length rule's limit), mm. */
export function requiredBoltLengthMm(model: JointModel): number {
  const f = model.design.fastener;
  const d = model.nominalDiameterMm;
  const nutH = d; // heavy hex nut height ≈ D [mem]; metric ISO 4032 ≈ 0.8–0.9·d, so this is conservative.
  const tapped = f.termination.kind === "tapped-hole" ? f.termination : null;
  return tapped
    ? model.gripMm -
        Math.min(tapped.memberThicknessMm, d) / 2 +
        tapped.engagementMm +
        (f.form === "stud" ? nutH : 0)
    : model.gripMm + (f.form === "stud" ? 2 : 1) * nutH;
}

export function checkBolts(model: JointModel): CheckRecord[] {
  const As = model.thread.tensileStressAreaMm2;
  const sy = model.strength.yieldMpa;
  const p = model.preload;
  const C = model.jointConstant;
  const pMax = Math.max(0, ...model.externalLoadPerBoltN);
  const out: CheckRecord[] = [];
  const sMin = p.minN / As;
  const sMax = p.maxN / As;
  const lo = ASSEMBLY_STRESS_MIN_FRACTION_OF_YIELD * sy;
  const hi = ASSEMBLY_STRESS_MAX_FRACTION_OF_YIELD * sy;
  const src =
    "ASME PCC-1 Appendix O style assembly bolt stress window (midpoints of the typical ranges) [pub2]";
  out.push(
    makeCheck({
      id: "bolt.assembly-stress-min",
      title: "Assembly bolt stress at minimum preload ≥ lower window limit",
      value: sMin,
      limit: lo,
      unit: "MPa",
      status: sMin >= lo ? "pass" : "warn",
      source: src,
      note: `Lower limit ${percent(ASSEMBLY_STRESS_MIN_FRACTION_OF_YIELD)} % of yield ${sy.toFixed(0)} MPa.`,
    }),
  );
  out.push(
    makeCheck({
      id: "bolt.assembly-stress-max",
      title: "Assembly bolt stress at maximum preload ≤ upper window limit",
      value: sMax,
      limit: hi,
      unit: "MPa",
      status: sMax <= hi ? "pass" : sMax <= sy ? "warn" : "fail",
      source: src,
      note: `Upper limit ${percent(ASSEMBLY_STRESS_MAX_FRACTION_OF_YIELD)} % of yield; above yield fails.`,
    }),
  );
  const sService = (p.maxN + C * pMax) / As;
  out.push(
    makeCheck({
      id: "bolt.service-stress",
      title: "Bolt stress in service at maximum preload (Fi + C·P) ≤ proof",
      value: sService,
      limit: p.proofMpa,
      unit: "MPa",
      status: sService <= p.proofMpa ? "pass" : sService <= sy ? "warn" : "fail",
      source:
        "load sharing by the joint constant Fb = Fi + C·P (VDI 2230 Part 1 load factor); ISO 898-1 proof stress or 0.9·yield [practice]",
      note: `C = ${C.toFixed(3)}, largest external load per bolt ${(pMax / 1000).toFixed(2)} kN${p.proofEstimated ? "; proof estimated as 0.9·yield" : ""}.`,
    }),
  );
  const p0 = p.minN / (1 - C);
  out.push(
    makeCheck({
      id: "joint.separation",
      title: "No joint separation at minimum preload (P < P0 = Fi/(1 − C))",
      value: pMax,
      limit: p0,
      unit: "N",
      status: pMax < p0 ? "pass" : "fail",
      source: "separation load of the joint diagram P0 = Fi/(1 − C) (VDI 2230 Part 1; Bickford)",
      note: pMax > 0 ? `Separation factor ${(p0 / pMax).toFixed(2)}.` : "No external separating load.",
    }),
  );
  const f = model.design.fastener;
  const d = model.nominalDiameterMm;
  const tapped = f.termination.kind === "tapped-hole" ? f.termination : null;
  const needed = requiredBoltLengthMm(model);
  out.push(
    makeCheck({
      id: "bolt.length",
      title: "Bolt length covers grip and full nut engagement",
      value: f.lengthMm,
      limit: needed,
      unit: "mm",
      status: f.lengthMm >= needed ? "pass" : "warn",
      source: "common practice: full nut engagement (nut height ≈ d) [practice]",
      note: "Add one to two thread pitches of protrusion in practice.",
    }),
  );
  if (tapped) {
    out.push(
      makeCheck({
        id: "bolt.thread-engagement",
        title: "Thread engagement in the tapped hole ≥ 1·d",
        value: tapped.engagementMm,
        limit: d,
        unit: "mm",
        status: tapped.engagementMm >= d ? "pass" : "warn",
        source: "common practice for steel into steel [practice]",
        note: "Softer tapped members need more (≈ 1.5–2·d).",
      }),
    );
  }
  return out;
}
