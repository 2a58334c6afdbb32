import type { JointDesign, TighteningMethod, UnitSystem } from "@/features/analysis/core/design";
import { boltMaterialOf } from "@/features/analysis/core/catalogue/bolt-materials";
import { mmToIn, nmmToFtLb, nmmToNm, nToLbf } from "@/features/analysis/core/units";
import { stringifyCsv } from "@/features/forms/csv-cells";
import type { BoltRow } from "./bolt-rows";

/**
 * The Pass log: the tightening record the fitter fills in at the joint, for every pass of the
 * stored assembly plan and every bolt (numbered as on the sheet): the target, and room for the
 * measured value, with initials and date per pass. Bolts are taken in the order the fitter meets
 * them: the stored cross sequence for cross passes, bolt numbers for the circular pass.
 *
 * The target is what the method measures:
 * - torque wrench, turn of nut, load-indicating washer: the plan's torque per pass (T = K·F·d);
 * - bolt elongation, ultrasonic: the stretch ΔL = s·F·(1/kb + d/(As·E)) of the pass's share s of
 *   the target preload F, with the stored bolt stiffness kb over the grip plus half a diameter of
 *   loaded thread inside each nut or head (the effective-length convention of ASME PCC-1 Appendix
 *   J [mem]) [calc];
 * - hydraulic tensioner: the residual bolt load s·F (the tool pressure comes from its maker's load
 *   chart, with the load-transfer factor).
 * Pure: reads the stored result and computes only those quotients.
 */
export type PassTargetKind = "torque" | "elongation" | "load";

export interface PassLogPass {
  pass: number;
  name: string;
  pattern: "cross" | "circular";
  fraction: number;
  note: string;
  /** Target of every bolt in this pass, in the core's unit: N·mm (torque), mm (elongation) or N (load). */
  target: number;
  /** The plan's torque of this pass, N·mm (for reference beside another kind of target). */
  torqueNmm: number;
  /** Bolts in the order they are tightened in this pass. */
  steps: { step: number; boltNumber: number; boltId: string }[];
}

export interface PassLog {
  kind: PassTargetKind;
  method: TighteningMethod;
  /** How the targets were worked out, with tags. */
  basis: string;
  passes: PassLogPass[];
}

type StoredPlan = {
  assemblyPlan?: {
    sequence?: string[];
    passes?: {
      pass: number;
      name: string;
      pattern: "cross" | "circular";
      fractionOfTarget: number;
      torqueNm: number;
      note?: string;
    }[];
  };
  preload?: { targetN?: number };
  stiffness?: { boltStiffnessNPerMm?: number };
  fastener?: { nominalDiameterMm?: number; tensileStressAreaMm2?: number };
} | null;

const KIND: Record<TighteningMethod, PassTargetKind> = {
  "torque-wrench": "torque",
  "turn-of-nut": "torque",
  "load-indicating-washer": "torque",
  "hydraulic-tensioner": "load",
  "bolt-elongation": "elongation",
  ultrasonic: "elongation",
};

const finite = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v > 0;

/** Elongation per newton of bolt load, mm/N: 1/kb + (ends · d/2)/(As·E). Null when a number is missing. */
function stretchPerNewton(design: Pick<JointDesign, "fastener">, r: StoredPlan): number | null {
  const kb = r?.stiffness?.boltStiffnessNPerMm;
  const d = r?.fastener?.nominalDiameterMm;
  const as = r?.fastener?.tensileStressAreaMm2;
  const e = boltMaterialOf(design.fastener)?.modulusMpa;
  if (!finite(kb) || !finite(d) || !finite(as) || !finite(e)) return null;
  // A through bolt has a nut or head at both ends of its grip; into a tapped hole the core's grip
  // already reaches half the engagement, so only the nut or head end is added.
  const ends = design.fastener.termination.kind === "tapped-hole" ? 1 : 2;
  return 1 / kb + (ends * (d / 2)) / (as * e);
}

