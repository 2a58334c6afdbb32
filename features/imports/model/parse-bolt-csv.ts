// Bolt positions from a CSV file: a header row naming the x and y columns and optionally the hole
// diameter. Accepted headers: `x`, `y`, `d` (in the unit chosen on the form), and Sealpitch's own
// hole list (`x_mm`, `y_mm`, `hole_diameter_mm`, or the `_in` columns), whose unit is in the
// header. Other columns (number, id, angle…) are ignored. Delimiter, encoding and decimal commas
// as spreadsheets write them (spreadsheet-csv.ts). Every bad row is reported by its line number
// and column, and one bad row fails the whole file.
import type { ImportedHole } from "./parse-dxf-flange";
import {
  DELIMITER_NAMES,
  describeCsvFormat,
  normaliseNumberCell,
  readSpreadsheetCsv,
} from "@/features/forms/spreadsheet-csv";

export interface CsvRowError {
  line: number;
  field: string;
  message: string;
}

export type BoltCsvResult =
  | { ok: true; holes: ImportedHole[]; unitFromHeader: "mm" | "in" | null; format: string }
  | { ok: false; message: string; rowErrors: CsvRowError[] };

const COLUMNS = {
  plain: { x: "x", y: "y", d: "d" },
  mm: { x: "x_mm", y: "y_mm", d: "hole_diameter_mm" },
  in: { x: "x_in", y: "y_in", d: "hole_diameter_in" },
} as const;

export function parseBoltCsv(
  input: Uint8Array | string,
  options: { unit?: "mm" | "in"; defaultDiameterMm?: number } = {},
): BoltCsvResult {
  const csv = readSpreadsheetCsv(input);
  if (!csv.ok) return { ok: false, message: csv.message, rowErrors: [] };
  const [head, ...body] = csv.records;
  if (!head || body.length === 0) return { ok: false, message: "The CSV has no bolt rows.", rowErrors: [] };
  const header = head.map((c) => c.trim().toLowerCase());
  const style = (["plain", "mm", "in"] as const).find(
    (s) => header.includes(COLUMNS[s].x) && header.includes(COLUMNS[s].y),
  );
  if (!style) {
    return {
      ok: false,
      message: `The CSV needs a header row with columns x and y (and optionally d), or a Sealpitch hole list (x_mm, y_mm, hole_diameter_mm or x_in, y_in, hole_diameter_in). Its header reads: ${header.join(", ")} (${DELIMITER_NAMES[csv.delimiter]}-separated).`,
      rowErrors: [],
    };
  }
  const cols = COLUMNS[style];
  const unit = style === "plain" ? (options.unit ?? "mm") : style;
  const k = unit === "in" ? 25.4 : 1;
  const at = (name: string) => header.indexOf(name);
  const rowErrors: CsvRowError[] = [];
  const holes: ImportedHole[] = [];
  body.forEach((record, i) => {
    const line = csv.lines[i + 1];
    const num = (field: string, required: boolean): number | null => {
      const raw = record[at(field)] ?? "";
      if (raw === "") {
        if (required) rowErrors.push({ line, field, message: `row ${line}: ${field} is missing` });
        return null;
      }
      const v = Number(normaliseNumberCell(raw, csv.decimalComma));
      if (!Number.isFinite(v)) {
        rowErrors.push({ line, field, message: `row ${line}: ${field} "${raw}" is not a number` });
        return null;
      }
      return v;
    };
    const x = num(cols.x, true);
    const y = num(cols.y, true);
    const d = at(cols.d) >= 0 ? num(cols.d, false) : null;
    if (d !== null && d <= 0)
      rowErrors.push({ line, field: cols.d, message: `row ${line}: ${cols.d} must be greater than 0` });
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
  return {
    ok: true,
    holes,
    unitFromHeader: style === "plain" ? null : style,
    format: describeCsvFormat(csv),
  };
}
