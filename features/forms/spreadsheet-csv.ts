// Reading CSV files as spreadsheet programs write them, shared by every CSV intake (the Drawing
// intake's bolt positions and the Stockroom's CSV intake). Pure and browser-safe.
// - Encoding: UTF-8 (with or without BOM), UTF-16 with BOM, else Windows-1252 (the usual "ANSI"
//   export); a file that is none of these, or already holds U+FFFD, is refused: nothing damaged is
//   ever stored.
// - Delimiter: `,`, `;` or tab, from the header line (Excel's `sep=` first line is honoured). With
//   `;` or tab, decimal commas in number cells are read ("12,5" → 12.5, "1.234,5" → 1234.5).
// - Cells the writers neutralised against formula injection (a leading `'` before = + - @ tab CR)
//   are read back to their original text (`restoreCsvText`, the exact inverse of our writers).
import { parse } from "csv-parse/sync";
import { restoreCsvText } from "./csv-cells";

export type CsvEncoding = "UTF-8" | "UTF-8 with BOM" | "UTF-16 LE" | "UTF-16 BE" | "Windows-1252";
export type CsvDelimiter = "," | ";" | "\t";

export interface SpreadsheetCsv {
  /** Header first; cells trimmed and un-neutralised. */
  records: string[][];
  /** File line of each record (1-based), for messages. */
  lines: number[];
  encoding: CsvEncoding;
  delimiter: CsvDelimiter;
  /** True when number cells may use a decimal comma (the delimiter is not a comma). */
  decimalComma: boolean;
}

export type SpreadsheetCsvResult = ({ ok: true } & SpreadsheetCsv) | { ok: false; message: string };

// Windows-1252 bytes 0x80–0x9F; the five undefined ones are absent.
const CP1252_HIGH: Record<number, number> = {
  0x80: 0x20ac,
  0x82: 0x201a,
  0x83: 0x0192,
  0x84: 0x201e,
  0x85: 0x2026,
  0x86: 0x2020,
  0x87: 0x2021,
  0x88: 0x02c6,
  0x89: 0x2030,
  0x8a: 0x0160,
  0x8b: 0x2039,
  0x8c: 0x0152,
  0x8e: 0x017d,
  0x91: 0x2018,
  0x92: 0x2019,
  0x93: 0x201c,
  0x94: 0x201d,
  0x95: 0x2022,
  0x96: 0x2013,
  0x97: 0x2014,
  0x98: 0x02dc,
  0x99: 0x2122,
  0x9a: 0x0161,
  0x9b: 0x203a,
  0x9c: 0x0153,
  0x9e: 0x017e,
  0x9f: 0x0178,
};

export const DELIMITER_NAMES: Record<CsvDelimiter, string> = { ",": "comma", ";": "semicolon", "\t": "tab" };

function lineOfOffset(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < bytes.length; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

/** Text of a CSV file, or a refusal that says why. */
export function decodeCsvBytes(
  bytes: Uint8Array,
): { ok: true; text: string; encoding: CsvEncoding } | { ok: false; message: string } {
  let text: string;
  let encoding: CsvEncoding;
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) {
    encoding = "UTF-8 with BOM";
    try {
      text = new TextDecoder("utf-8", { fatal: true }).decode(bytes.subarray(3));
    } catch {
      return {
        ok: false,
        message: "The file starts with a UTF-8 mark but is not valid UTF-8; save it again as UTF-8.",
      };
    }
  } else if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    encoding = bytes[0] === 0xff ? "UTF-16 LE" : "UTF-16 BE";
    text = new TextDecoder(bytes[0] === 0xff ? "utf-16le" : "utf-16be").decode(bytes.subarray(2));
  } else {
    try {
      text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
      encoding = "UTF-8";
    } catch {
      let out = "";
      for (let i = 0; i < bytes.length; i++) {
        const b = bytes[i];
        if (b < 0x80 || b >= 0xa0) out += String.fromCharCode(b);
        else if (CP1252_HIGH[b]) out += String.fromCharCode(CP1252_HIGH[b]);
        else
          return {
            ok: false,
            message: `The file is neither UTF-8 nor Windows-1252 (byte 0x${b.toString(16).toUpperCase()} on line ${lineOfOffset(bytes, i)}). Save it as CSV UTF-8.`,
          };
      }
      text = out;
      encoding = "Windows-1252";
    }
  }
  const bad = text.indexOf("\uFFFD");
  if (bad >= 0)
    return {
      ok: false,
      message: `Line ${text.slice(0, bad).split("\n").length} holds the replacement character "\uFFFD": the text was already damaged by an earlier conversion. Fix the cell (for example "°C") and save again.`,
    };
  return { ok: true, text, encoding };
}

