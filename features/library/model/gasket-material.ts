// The copy of a Stockroom gasket that goes into a design document. A design embeds these values
// (never a reference), so later edits of the Stockroom row cannot change a saved revision.
import type { GasketMaterial } from "@/features/analysis/core/design";
import type { GasketChoiceDto, LeakageClass } from "./dto";

/**
 * Example: `toGasketMaterial(choice, "L0.1")` copies m, y, modulus, thickness and the L0.1
 * Qmin/QSmin (if the row has them) with the row's source and edition. A built-in row keeps the
 * core catalogue's own id (so the analysis lists its catalogue edition); an organisation's row
 * keeps its "org:<uuid>" id, which names where the copy came from.
 */
export function toGasketMaterial(
  choice: GasketChoiceDto,
  leakageClass: LeakageClass = "L0.1",
): GasketMaterial {
  const t = choice.tightness[leakageClass];
  return {
    name: choice.name,
    catalogueId: choice.origin === "builtin" ? choice.rowId : choice.id,
    m: choice.m,
    yMpa: choice.yMpa,
    ...(t?.qMinMpa != null ? { qMinMpa: t.qMinMpa } : {}),
    ...(t?.qsMinMpa != null ? { qsMinMpa: t.qsMinMpa } : {}),
    ...(choice.qsMaxMpa != null ? { qsMaxMpa: choice.qsMaxMpa } : {}),
    modulusMpa: choice.modulusMpa,
    thicknessMm: choice.thicknessMm,
    source: choice.edition ? `${choice.source}; ${choice.edition}` : choice.source,
  };
}
