// CSV columns of each Stockroom table: the import reads them, the export writes them, in this
// order. The names are the schema field names (features/library/schema.ts), so a validation
// error names the column as the user sees it in the file.
import type { LibraryKind } from "./dto";

export const CSV_COLUMNS: Record<LibraryKind, readonly string[]> = {
  gasket: [
    "name",
    "gasket_type",
    "m",
    "y_mpa",
    "qmin_l1",
    "qsmin_l1",
    "qmin_l01",
    "qsmin_l01",
    "qmin_l001",
    "qsmin_l001",
    "qsmax_mpa",
    "pqr",
    "eg_mpa",
    "modulus_mpa",
    "thickness_mm",
    "source",
    "edition",
  ],
  // One line per size range; lines with the same name form one material.
  bolting: [
    "name",
    "modulus_mpa",
    "max_diameter_mm",
    "proof_mpa",
    "yield_mpa",
    "tensile_mpa",
    "allowable_mpa",
    "source",
    "edition",
  ],
  flange: [
    "standard",
    "pressure_class",
    "size",
    "outside_diameter_mm",
    "bore_diameter_mm",
    "bolt_circle_diameter_mm",
    "bolt_count",
    "bolt_designation",
    "bolt_diameter_mm",
    "hole_diameter_mm",
    "source",
    "edition",
  ],
};

export const REQUIRED_COLUMNS: Record<LibraryKind, readonly string[]> = {
  gasket: ["name", "gasket_type", "m", "y_mpa", "modulus_mpa", "thickness_mm", "source"],
  bolting: ["name", "modulus_mpa", "max_diameter_mm", "yield_mpa", "tensile_mpa", "source"],
  // Every flange column but the bore and the edition.
  flange: CSV_COLUMNS.flange.filter((c) => c !== "bore_diameter_mm" && c !== "edition"),
};

export const KIND_LABELS: Record<LibraryKind, { plural: string; file: string }> = {
  gasket: { plural: "gaskets", file: "stockroom-gaskets.csv" },
  bolting: { plural: "bolting materials", file: "stockroom-bolting.csv" },
  flange: { plural: "flange templates", file: "stockroom-flanges.csv" },
};

/** Columns that hold text; every other column is a number (decimal commas are read there only). */
export const TEXT_COLUMNS: Record<LibraryKind, readonly string[]> = {
  gasket: ["name", "gasket_type", "source", "edition"],
  bolting: ["name", "source", "edition"],
  flange: ["standard", "pressure_class", "size", "bolt_designation", "source", "edition"],
};
