/**
 * The length of stud (or bolt) to order for a joint, added up from what the fastener passes
 * through and holds:
 *
 *   L = clamped layers + washers + nuts + thread projection beyond each nut
 *       (+ thread engagement in a tapped hole) (+ free thread for a tensioner's puller)
 *
 * - Projection: two thread pitches beyond each nut [practice] (ASME PCC-1 and B16.5 practice ask the
 *   stud to pass the nut by at least one full thread [mem]).
 * - Hydraulic tensioner: the puller grips the stud beyond the nut on one end, so that end projects
 *   at least one nominal diameter [practice] (the tensioner maker's data govern).
 * - A hex bolt is measured under the head; a stud end to end without the points [mem: B16.5 practice].
 * - Rounded up to the next 5 mm for metric sizes [practice], the next 1/4 in for inch sizes (ASME
 *   B16.5 stud lengths go in 1/4 in steps [mem]).
 *
 * Washers: one under each nut or head (two for a through bolt, one into a tapped hole).
 * Example: M20 stud, nuts both ends, layers 30 + 3 + 30 mm, washers 3 mm, nut m = 18 mm, P = 2.5 mm:
 * 63 + 2·3 + 2·18 + 2·5 = 115 mm, ordered as 115 mm.
 */
import { inToMm, mmToIn } from "./units";

export interface StudLengthInput {
  form: "stud" | "hex-bolt";
  termination: "nut" | "tapped-hole";
  /** Sum of the clamped layers (flanges, covers, gasket), mm. */
  clampedMm: number;
  /** Thickness of one washer, mm; 0 without washers. */
  washerThicknessMm: number;
  nutHeightMm: number;
  pitchMm: number;
  nominalDiameterMm: number;
  /** Thread engagement in a tapped member, mm (tapped holes only). */
  engagementMm: number | null;
  metric: boolean;
  /** Tightened with a hydraulic tensioner: one end projects at least 1·d. */
  tensioner: boolean;
}

export interface StudLengthTerm {
  label: string;
  count: number;
  eachMm: number;
}

export interface StudLength {
  /** The length the joint needs, mm. */
  requiredMm: number;
  /** Rounded up to the ordering step, mm. */
  orderMm: number;
  /** The ordering step, mm (5, or 1/4 in). */
  stepMm: number;
  nutsPerBolt: 0 | 1 | 2;
  washersPerBolt: 0 | 1 | 2;
  /** Thread beyond one nut: two pitches, mm. */
  projectionMm: number;
  /** The sum, term by term, in the order a reader checks it. */
  terms: StudLengthTerm[];
  /** The rules behind the terms and the rounding, with their tags. */
  rule: string;
}

export function computeStudLength(input: StudLengthInput): StudLength {
  const tapped = input.termination === "tapped-hole";
  const nutsPerBolt: 0 | 1 | 2 = tapped ? (input.form === "stud" ? 1 : 0) : input.form === "stud" ? 2 : 1;
  const washersPerBolt: 0 | 1 | 2 = input.washerThicknessMm > 0 ? (tapped ? 1 : 2) : 0;
  const projectionMm = 2 * input.pitchMm;
  const terms: StudLengthTerm[] = [{ label: "clamped layers", count: 1, eachMm: input.clampedMm }];
  if (washersPerBolt > 0)
    terms.push({ label: "washer", count: washersPerBolt, eachMm: input.washerThicknessMm });
  if (tapped) terms.push({ label: "thread engagement", count: 1, eachMm: input.engagementMm ?? 0 });
  if (nutsPerBolt > 0) {
    terms.push({ label: "nut", count: nutsPerBolt, eachMm: input.nutHeightMm });
    terms.push({ label: "2 threads beyond the nut", count: nutsPerBolt, eachMm: projectionMm });
    const extra = input.tensioner ? Math.max(0, input.nominalDiameterMm - projectionMm) : 0;
    if (extra > 0) terms.push({ label: "free thread for the tensioner (1·d)", count: 1, eachMm: extra });
  }
  const requiredMm = terms.reduce((a, t) => a + t.count * t.eachMm, 0);
  const stepMm = input.metric ? 5 : inToMm(0.25);
  // A hair of tolerance so that a length already on the step is not pushed to the next one.
  const orderMm = input.metric
    ? Math.ceil(requiredMm / 5 - 1e-9) * 5
    : inToMm(Math.ceil(mmToIn(requiredMm) / 0.25 - 1e-9) * 0.25);
  const rules = [
    nutsPerBolt > 0 ? "2 threads beyond each nut [practice]" : null,
    input.tensioner && nutsPerBolt > 0 ? "1·d free thread on the tensioner end [practice]" : null,
    input.metric ? "rounded up to 5 mm [practice]" : "rounded up to 1/4 in (ASME B16.5 stud lengths [mem])",
    input.form === "stud" ? "stud length without the points" : "bolt length under the head",
  ].filter(Boolean);
  return {
    requiredMm,
    orderMm,
    stepMm,
    nutsPerBolt,
    washersPerBolt,
    projectionMm,
    terms,
    rule: rules.join("; "),
  };
}
