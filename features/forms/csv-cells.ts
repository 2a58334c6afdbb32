// CSV files we write are opened in spreadsheets, which run a cell that starts with =, +, -, @, tab
// or carriage return as a formula (CSV / formula injection). Following OWASP's CSV Injection
// guidance, every such text cell is written with a leading single quote, which spreadsheets show as
// text and do not run; csv-stringify quotes cells that hold the delimiter or quotes. One helper for
// every CSV the app writes (the hole list, the Stockroom exports), and its inverse for the CSV intake
// so that the app reads its own exports back unchanged.
//
// What is neutralised: text cells only. Numbers (JavaScript numbers, and text that is exactly a
// decimal number such as "-12.5" or "1e-3", which is how the hole list writes coordinates) stay as
// written, so numeric columns remain numbers in a spreadsheet and in our intake; a bare number is
// not a formula. A text cell that already starts with quotes followed by a trigger character gets one
// more quote, so the round trip is exact for every value: restoreCsvText(neutralizeCsvText(v)) === v.
import { stringify, type Options } from "csv-stringify/sync";

const NEEDS_QUOTE = /^'*[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** The text as written into a CSV cell: a leading quote when a spreadsheet would run it. */
export function neutralizeCsvText(value: string): string {
  if (PLAIN_NUMBER.test(value)) return value;
  return NEEDS_QUOTE.test(value) ? `'${value}` : value;
}

/** The inverse, for reading a cell of a file we wrote (hand-made cells without the quote pass as they are). */
export function restoreCsvText(cell: string): string {
  return cell.startsWith("'") && NEEDS_QUOTE.test(cell.slice(1)) && !PLAIN_NUMBER.test(cell.slice(1))
    ? cell.slice(1)
    : cell;
}

export type CsvCell = string | number | null | undefined;

/** csv-stringify with every text cell neutralised; null and undefined become empty cells. */
export function stringifyCsv(records: readonly (readonly CsvCell[])[], options: Options = {}): string {
  const safe = records.map((record) =>
    record.map((value) =>
      value === null || value === undefined
        ? ""
        : typeof value === "string"
          ? neutralizeCsvText(value)
          : value,
    ),
  );
  return stringify(safe, options);
}
