// Stockroom bolting rows as the pattern search takes them ("stocked bolting"): the row's values
// as stored, copied into `StockedBoltingRow`s (core/suggest/request.ts). Built-in rows are the
// catalogue's materials and are offered by their catalogue id instead. Pure (safe on the client).
import { sortedStrengthRanges } from "@/features/analysis/core/catalogue/lookups";
import type { StockedBoltMaterial } from "@/features/analysis/core/design";
import type { StockedBoltingRow } from "@/features/analysis/core/suggest/request";
import type { BoltingInput } from "../schema";
import type { BoltingChoiceDto } from "./dto";

type BoltingValues = Pick<BoltingChoiceDto, "name" | "modulusMpa" | "ranges" | "source" | "edition">;

/** The stored values of one bolting row, ranges in ascending order of size. */
export function stockedMaterialOf(row: BoltingValues): StockedBoltMaterial {
  return {
    name: row.name,
    modulusMpa: row.modulusMpa,
    ranges: sortedStrengthRanges(row.ranges),
    source: row.source,
    edition: row.edition,
  };
}

/**
 * What the search is offered for listed rows: an organisation's row as a stocked row under its
 * Stockroom id ("org:<uuid>"), a built-in row as its catalogue id.
 */
export function searchMaterialsOf(
  rows: (BoltingValues & Pick<BoltingChoiceDto, "id" | "origin" | "rowId">)[],
): {
  materialIds: string[];
  stockedBolting: StockedBoltingRow[];
} {
  const stockedBolting = rows
    .filter((r) => r.origin === "organization")
    .map((r) => ({ id: r.id, material: stockedMaterialOf(r) }));
  return {
    materialIds: rows.map((r) => (r.origin === "organization" ? r.id : r.rowId)),
    stockedBolting,
  };
}

/**
 * The lines of a `stockroom-bolting.csv` (one size range each) as materials: lines of one name
 * (case ignored, as the intake merges them) form one row, named and sourced by its first line,
 * with the id "csv:<first line>".
 */
export function stockedRowsFromCsv(inputs: { line: number; input: BoltingInput }[]): StockedBoltingRow[] {
  const groups = new Map<string, { line: number; input: BoltingInput }[]>();
  for (const x of inputs) {
    const key = x.input.name.toLowerCase();
    groups.set(key, [...(groups.get(key) ?? []), x]);
  }
  return [...groups.values()].map((lines) => {
    const first = lines[0].input;
    return {
      id: `csv:${lines[0].line}`,
      material: stockedMaterialOf({
        name: first.name,
        modulusMpa: first.modulus_mpa,
        source: first.source,
        edition: first.edition,
        ranges: lines.map(({ input: r }) => ({
          maxDiameterMm: r.max_diameter_mm,
          proofMpa: r.proof_mpa,
          yieldMpa: r.yield_mpa,
          tensileMpa: r.tensile_mpa,
          allowableMpa: r.allowable_mpa,
        })),
      }),
    };
  });
}
