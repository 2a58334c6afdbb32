import "server-only";
import { fontFor, printable } from "./fonts";
import { C, type SheetContext } from "./sheet-context";

export interface Column {
  header: string;
  /** Share of the content width (the shares are normalised). */
  width: number;
  align?: "left" | "right" | "center";
  mono?: boolean;
  /** Long text that may wrap onto more lines (checks, sources). */
  wrap?: boolean;
}

export interface CellStyle {
  color?: string;
  fill?: string;
  bold?: boolean;
}

export type Cell = string | { text: string; style: CellStyle };

const ROW_H = 10.5;
const FONT = 6.9;
const PAD = 3;

/**
 * A ruled table that flows over pages: the header row is repeated on each new page with
 * "(continued)", rows never split. Sized for 100 rows and more (the 96-bolt table).
 */
export function drawTable(
  ctx: SheetContext,
  cols: Column[],
  rows: Cell[][],
  opts: { x?: number; width?: number; zebra?: boolean } = {},
): void {
  const { doc } = ctx;
  const x0 = opts.x ?? ctx.content.x0;
  const totalW = opts.width ?? ctx.content.x1 - x0;
  const share = cols.reduce((a, c) => a + c.width, 0);
  const widths = cols.map((c) => (c.width / share) * totalW);

  const header = (continued: boolean) => {
    const h = ROW_H + 2;
    doc.rect(x0, ctx.y, totalW, h).fill(C.ink900);
    let x = x0;
    doc
      .font("sansBold")
      .fontSize(FONT - 0.3)
      .fillColor("#ffffff");
    cols.forEach((c, i) => {
      const label = continued && i === 0 ? `${c.header} (cont.)` : c.header;
      doc.text(label, x + PAD, ctx.y + 3.2, {
        width: widths[i] - 2 * PAD,
        align: c.align ?? "left",
        lineBreak: false,
      });
      x += widths[i];
    });
    ctx.y += h;
  };

  ctx.ensure(ROW_H * 3);
  header(false);
  rows.forEach((row, r) => {
    let h = ROW_H;
    if (cols.some((c) => c.wrap)) {
      cols.forEach((c, i) => {
        if (!c.wrap) return;
        const cell = row[i];
        const text = printable(typeof cell === "string" ? cell : cell.text);
        doc.font(fontFor(c.mono ? "mono" : "sans", text)).fontSize(FONT);
        h = Math.max(h, doc.heightOfString(text, { width: widths[i] - 2 * PAD }) + 4);
      });
    }
    if (ctx.y + h > ctx.content.y1) {
      ctx.newPage();
      header(true);
    }
    if (opts.zebra !== false && r % 2 === 1) doc.rect(x0, ctx.y, totalW, h).fill(C.ink50);
    let x = x0;
    cols.forEach((c, i) => {
      const cell = row[i];
      const text = printable(typeof cell === "string" ? cell : cell.text);
      const style = typeof cell === "string" ? {} : cell.style;
      if (style.fill) doc.rect(x + 1, ctx.y + 1, widths[i] - 2, h - 2).fill(style.fill);
      doc
        .font(fontFor(style.bold ? (c.mono ? "monoBold" : "sansBold") : c.mono ? "mono" : "sans", text))
        .fontSize(FONT)
        .fillColor(style.color ?? C.ink900)
        .text(text, x + PAD, ctx.y + 2.4, {
          width: widths[i] - 2 * PAD,
          align: c.align ?? "left",
          lineBreak: !!c.wrap,
        });
      x += widths[i];
    });
    doc
      .lineWidth(0.3)
      .strokeColor(C.ink200)
      .moveTo(x0, ctx.y + h)
      .lineTo(x0 + totalW, ctx.y + h)
      .stroke();
    ctx.y += h;
  });
  ctx.y += 8;
}

/** Key–value block (two columns of label and value). */
export function drawKeyValues(
  ctx: SheetContext,
  x: number,
  width: number,
  items: { label: string; value: string }[],
): number {
  const { doc } = ctx;
  let y = ctx.y;
  for (const raw of items) {
    const it = { label: printable(raw.label), value: printable(raw.value) };
    doc
      .font(fontFor("sans", it.label))
      .fontSize(6.6)
      .fillColor(C.ink500)
      .text(it.label, x, y, { width: width * 0.45, lineBreak: false });
    doc.font(fontFor("mono", it.value)).fontSize(6.8).fillColor(C.ink900);
    const h = doc.heightOfString(it.value, { width: width * 0.55 });
    doc.text(it.value, x + width * 0.45, y, { width: width * 0.55 });
    y += Math.max(9.5, h + 2.5);
    doc
      .lineWidth(0.25)
      .strokeColor(C.ink100)
      .moveTo(x, y - 1.5)
      .lineTo(x + width, y - 1.5)
      .stroke();
  }
  return y;
}
