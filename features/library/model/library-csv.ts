// Parsing and writing Stockroom CSV files. Pure: the preview and the commit both call
// `parseLibraryCsv`, so what the user previewed is exactly what is validated again on commit.
import { z } from "zod";
import { stringifyCsv } from "@/features/forms/csv-cells";
import {
  boltingInputSchema,
  flangeInputSchema,
  gasketInputSchema,
  type BoltingInput,
  type FlangeInput,
  type GasketInput,
} from "../schema";
import { describeCsvFormat, normaliseNumberCell, readSpreadsheetCsv } from "@/features/forms/spreadsheet-csv";
import { CSV_COLUMNS, REQUIRED_COLUMNS, TEXT_COLUMNS } from "./csv-columns";
import type { BoltingChoiceDto, FlangeTemplateChoiceDto, GasketChoiceDto, LibraryKind } from "./dto";
import { fieldErrorsOf } from "@/features/forms/form-data";

export interface CsvFieldError {
  /** Line in the file (line 1 is the header). */
  line: number;
  field: string;
  message: string;
}

export interface CsvPreviewRow {
  line: number;
  cells: Record<string, string>;
  errors: CsvFieldError[];
}

type InputOf<K extends LibraryKind> = K extends "gasket"
  ? GasketInput
  : K extends "bolting"
    ? BoltingInput
    : FlangeInput;

export type ParsedLibraryCsv<K extends LibraryKind> =
  | { ok: true; rows: CsvPreviewRow[]; inputs: { line: number; input: InputOf<K> }[]; format: string }
  | { ok: false; message: string; rows: CsvPreviewRow[]; errors: CsvFieldError[] };

/** "add": every row is new (a name already in the Stockroom is refused); "update": rows whose name
 *  (flange templates: standard, class and size) is already in the Stockroom replace that row. */
export type CsvImportMode = "add" | "update";

/** What one row of the Stockroom becomes: the file lines it is made of and whether it is new. */
export interface CsvPlanItem {
  label: string;
  lines: number[];
  action: "add" | "update";
}

export interface CsvImportPlan {
  mode: CsvImportMode;
  format: string;
  added: number;
  updated: number;
  /** Bolting: lines of one name that become one material with one size range per line. */
  merged: { label: string; lines: number[] }[];
  items: CsvPlanItem[];
  /** The plan in words, e.g. "2 to add, 1 to update; lines 2–3 (Halden B7) merge into 1 bolting material". */
  summary: string;
}

const SCHEMAS: { [K in LibraryKind]: z.ZodType<InputOf<K>> } = {
  gasket: gasketInputSchema,
  bolting: boltingInputSchema,
  flange: flangeInputSchema,
};
export const MAX_CSV_ROWS = 2000;

export function describeCsvError(e: CsvFieldError): string {
  return `Row ${e.line}, field ${e.field}: ${e.message}`;
}

/**
 * Reads a Stockroom CSV as spreadsheets write it (bytes as uploaded, or text): delimiter, encoding
 * and decimal commas are detected (`readSpreadsheetCsv`); a file that cannot be decoded without
 * loss is refused as a whole.
 */
export function parseLibraryCsv<K extends LibraryKind>(
  kind: K,
  input: Uint8Array | string,
): ParsedLibraryCsv<K> {
  const csv = readSpreadsheetCsv(input);
  if (!csv.ok) return { ok: false, message: `${csv.message} Nothing was imported.`, rows: [], errors: [] };
  const records = csv.records;
  if (records.length < 2)
    return { ok: false, message: "The file has no rows under its header.", rows: [], errors: [] };
  const header = records[0].map((h) => h.trim().toLowerCase());
  const missing = REQUIRED_COLUMNS[kind].filter((c) => !header.includes(c));
  if (missing.length > 0)
    return {
      ok: false,
      message: `The header is missing the column(s): ${missing.join(", ")}. It was read as ${describeCsvFormat(csv)}, with the columns: ${header.join(" | ")}.`,
      rows: [],
      errors: [],
    };
  const unknown = header.filter((h) => !CSV_COLUMNS[kind].includes(h));
  if (unknown.length > 0)
    return {
      ok: false,
      message: `Unknown column(s): ${unknown.join(", ")}. Expected: ${CSV_COLUMNS[kind].join(", ")}.`,
      rows: [],
      errors: [],
    };
  if (records.length - 1 > MAX_CSV_ROWS)
    return {
      ok: false,
      message: `The file has more than ${MAX_CSV_ROWS} rows; split it.`,
      rows: [],
      errors: [],
    };

  const schema: z.ZodType<InputOf<K>> = SCHEMAS[kind];
  const rows: CsvPreviewRow[] = [];
  const inputs: { line: number; input: InputOf<K> }[] = [];
  const seen = new Map<string, number>();
  const textColumns = new Set(TEXT_COLUMNS[kind]);
  records.slice(1).forEach((record, i) => {
    const line = csv.lines[i + 1];
    const values = Object.fromEntries(
      header.map((h, j) => [
        h,
        textColumns.has(h) ? (record[j] ?? "") : normaliseNumberCell(record[j] ?? "", csv.decimalComma),
      ]),
    );
    const errors: CsvFieldError[] = [];
    if (record.length > header.length)
      errors.push({
        line,
        field: "(row)",
        message: `has ${record.length} cells, the header has ${header.length}`,
      });
    const result = schema.safeParse(values);
    if (!result.success) {
      for (const [field, messages] of Object.entries(fieldErrorsOf(result.error))) {
        errors.push({ line, field, message: messages[0] });
      }
    } else {
      const key = duplicateKey(kind, result.data);
      const earlier = seen.get(key);
      if (earlier !== undefined)
        errors.push({ line, field: kind === "flange" ? "size" : "name", message: `repeats row ${earlier}` });
      else seen.set(key, line);
      if (errors.length === 0) inputs.push({ line, input: result.data });
    }
    rows.push({ line, cells: values, errors });
  });
  const errors = rows.flatMap((r) => r.errors);
  if (errors.length > 0) {
    const more =
      errors.length > 1 ? ` (and ${errors.length - 1} more problem${errors.length > 2 ? "s" : ""})` : "";
    return {
      ok: false,
      message: `${describeCsvError(errors[0])}${more}. Nothing was imported.`,
      rows,
      errors,
    };
  }
  return { ok: true, rows, inputs, format: describeCsvFormat(csv) };
}

