import "server-only";
import { readFileSync } from "node:fs";
import path from "node:path";
import * as fontkit from "fontkit";

// Complete TrueType files shipped in ./fonts (see its README for where they come from): IBM Plex
// Sans for text, DejaVu Sans Mono for figures. Both cover the Greek letters and maths signs the
// core writes (π, Σ, λ, ≥, ≤, ≈, √, ², µ, ±, Ø), so the sheet prints them as themselves.
const FILES = {
  sans: "IBMPlexSans-Regular.ttf",
  sansBold: "IBMPlexSans-SemiBold.ttf",
  mono: "DejaVuSansMono.ttf",
  monoBold: "DejaVuSansMono-Bold.ttf",
} as const;

export type SheetFont = keyof typeof FILES;

/** When a string has a character its face lacks, the next face of the same weight that has them all. */
const FALLBACK: Record<SheetFont, SheetFont> = {
  sans: "mono",
  sansBold: "monoBold",
  mono: "sans",
  monoBold: "sansBold",
};

const FONT_DIR = path.join(process.cwd(), "features", "exports", "sheet", "fonts");

let cache: Record<SheetFont, fontkit.Font> | undefined;

/**
 * The parsed fonts, read and parsed once per process. Parsing is most of the cost of a small
 * sheet (about 160 ms a document), and pdfkit's `registerFont` takes a parsed fontkit font as its
 * source, so every document shares these (each document still embeds its own subset).
 */
export function getSheetFonts(): Record<SheetFont, fontkit.Font> {
  if (cache) return cache;
  const parse = (file: string): fontkit.Font => {
    const font = fontkit.create(readFileSync(path.join(FONT_DIR, file)));
    if (!("glyphForCodePoint" in font)) throw new Error(`${file}: a font collection, not one font`);
    return font;
  };
  cache = Object.fromEntries(Object.entries(FILES).map(([k, f]) => [k, parse(f)])) as Record<
    SheetFont,
    fontkit.Font
  >;
  return cache;
}

const covers = (font: fontkit.Font, s: string): boolean => {
  for (const ch of s) {
    const cp = ch.codePointAt(0)!;
    if (cp >= 0x20 && !font.hasGlyphForCodePoint(cp)) return false;
  }
  return true;
};

/**
 * The face to draw `text` in: `wanted` when it has every character, else its fallback when that
 * has them all, else `wanted` again. Example: `fontFor("sans", "|r| ≲ π/4")` → "mono" (Plex Sans
 * has no ≲); `fontFor("sans", "Ab ≥ Am")` → "sans".
 */
export function fontFor(wanted: SheetFont, text: string): SheetFont {
  const fonts = getSheetFonts();
  if (covers(fonts[wanted], text)) return wanted;
  return covers(fonts[FALLBACK[wanted]], text) ? FALLBACK[wanted] : wanted;
}

/**
 * `text` with each character that no sheet face can draw (for example CJK in a design name)
 * written as "?", so nothing vanishes silently; every other character is kept as it is.
 */
export function printable(text: string): string {
  const fonts = Object.values(getSheetFonts());
  let out = "";
  for (const ch of text) out += fonts.some((f) => covers(f, ch)) ? ch : "?";
  return out;
}
