// $INSUNITS codes of the DXF header that a flange drawing plausibly uses, as mm per drawing unit.
// A file that states no unit (R12 has no $INSUNITS; 0 means unitless) is read in the unit the
// user picks on the Drawing intake (mm unless $MEASUREMENT says imperial), and says so.
const MM_PER_UNIT: Record<number, { mm: number; label: string }> = {
  1: { mm: 25.4, label: "inches" },
  2: { mm: 304.8, label: "feet" },
  4: { mm: 1, label: "millimetres" },
  5: { mm: 10, label: "centimetres" },
  6: { mm: 1000, label: "metres" },
  14: { mm: 100, label: "decimetres" },
};

export type AssumedUnit = "mm" | "in";

export interface DxfUnits {
  mmPerUnit: number;
  label: string;
  /** False when the file states no unit and `assumed` was used. */
  stated: boolean;
  /** The unit used when the file states none (the user's pick, else the $MEASUREMENT hint). */
  assumed: AssumedUnit;
}

export function resolveDxfUnits(
  header: { $INSUNITS?: unknown; $MEASUREMENT?: unknown } | undefined,
  pick?: AssumedUnit,
): DxfUnits | { error: string } {
  const insunits = header?.$INSUNITS;
  const code = insunits === undefined || insunits === null ? 0 : Number(insunits);
  const assumed: AssumedUnit = pick ?? (Number(header?.$MEASUREMENT) === 0 ? "in" : "mm");
  if (code === 0) {
    const why = insunits === undefined || insunits === null ? "the file states no unit" : "unitless";
    return assumed === "in"
      ? { mmPerUnit: 25.4, label: `inches (${why}; your choice)`, stated: false, assumed }
      : { mmPerUnit: 1, label: `millimetres (${why}; your choice)`, stated: false, assumed };
  }
  const hit = MM_PER_UNIT[code];
  if (!hit)
    return {
      error: `The drawing's units ($INSUNITS = ${String(insunits)}) are not supported; save it in mm or inches.`,
    };
  return { mmPerUnit: hit.mm, label: hit.label, stated: true, assumed };
}
