// Parsing and writing Stockroom CSV files. Pure: the preview and the commit both call
// `parseLibraryCsv`, so what the user previewed is exactly what is validated again on commit.
import { parse } from "csv-parse/sync";
import { z } from "zod";
import { restoreCsvText, stringifyCsv } from "@/features/forms/csv-cells";
import {
  boltingInputSchema,
  flangeInputSchema,
  gasketInputSchema,
  type BoltingInput,
  type FlangeInput,
  type GasketInput,
} from "../schema";
import { CSV_COLUMNS, REQUIRED_COLUMNS } from "./csv-columns";
import type { BoltingChoiceDto, FlangeTemplateChoiceDto, GasketChoiceDto, LibraryKind } from "./dto";

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
  | { ok: true; rows: CsvPreviewRow[]; inputs: { line: number; input: InputOf<K> }[] }
  | { ok: false; message: string; rows: CsvPreviewRow[]; errors: CsvFieldError[] };

const SCHEMAS = {
  gasket: gasketInputSchema,
  bolting: boltingInputSchema,
  flange: flangeInputSchema,
} as const;
export const MAX_CSV_ROWS = 2000;

export function describeCsvError(e: CsvFieldError): string {
  return `Row ${e.line}, field ${e.field}: ${e.message}`;
}

export function parseLibraryCsv<K extends LibraryKind>(kind: K, text: string): ParsedLibraryCsv<K> {
  let records: string[][];
  try {
    records = parse(text, { skip_empty_lines: true, trim: true, bom: true, relax_column_count: true });
  } catch (err) {
    return {
      ok: false,
      message: `The file could not be read as CSV: ${(err as Error).message}`,
      rows: [],
      errors: [],
    };
  }
  if (records.length < 2)
    return { ok: false, message: "The file has no rows under its header.", rows: [], errors: [] };
  const header = records[0].map((h) => h.trim().toLowerCase());
  const missing = REQUIRED_COLUMNS[kind].filter((c) => !header.includes(c));
  if (missing.length > 0)
    return {
      ok: false,
      message: `The header is missing the column(s): ${missing.join(", ")}.`,
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

  const schema = SCHEMAS[kind] as unknown as z.ZodType<InputOf<K>>;
  const rows: CsvPreviewRow[] = [];
  const inputs: { line: number; input: InputOf<K> }[] = [];
  const seen = new Map<string, number>();
  records.slice(1).forEach((record, i) => {
    const line = i + 2;
    const cells = Object.fromEntries(header.map((h, j) => [h, restoreCsvText(record[j] ?? "")]));
    const errors: CsvFieldError[] = [];
    if (record.length > header.length)
      errors.push({
        line,
        field: "(row)",
        message: `has ${record.length} cells, the header has ${header.length}`,
      });
    const result = schema.safeParse(cells);
    if (!result.success) {
      for (const [field, messages] of Object.entries(
        z.flattenError(result.error).fieldErrors as Record<string, string[]>,
      )) {
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
    rows.push({ line, cells, errors });
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
  return { ok: true, rows, inputs };
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

export function gasketsToCsv(rows: GasketChoiceDto[]): string {
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
    { header: true, columns: [...CSV_COLUMNS.gasket] },
  );
}

export function boltingToCsv(rows: BoltingChoiceDto[]): string {
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
    { header: true, columns: [...CSV_COLUMNS.bolting] },
  );
}

export function flangesToCsv(rows: FlangeTemplateChoiceDto[]): string {
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
    { header: true, columns: [...CSV_COLUMNS.flange] },
  );
}