// Bolting lines repeat a name on purpose (one line per size range); the same range twice is the duplicate.
function duplicateKey(kind: LibraryKind, input: GasketInput | BoltingInput | FlangeInput): string {
  if (kind === "bolting") {
    const b = input as BoltingInput;
    return `${b.name.toLowerCase()}|${b.max_diameter_mm}`;
  }
  if (kind === "flange") {
    const f = input as FlangeInput;
    return `${f.standard}|${f.pressure_class}|${f.size}`.toLowerCase();
  }
  return (input as GasketInput).name.toLowerCase();
}

/**
 * "plain": UTF-8 without BOM, LF line ends (for scripts and version control). "spreadsheet": UTF-8
 * with BOM and CRLF, which spreadsheet programs open directly with °, µ and other signs intact.
 * Both neutralise formula cells (`stringifyCsv`); the intake reads them back unchanged.
 */
export type CsvVariant = "plain" | "spreadsheet";
const variantOptions = (variant: CsvVariant) =>
  variant === "spreadsheet" ? { bom: true, record_delimiter: "windows" as const } : {};

export function gasketsToCsv(rows: GasketChoiceDto[], variant: CsvVariant = "plain"): string {
  return stringifyCsv(
    rows.map((g) => [
      g.name,
      g.gasketType,
      g.m,
      g.yMpa,
      g.tightness["L1.0"]?.qMinMpa,
      g.tightness["L1.0"]?.qsMinMpa,
      g.tightness["L0.1"]?.qMinMpa,
      g.tightness["L0.1"]?.qsMinMpa,
      g.tightness["L0.01"]?.qMinMpa,
      g.tightness["L0.01"]?.qsMinMpa,
      g.qsMaxMpa,
      g.pqr,
      g.egMpa,
      g.modulusMpa,
      g.thicknessMm,
      g.source,
      g.edition,
    ]),
    { header: true, columns: [...CSV_COLUMNS.gasket], ...variantOptions(variant) },
  );
}

export function boltingToCsv(rows: BoltingChoiceDto[], variant: CsvVariant = "plain"): string {
  return stringifyCsv(
    rows.flatMap((b) =>
      b.ranges.map((r) => [
        b.name,
        b.modulusMpa,
        r.maxDiameterMm,
        r.proofMpa,
        r.yieldMpa,
        r.tensileMpa,
        r.allowableMpa,
        b.source,
        b.edition,
      ]),
    ),
    { header: true, columns: [...CSV_COLUMNS.bolting], ...variantOptions(variant) },
  );
}

export function flangesToCsv(rows: FlangeTemplateChoiceDto[], variant: CsvVariant = "plain"): string {
  return stringifyCsv(
    rows.map((f) => [
      f.standard,
      f.pressureClass,
      f.size,
      f.outsideDiameterMm,
      f.boreDiameterMm,
      f.boltCircleDiameterMm,
      f.boltCount,
      f.boltDesignation,
      f.boltDiameterMm,
      f.holeDiameterMm,
      f.source,
      f.edition,
    ]),
    { header: true, columns: [...CSV_COLUMNS.flange], ...variantOptions(variant) },
  );
}
