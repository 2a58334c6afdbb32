import "server-only";
import { readFileSync } from "node:fs";
import path from "node:path";
import PDFDocument from "pdfkit";
import { woffToSfnt } from "./woff";

// The sheet embeds the app's own IBM Plex files (the same the screens use). WOFF, not WOFF2:
// pdfkit's font loader (fontkit) crashes on WOFF2 files, and misreads the mono .woff, so each
// file is unpacked to a plain sfnt first (./woff.ts).
const FILES = {
  sans: "@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff",
  sansBold: "@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-normal.woff",
  mono: "@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-400-normal.woff",
  monoBold: "@fontsource/ibm-plex-mono/files/ibm-plex-mono-latin-600-normal.woff",
} as const;

export type SheetFont = keyof typeof FILES;

/** A parsed font as pdfkit accepts it in `registerFont` (fontkit's Font: anything with layout()). */
export type ParsedFont = { layout: (...args: unknown[]) => unknown };

let cache: Record<SheetFont, ParsedFont> | undefined;

/**
 * The parsed fonts, read and parsed once per process. Parsing the OpenType tables is most of the
 * cost of a small sheet, and pdfkit takes an already parsed font as a font source, so every
 * document shares these (each document still makes its own subset). The parsed object is taken
 * from a throw-away pdfkit document so that we need no direct dependency on fontkit.
 */
export function getSheetFonts(): Record<SheetFont, ParsedFont> {
  if (cache) return cache;
  const root = path.join(process.cwd(), "node_modules");
  const parse = (file: string): ParsedFont => {
    const sfnt = woffToSfnt(readFileSync(path.join(root, file)));
    const probe = new PDFDocument({ autoFirstPage: false, font: sfnt as unknown as string });
    return (probe as unknown as { _font: { font: ParsedFont } })._font.font;
  };
  cache = Object.fromEntries(Object.entries(FILES).map(([k, f]) => [k, parse(f)])) as Record<
    SheetFont,
    ParsedFont
  >;
  return cache;
}