export function buildPassLog(
  design: Pick<JointDesign, "assembly" | "fastener">,
  result: unknown,
  rows: readonly BoltRow[],
): PassLog {
  const r = (result ?? null) as StoredPlan;
  const plan = r?.assemblyPlan;
  const targetN = r?.preload?.targetN;
  const perN = stretchPerNewton(design, r);
  let kind = KIND[design.assembly.method] ?? "torque";
  // Without the numbers a quotient needs, fall back to the plan's torque rather than invent one.
  if (kind === "elongation" && !(finite(targetN) && perN !== null)) kind = "torque";
  if (kind === "load" && !finite(targetN)) kind = "torque";
  const byId = new Map(rows.map((row) => [row.id, row]));
  const sequence = (plan?.sequence ?? []).map((id) => byId.get(id)).filter((x): x is BoltRow => !!x);
  const crossOrder = sequence.length === rows.length ? sequence : [...rows];
  const byNumber = [...rows].sort((a, b) => a.number - b.number);
  const passes: PassLogPass[] = (plan?.passes ?? []).map((p) => {
    const order = p.pattern === "cross" ? crossOrder : byNumber;
    const share = p.fractionOfTarget * (targetN ?? 0);
    return {
      pass: p.pass,
      name: p.name,
      pattern: p.pattern,
      fraction: p.fractionOfTarget,
      note: p.note ?? "",
      target: kind === "elongation" ? share * perN! : kind === "load" ? share : p.torqueNm * 1000,
      torqueNmm: p.torqueNm * 1000,
      steps: order.map((row, i) => ({ step: i + 1, boltNumber: row.number, boltId: row.id })),
    };
  });
  const basis =
    kind === "elongation"
      ? "target stretch ΔL = share × F × (1/kb + d/(As·E)): stored target preload F and bolt stiffness kb, half a diameter of loaded thread in each nut or head (ASME PCC-1 Appendix J convention [mem]) [calc]"
      : kind === "load"
        ? "target residual bolt load = share × F, the stored target preload; set the tool pressure from the tensioner maker's load chart (load-transfer factor)"
        : "target torque of the assembly plan, T = K·F·d per pass";
  return { kind, method: design.assembly.method, basis, passes };
}

/** The unit and the numbers of a Pass log target in a unit system (torque N·m / ft·lb, mm / in, kN / lbf). */
export function passTargetUnit(kind: PassTargetKind, system: UnitSystem): string {
  if (kind === "torque") return system === "US" ? "ft·lb" : "N·m";
  if (kind === "load") return system === "US" ? "lbf" : "kN";
  return system === "US" ? "in" : "mm";
}

/** Example: torque 255700 N·mm in SI → "256"; elongation 0.2104 mm in US → "0.0083". */
export function passTargetText(kind: PassTargetKind, system: UnitSystem, value: number): string {
  if (kind === "torque") return (system === "US" ? nmmToFtLb(value) : nmmToNm(value)).toFixed(0);
  if (kind === "load") return system === "US" ? nToLbf(value).toFixed(0) : (value / 1000).toFixed(1);
  // Stretches are tenths of a millimetre: three decimals in mm, four in inches.
  return system === "US" ? mmToIn(value).toFixed(4) : value.toFixed(3);
}

/**
 * The Pass log as CSV (`pass-log.csv`): one row per pass and bolt, in tightening order, with the
 * target in the design's unit system and empty `measured`, `initials` and `date` cells to fill in.
 * Text cells go through the shared formula-injection guard.
 */
export function buildPassLogCsv(
  design: Pick<JointDesign, "units">,
  log: PassLog,
  options: { unverified?: boolean } = {},
): string {
  const unit = passTargetUnit(log.kind, design.units).replace("·", "_");
  const header = [
    "pass",
    "pass_name",
    "pattern",
    "share_of_target_percent",
    "step",
    "bolt_number",
    "bolt_id",
    `target_${log.kind}_${unit}`,
    "measured",
    "initials",
    "date",
    ...(options.unverified ? ["contains_unverified_table_values"] : []),
  ];
  const rows = log.passes.flatMap((p) =>
    p.steps.map((s) => [
      String(p.pass),
      p.name,
      p.pattern,
      String(Math.round(p.fraction * 100)),
      String(s.step),
      String(s.boltNumber),
      s.boltId,
      passTargetText(log.kind, design.units, p.target),
      "",
      "",
      "",
      ...(options.unverified ? ["yes"] : []),
    ]),
  );
  return stringifyCsv([header, ...rows], { record_delimiter: "\r\n" });
}
