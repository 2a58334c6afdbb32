/**
 * The Pattern finder's "Stock to try" materials: our Stockroom's bolting rows (the built-in rows
 * the organisation did not hide and its own rows, as GET /api/v1/library/bolting lists them) or
 * the catalogue's bolt materials. Ticked rows become the request's `materialIds` and, for our own
 * rows, `stockedBolting` with their stored values, by the same mapping the API uses
 * (`searchMaterialsOf`). Pure (safe on the client).
 */
import type { UnitSystem } from "@/features/analysis/core/design";
import { BOLT_MATERIALS } from "@/features/analysis/core/catalogue/bolt-materials";
import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";
import type { BoltingChoiceDto } from "@/features/library/model/dto";
import { searchMaterialsOf } from "@/features/library/model/stocked-bolting";
import { toDisplay, unitLabel } from "./quantities";

export type StockSource = "stockroom" | "catalogue";

/** One material row of the dialog: its search id (catalogue id or "org:<uuid>") and what it shows. */
export interface StockChoice {
  searchId: string;
  name: string;
  ours: boolean;
  ranges: { yieldMpa: number; tensileMpa: number }[];
}

/** Our Stockroom's rows as the search names them: own rows by "org:<uuid>", built-in ones by catalogue id. */
export function stockroomChoices(rows: BoltingChoiceDto[]): StockChoice[] {
  const ids = searchMaterialsOf(rows).materialIds;
  return rows.map((r, i) => ({
    searchId: ids[i],
    name: r.name,
    ours: r.origin === "organization",
    ranges: r.ranges,
  }));
}

export function catalogueChoices(): StockChoice[] {
  return BOLT_MATERIALS.map((m) => ({ searchId: m.id, name: m.name, ours: false, ranges: m.ranges }));
}

/** "Sy 640–660 · Su 800–830 MPa": the yield and tensile strengths over the row's size ranges. */
export function strengthText(ranges: StockChoice["ranges"], units: UnitSystem): string {
  const span = (values: number[]) => {
    const [lo, hi] = [Math.min(...values), Math.max(...values)].map((v) =>
      String(Number(toDisplay("stress", v, units).toPrecision(3))),
    );
    return lo === hi ? lo : `${lo}–${hi}`;
  };
  if (ranges.length === 0) return "—";
  return `Sy ${span(ranges.map((r) => r.yieldMpa))} · Su ${span(ranges.map((r) => r.tensileMpa))} ${unitLabel("stress", units)}`;
}

/**
 * The request's materials for the ticked rows: from the Stockroom, the ticked listing rows through
 * `searchMaterialsOf` (own rows travel with their stored values); from the catalogue, its ids.
 */
export function stockOfRequest(
  source: StockSource,
  stockroomRows: BoltingChoiceDto[],
  ticked: ReadonlySet<string>,
): Pick<SuggestionRequest, "materialIds" | "stockedBolting"> {
  if (source === "catalogue")
    return {
      materialIds: catalogueChoices()
        .filter((c) => ticked.has(c.searchId))
        .map((c) => c.searchId),
    };
  const ids = searchMaterialsOf(stockroomRows).materialIds;
  const chosen = searchMaterialsOf(stockroomRows.filter((_, i) => ticked.has(ids[i])));
  return {
    materialIds: chosen.materialIds,
    ...(chosen.stockedBolting.length > 0 ? { stockedBolting: chosen.stockedBolting } : {}),
  };
}
