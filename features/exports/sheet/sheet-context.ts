import "server-only";
import type { SheetUnits } from "./format";
import type { SheetInput } from "./sheet-input";
import { listUnverifiedValues, type UnverifiedValue } from "@/features/analysis/unverified-values";

// Colours of the product's tokens (tailwind.config.ts), so the sheet reads as Sealpitch's own.
export const C = {
  ink900: "#121a28",
  ink700: "#2b3850",
  ink500: "#4c5d7d",
  ink300: "#98a6bf",
  ink200: "#c3ccdb",
  ink100: "#e2e7ef",
  ink50: "#f3f5f8",
  steel100: "#eeeeea",
  brass50: "#fdf7ec",
  brass300: "#e7bd6e",
  brass500: "#c98d2b",
  brass700: "#845616",
  pass: "#2f7d4f",
  warn: "#a86a00",
  fail: "#b3261e",
  na: "#6b7c9c",
  passBg: "#e4f3ea",
  warnBg: "#fbf0d9",
  failBg: "#fbe4e2",
  naBg: "#eceff4",
} as const;

export const PAPER_SIZES = { a4: [595.28, 841.89], letter: [612, 792] } as const;

/** Page frame: outer margin, the title-block strip at the foot of every page. */
export const MARGIN = 22;
export const TITLE_BLOCK_H = 56;

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface SheetContext {
  doc: PDFKit.PDFDocument;
  input: SheetInput;
  u: SheetUnits;
  /** The document's name in the title strip's brand cell ("BOLT-SPACING SHEET", "PASS LOG"). */
  label: string;
  /** The stored result's unverified values (table values from memory), read once per sheet. */
  unverified: UnverifiedValue[];
  pageW: number;
  pageH: number;
  /** Where content may go on every page (inside the frame, above the title block). */
  content: { x0: number; x1: number; y0: number; y1: number };
  /** Current flow position. */
  y: number;
  newPage(): void;
  /** Starts a new page unless `h` points still fit below the cursor. */
  ensure(h: number): void;
}

export function createContext(
  doc: PDFKit.PDFDocument,
  input: SheetInput,
  u: SheetUnits,
  label = "BOLT-SPACING SHEET",
): SheetContext {
  const [pageW, pageH] = PAPER_SIZES[input.paper];
  const content = {
    x0: MARGIN + 10,
    x1: pageW - MARGIN - 10,
    y0: MARGIN + 10,
    y1: pageH - MARGIN - TITLE_BLOCK_H - 8,
  };
  const ctx: SheetContext = {
    doc,
    input,
    u,
    label,
    unverified: listUnverifiedValues(input.document, input.result),
    pageW,
    pageH,
    content,
    y: content.y0,
    newPage() {
      doc.addPage({ size: [pageW, pageH], margin: 0 });
      ctx.y = content.y0;
    },
    ensure(h: number) {
      if (ctx.y + h > content.y1) ctx.newPage();
    },
  };
  return ctx;
}

/** Section heading: a small brass rule and caps label. */
export function heading(ctx: SheetContext, text: string, note?: string): void {
  const { doc, content } = ctx;
  ctx.ensure(40);
  const y = ctx.y;
  doc.rect(content.x0, y + 1, 3, 10).fill(C.brass500);
  doc
    .font("sansBold")
    .fontSize(9.5)
    .fillColor(C.ink900)
    .text(text.toUpperCase(), content.x0 + 8, y, { lineBreak: false, characterSpacing: 0.6 });
  if (note) {
    const w = doc.widthOfString(text.toUpperCase(), { characterSpacing: 0.6 });
    doc
      .font("sans")
      .fontSize(7.5)
      .fillColor(C.ink500)
      .text(note, content.x0 + 16 + w, y + 2, { lineBreak: false });
  }
  ctx.y = y + 16;
}
