// $INSUNITS codes of the DXF header that a flange drawing plausibly uses, as mm per drawing unit.
// 0 (unitless) is read as millimetres, the usual default of drawing offices working in SI.
const MM_PER_UNIT: Record<number, { mm: number; label: string }> = {
  0: { mm: 1, label: "unitless (read as mm)" },
  1: { mm: 25.4, label: "inches" },
  2: { mm: 304.8, label: "feet" },
  4: { mm: 1, label: "millimetres" },
  5: { mm: 10, label: "centimetres" },
  6: { mm: 1000, label: "metres" },
  14: { mm: 100, label: "decimetres" },
};

export function resolveDxfUnits(insunits: unknown): { mmPerUnit: number; label: string } | { error: string } {
  const code = insunits === undefined || insunits === null ? 0 : Number(insunits);
  const hit = MM_PER_UNIT[code];
  if (!hit)
    return {
      error: `The drawing's units ($INSUNITS = ${String(insunits)}) are not supported; save it in mm or inches.`,
    };
  return { mmPerUnit: hit.mm, label: hit.label };
}