/** Counts a character outside double quotes on one line. */
function countOutsideQuotes(line: string, ch: string): number {
  let n = 0;
  let quoted = false;
  for (const c of line) {
    if (c === '"') quoted = !quoted;
    else if (c === ch && !quoted) n++;
  }
  return n;
}

/** The delimiter of a CSV text: the one that splits the header into the most cells, consistently. */
export function sniffDelimiter(text: string): { delimiter: CsvDelimiter; skipFirstLine: boolean } {
  const lines = text.split(/\r\n|\n|\r/).filter((l) => l.trim() !== "");
  const sep = /^sep=(.)\s*$/i.exec(lines[0] ?? "");
  if (sep && (sep[1] === "," || sep[1] === ";" || sep[1] === "\t"))
    return { delimiter: sep[1] as CsvDelimiter, skipFirstLine: true };
  const sample = lines.slice(0, 6);
  let best: { delimiter: CsvDelimiter; score: number } = { delimiter: ",", score: -1 };
  for (const d of [",", ";", "\t"] as CsvDelimiter[]) {
    const counts = sample.map((l) => countOutsideQuotes(l, d));
    if (counts[0] === 0) continue;
    const consistent = counts.filter((c) => c === counts[0]).length;
    const score = consistent * 1000 + counts[0];
    if (score > best.score) best = { delimiter: d, score };
  }
  return { delimiter: best.delimiter, skipFirstLine: false };
}

/** A cell as it was before our writers prefixed `'` against formula injection (`restoreCsvText`). */
export const unneutralise = restoreCsvText;

/**
 * A number cell in the file's convention to the plain form `Number()` reads: with decimal commas
 * "12,5" → "12.5" and "1.234,5" → "1234.5" (thin and plain spaces as thousands separators go too).
 * Cells that are not numbers come back unchanged, so the schema names them.
 */
export function normaliseNumberCell(raw: string, decimalComma: boolean): string {
  const t = raw.trim();
  if (!decimalComma) return t;
  const s = t.replace(/[\u202f\u00a0 ]/g, "");
  if (/^[+-]?\d{1,3}(\.\d{3})+(,\d+)?$/.test(s)) return s.replace(/\./g, "").replace(",", ".");
  if (/^[+-]?\d*,\d+$/.test(s) || /^[+-]?\d+,$/.test(s)) return s.replace(",", ".");
  return t;
}

/** Decodes, sniffs and parses a CSV file (bytes as uploaded, or text already decoded). */
export function readSpreadsheetCsv(input: Uint8Array | string): SpreadsheetCsvResult {
  let text: string;
  let encoding: CsvEncoding;
  if (typeof input === "string") {
    if (input.includes("\uFFFD"))
      return decodeCsvBytes(new TextEncoder().encode(input)) as { ok: false; message: string };
    text = input.replace(/^\uFEFF/, "");
    encoding = input.startsWith("\uFEFF") ? "UTF-8 with BOM" : "UTF-8";
  } else {
    const d = decodeCsvBytes(input);
    if (!d.ok) return d;
    text = d.text.replace(/^\uFEFF/, "");
    encoding = d.encoding;
  }
  const { delimiter, skipFirstLine } = sniffDelimiter(text);
  let records: string[][];
  let info: { lines: number }[];
  try {
    const out = parse(text, {
      delimiter,
      skip_empty_lines: true,
      trim: true,
      relax_column_count: true,
      from_line: skipFirstLine ? 2 : 1,
      info: true,
    }) as unknown as { record: string[]; info: { lines: number } }[]; // csv-parse's types omit `info: true`
    records = out.map((r) => r.record.map(unneutralise));
    info = out.map((r) => r.info);
  } catch (err) {
    const e = err as Error & { lines?: number };
    return {
      ok: false,
      message: `The file could not be read as CSV with ${DELIMITER_NAMES[delimiter]} (${JSON.stringify(delimiter)}) as the delimiter${e.lines ? ` (line ${e.lines})` : ""}: ${e.message.replace(/^[A-Za-z_ ]*:\s*/, "")}`,
    };
  }
  // Drop rows a spreadsheet leaves behind with only empty cells (";;;;").
  const keep = records.map((r) => r.some((c) => c !== ""));
  return {
    ok: true,
    records: records.filter((_, i) => keep[i]),
    lines: info.filter((_, i) => keep[i]).map((x) => x.lines),
    encoding,
    delimiter,
    decimalComma: delimiter !== ",",
  };
}

/** "semicolon-separated, Windows-1252, decimal commas": what the reader took the file to be. */
export function describeCsvFormat(
  csv: Pick<SpreadsheetCsv, "delimiter" | "encoding" | "decimalComma">,
): string {
  return `${DELIMITER_NAMES[csv.delimiter]}-separated, ${csv.encoding}${csv.decimalComma ? ", decimal commas accepted" : ""}`;
}
