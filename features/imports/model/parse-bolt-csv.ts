// Bolt positions from a CSV file: a header row with columns x, y and optionally d (hole
// diameter), in mm (or inches with `unit: "in"`). Every bad row is reported by its line number
// and column, and one bad row fails the whole file.
import { parse } from "csv-parse/sync";
import type { ImportedHole, ParseResult } from "./parse-dxf-flange";

export interface CsvRowError {
  line: number;
  field: string;
  message: string;
}

export type BoltCsvResult =
  { ok: true; holes: ImportedHole[] } | { ok: false; message: string; rowErrors: CsvRowError[] };

export function parseBoltCsv(
  text: string,
  options: { unit?: "mm" | "in"; defaultDiameterMm?: number } = {},
): BoltCsvResult {
  const k = options.unit === "in" ? 25.4 : 1;
  let records: Record<string, string>[];
  try {
    records = parse(text, {
      columns: (h: string[]) => h.map((c) => c.trim().toLowerCase()),
      skip_empty_lines: true,
      trim: true,
      bom: true,
    });
  } catch (err) {
    return { ok: false, message: `The CSV could not be read: ${(err as Error).message}`, rowErrors: [] };
  }
  if (records.length === 0) return { ok: false, message: "The CSV has no bolt rows.", rowErrors: [] };
  const header = Object.keys(records[0]);
  if (!header.includes("x") || !header.includes("y")) {
    return {
      ok: false,
      message: "The CSV needs a header row with columns x and y (and optionally d).",
      rowErrors: [],
    };
  }
  const rowErrors: CsvRowError[] = [];
  const holes: ImportedHole[] = [];
  records.forEach((r, i) => {
    const line = i + 2; // line 1 is the header
    const num = (field: string, required: boolean): number | null => {
      const raw = r[field];
      if (raw === undefined || raw === "") {
        if (required) rowErrors.push({ line, field, message: `row ${line}: ${field} is missing` });
        return null;
      }
      const v = Number(raw);
      if (!Number.isFinite(v)) {
        rowErrors.push({ line, field, message: `row ${line}: ${field} "${raw}" is not a number` });
        return null;
      }
      return v;
    };
    const x = num("x", true);
    const y = num("y", true);
    const d = header.includes("d") ? num("d", false) : null;
    if (d !== null && d <= 0)
      rowErrors.push({ line, field: "d", message: `row ${line}: d must be greater than 0` });
    if (x !== null && y !== null)
      holes.push({
        xMm: x * k,
        yMm: y * k,
        diameterMm: d !== null ? d * k : (options.defaultDiameterMm ?? 0),
      });
  });
  if (rowErrors.length > 0) return { ok: false, message: rowErrors[0].message, rowErrors };
  if (holes.length < 2)
    return { ok: false, message: "The CSV needs at least two bolt positions.", rowErrors: [] };
  return { ok: true, holes };
}

export type { ParseResult };
