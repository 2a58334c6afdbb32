/**
 * The Pattern finder's lengths (bolt-path offsets, keep-out zones, tool clearance) as typed, in
 * the Layout desk's unit system (SI mm, US in), and their conversion to the request's mm with the
 * joint data form's unit table and number parsing (`quantities.ts`, `parseNumberField`). Pure.
 */
import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import { getBoltPathLengthMm } from "@/features/analysis/core/geometry";
import {
  SUGGESTION_LIMITS,
  currentOffsetMm,
  type SuggestionRequest,
} from "@/features/analysis/core/suggest/request";
import { parseNumberField, type NumberFieldSpec } from "./field-specs";
import { formatInputNumber, toDisplay, unitLabel } from "./quantities";

export interface KeepOutRow {
  from: string;
  to: string;
  label: string;
}

/** What the Path rules' length boxes hold, in display units. */
export interface FinderLengths {
  tryOffsets: boolean;
  offsetFrom: string;
  offsetTo: string;
  offsetStep: string;
  keepOuts: KeepOutRow[];
  clearance: string;
}

export type FinderLengthsMm = Pick<SuggestionRequest, "offsetRangeMm" | "keepOuts" | "minToolClearanceMm">;

// The offered offset range: the design's offset one step either side, rounded (display units).
const OFFSET_STEP: Record<UnitSystem, number> = { SI: 5, US: 0.25 };
const OFFSET_ROUNDING: Record<UnitSystem, number> = { SI: 1, US: 0.05 };
// Decimals of a length on the Candidate cards: 0.1 mm, 0.001 in.
const CARD_DECIMALS: Record<UnitSystem, number> = { SI: 1, US: 3 };

/** The boxes as the dialog opens: no keep-outs, no extra clearance, offsets around the design's own. */
export function initialFinderLengths(design: JointDesign, units: UnitSystem): FinderLengths {
  const offsetMm = currentOffsetMm(design);
  const step = OFFSET_STEP[units];
  const q = OFFSET_ROUNDING[units];
  const round = (v: number) => Math.round(v / q) * q;
  const shown = offsetMm === null ? null : toDisplay("length", offsetMm, units);
  return {
    tryOffsets: false,
    offsetFrom: shown === null ? "" : formatInputNumber(Math.max(q, round(shown - step))),
    offsetTo: shown === null ? "" : formatInputNumber(round(shown + step)),
    offsetStep: formatInputNumber(step),
    keepOuts: [],
    clearance: "0",
  };
}

/** A length in display units for the dialog's text, without its unit: `cardLength(25.4, "US")` → "1.000". */
export function cardLength(mm: number, units: UnitSystem): string {
  return toDisplay("length", mm, units).toFixed(CARD_DECIMALS[units]);
}

/** The path length as the dialog's heading states it ("1893.4 mm", "74.543 in"). */
export function pathLengthText(design: JointDesign, units: UnitSystem): string {
  return `${cardLength(getBoltPathLengthMm(design), units)} ${unitLabel("length", units)}`;
}

const length = (label: string, min: number, max: number, minExclusive = false): NumberFieldSpec => ({
  path: label,
  label,
  quantity: "length",
  min,
  max,
  minExclusive,
});

/**
 * The boxes in mm, or every problem in the unit typed: offsets greater than zero, keep-outs on
 * the path (0 to its length; a value a rounding above the length, as the heading shows it, is the
 * length), the clearance within the search's limit.
 */
export function finderLengthsToMm(
  design: JointDesign,
  form: FinderLengths,
  units: UnitSystem,
): { ok: true; value: FinderLengthsMm } | { ok: false; messages: string[] } {
  const messages: string[] = [];
  const read = (spec: NumberFieldSpec, raw: string) => {
    const r = parseNumberField(spec, raw, units);
    if (r.ok) return r.value;
    messages.push(r.message);
    return NaN;
  };
  const L = getBoltPathLengthMm(design);
  const onPath = (label: string) => length(label, 0, L * (1 + 1e-4));
  const offsets = form.tryOffsets && currentOffsetMm(design) !== null;
  const value: FinderLengthsMm = {
    offsetRangeMm: offsets
      ? {
          fromMm: read(length("Offset from", 0, Infinity, true), form.offsetFrom),
          toMm: read(length("Offset to", 0, Infinity, true), form.offsetTo),
          stepMm: read(length("Offset step", 0, Infinity, true), form.offsetStep),
        }
      : null,
    keepOuts: form.keepOuts.map((k, i) => ({
      kind: "arc-length" as const,
      fromMm: Math.min(read(onPath(`Keep-out ${i + 1} from`), k.from), L),
      toMm: Math.min(read(onPath(`Keep-out ${i + 1} to`), k.to), L),
      ...(k.label.trim() ? { label: k.label.trim() } : {}),
    })),
    minToolClearanceMm: read(length("Tool clearance", 0, SUGGESTION_LIMITS.toolClearanceMm), form.clearance),
  };
  return messages.length > 0 ? { ok: false, messages } : { ok: true, value };
}
