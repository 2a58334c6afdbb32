import "server-only";
import type { JointDesign, Outline, PointMm } from "@/features/analysis/core/design";
import { getBoltPath, outlineToPolyline } from "@/features/analysis/core/geometry";
import { pathToPolyline } from "@/features/analysis/core/path";
import type { BoltRow } from "@/features/exports/model/bolt-rows";
import { C, type Box, type SheetContext } from "./sheet-context";

const PT_PER_MM = 72 / 25.4;
const SCALES = [1, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10, 12.5, 15, 20, 25, 30, 40, 50, 75, 100];

/** Largest standard reduction 1:n that fits `extentMm` into `boxPt` (both axes). */
export function chooseScale(widthMm: number, heightMm: number, boxWPt: number, boxHPt: number): number {
  for (const n of SCALES)
    if ((widthMm * PT_PER_MM) / n <= boxWPt && (heightMm * PT_PER_MM) / n <= boxHPt) return n;
  return SCALES[SCALES.length - 1];
}

type Xf = (p: PointMm) => [number, number];

function tracePolygon(doc: PDFKit.PDFDocument, pts: PointMm[], xf: Xf): void {
  pts.forEach((p, i) => {
    const [x, y] = xf(p);
    if (i === 0) doc.moveTo(x, y);
    else doc.lineTo(x, y);
  });
  doc.closePath();
}

function traceOutline(doc: PDFKit.PDFDocument, o: Outline, xf: Xf, s: number): void {
  if (o.kind === "circle") {
    const [x, y] = xf({ x: 0, y: 0 });
    doc.circle(x, y, (o.diameterMm / 2) * s);
  } else tracePolygon(doc, outlineToPolyline(o, 1.5), xf);
}

function arrowHead(doc: PDFKit.PDFDocument, x: number, y: number, dx: number, dy: number): void {
  const len = Math.hypot(dx, dy) || 1;
  const ux = dx / len;
  const uy = dy / len;
  const a = 4.2;
  const b = 1.4;
  doc
    .moveTo(x, y)
    .lineTo(x - ux * a - uy * b, y - uy * a + ux * b)
    .lineTo(x - ux * a + uy * b, y - uy * a - ux * b)
    .closePath()
    .fill(C.ink900);
}

/** A linear dimension between two page points, text centred above the line. */
function dimension(ctx: SheetContext, x1: number, y1: number, x2: number, y2: number, text: string): void {
  const { doc } = ctx;
  doc.lineWidth(0.4).strokeColor(C.ink900).moveTo(x1, y1).lineTo(x2, y2).stroke();
  arrowHead(doc, x1, y1, x1 - x2, y1 - y2);
  arrowHead(doc, x2, y2, x2 - x1, y2 - y1);
  doc.font("mono").fontSize(7).fillColor(C.ink900);
  const tw = doc.widthOfString(text);
  const mx = (x1 + x2) / 2;
  const my = (y1 + y2) / 2;
  doc.rect(mx - tw / 2 - 1.5, my - 9, tw + 3, 8).fill("#ffffff");
  doc.fillColor(C.ink900).text(text, mx - tw / 2, my - 8.5, { lineBreak: false });
}

function extent(o: Outline): { hw: number; hh: number } {
  if (o.kind === "circle") return { hw: o.diameterMm / 2, hh: o.diameterMm / 2 };
  if (o.kind === "rectangle") return { hw: o.widthMm / 2, hh: o.heightMm / 2 };
  if (o.kind === "obround") return { hw: o.lengthMm / 2, hh: o.widthMm / 2 };
  let hw = 0;
  let hh = 0;
  for (const p of o.points) {
    hw = Math.max(hw, Math.abs(p.x));
    hh = Math.max(hh, Math.abs(p.y));
  }
  return { hw, hh };
}

/**
 * The flange drawn to scale as vectors: outline, bore, gasket, bolt path (chain line), centre
 * lines, numbered holes, overall and bolt-path dimensions, and one pitch/chord callout.
 * Returns the reduction n of the scale 1:n (true when the sheet is printed at 100 %).
 */
/** Where the flange centre lands on the page and how many points one model mm is (pure). */
export function flangeTransform(
  box: Box,
  outline: Outline,
): { cx: number; cy: number; ptPerMm: number; reduction: number } {
  const { hw, hh } = extent(outline);
  const pad = 40;
  const n = chooseScale(2 * hw, 2 * hh, box.w - 2 * pad, box.h - 2 * pad - 10);
  return { cx: box.x + box.w / 2, cy: box.y + box.h / 2 - 4, ptPerMm: PT_PER_MM / n, reduction: n };
}

export function drawFlange(
  ctx: SheetContext,
  box: Box,
  design: JointDesign,
  rows: readonly BoltRow[],
): number {
  const { doc, u } = ctx;
  const { hw, hh } = extent(design.outline);
  const { cx, cy, ptPerMm: s, reduction: n } = flangeTransform(box, design.outline);
  const xf: Xf = (p) => [cx + p.x * s, cy - p.y * s];

  doc.save();
  // Outline with the bore cut out (even-odd), then the gasket on top.
  traceOutline(doc, design.outline, xf, s);
  if (design.bore) traceOutline(doc, design.bore, xf, s);
  doc
    .fillColor(C.steel100)
    .lineWidth(1)
    .strokeColor(C.ink900)
    .fillAndStroke(C.steel100, C.ink900, "even-odd");
  const g = design.gasket;
  if (g.kind === "ring") {
    if (g.geometry.kind === "annulus") {
      doc
        .circle(cx, cy, (g.geometry.outerDiameterMm / 2) * s)
        .circle(cx, cy, (g.geometry.innerDiameterMm / 2) * s);
    } else {
      const { centreOffsetMm, widthMm } = g.geometry;
      tracePolygon(
        doc,
        pathToPolyline(
          getBoltPath(design.outline, { kind: "offset", offsetMm: centreOffsetMm - widthMm / 2 }),
          1.5,
        ),
        xf,
      );
      tracePolygon(
        doc,
        pathToPolyline(
          getBoltPath(design.outline, { kind: "offset", offsetMm: centreOffsetMm + widthMm / 2 }),
          1.5,
        ),
        xf,
      );
    }
    doc.fillOpacity(0.85).lineWidth(0.5).fillAndStroke(C.brass300, C.brass700, "even-odd").fillOpacity(1);
  }
  // Centre lines (chain) and the bolt path.
  doc.lineWidth(0.35).strokeColor(C.ink500).dash(9, { space: 2.2 });
  doc
    .moveTo(cx - hw * s - 12, cy)
    .lineTo(cx + hw * s + 12, cy)
    .stroke();
  doc
    .moveTo(cx, cy - hh * s - 12)
    .lineTo(cx, cy + hh * s + 12)
    .stroke();
  if (design.boltPath.kind === "circle") doc.circle(cx, cy, (design.boltPath.diameterMm / 2) * s).stroke();
  else {
    tracePolygon(doc, pathToPolyline(getBoltPath(design.outline, design.boltPath), 2), xf);
    doc.stroke();
  }
  doc.undash();

  // Holes with centre marks, numbers outside the bolt path along the outward normal.
  const rHole = (design.fastener.holeDiameterMm / 2) * s;
  doc.lineWidth(0.7).strokeColor(C.ink900);
  for (const r of rows) {
    const [x, y] = xf({ x: r.xMm, y: r.yMm });
    doc.circle(x, y, rHole).fillAndStroke("#ffffff", C.ink900);
  }
  doc.lineWidth(0.3).strokeColor(C.ink700);
  const arm = Math.max(rHole * 1.35, 2);
  for (const r of rows) {
    const [x, y] = xf({ x: r.xMm, y: r.yMm });
    doc
      .moveTo(x - arm, y)
      .lineTo(x + arm, y)
      .moveTo(x, y - arm)
      .lineTo(x, y + arm);
  }
  doc.stroke();
  const minChordPt = Math.min(...rows.map((r) => (r.chordToNextMm ?? 1e9) * s));
  const labelSize = Math.max(4, Math.min(7.5, minChordPt * 0.62));
  doc.font("sansBold").fontSize(labelSize).fillColor(C.ink900);
  for (const r of rows) {
    const [x, y] = xf({ x: r.xMm, y: r.yMm });
    const dx = x - cx;
    const dy = y - cy;
    const d = Math.hypot(dx, dy) || 1;
    // Labels sit on the ray from the centre through the hole, just beyond the hole.
    const k = d + rHole + labelSize * 0.9;
    const lx = cx + (dx / d) * k;
    const ly = cy + (dy / d) * k;
    const text = String(r.number);
    const tw = doc.widthOfString(text);
    doc.text(text, lx - tw / 2, ly - labelSize / 2, { lineBreak: false });
  }

  // Main dimensions: overall size below, bolt path above (circle) and one pitch callout.
  const top = cy - hh * s;
  const bottom = cy + hh * s;
  doc.lineWidth(0.3).strokeColor(C.ink500);
  doc
    .moveTo(cx - hw * s, cy + 4)
    .lineTo(cx - hw * s, bottom + 20)
    .moveTo(cx + hw * s, cy + 4)
    .lineTo(cx + hw * s, bottom + 20)
    .stroke();
  const overall =
    design.outline.kind === "circle"
      ? `Ø${u.len(design.outline.diameterMm)}`
      : `${u.len(2 * hw)} × ${u.len(2 * hh)}`;
  dimension(ctx, cx - hw * s, bottom + 17, cx + hw * s, bottom + 17, overall);
  if (design.boltPath.kind === "circle") {
    const rb = (design.boltPath.diameterMm / 2) * s;
    doc
      .lineWidth(0.3)
      .strokeColor(C.ink500)
      .moveTo(cx - rb, cy - 4)
      .lineTo(cx - rb, top - 20)
      .moveTo(cx + rb, cy - 4)
      .lineTo(cx + rb, top - 20)
      .stroke();
    dimension(ctx, cx - rb, top - 17, cx + rb, top - 17, `Ø${u.len(design.boltPath.diameterMm)} bolt circle`);
  } else {
    doc
      .font("mono")
      .fontSize(7)
      .fillColor(C.ink900)
      .text(`bolt path ${u.len(design.boltPath.offsetMm)} in from edge`, box.x + 6, top - 20, {
        lineBreak: false,
      });
  }
  const first = rows[0];
  const next = first?.nextNumber ? rows[first.nextNumber - 1] : undefined;
  if (first && next && first.pitchToNextMm !== null && first.chordToNextMm !== null) {
    const [x1, y1] = xf({ x: first.xMm, y: first.yMm });
    const [x2, y2] = xf({ x: next.xMm, y: next.yMm });
    doc.lineWidth(0.9).strokeColor(C.brass700).moveTo(x1, y1).lineTo(x2, y2).stroke();
    const mx = (x1 + x2) / 2;
    const my = (y1 + y2) / 2;
    const lx = box.x + box.w - 150;
    const ly = box.y + 14;
    doc
      .lineWidth(0.35)
      .strokeColor(C.brass700)
      .moveTo(mx, my)
      .lineTo(lx + 146, ly + 16)
      .lineTo(lx, ly + 16)
      .stroke();
    doc.font("mono").fontSize(6.8).fillColor(C.brass700);
    doc.text(`pitch ${first.number}–${next.number}  ${u.len(first.pitchToNextMm)} ${u.length}`, lx, ly, {
      lineBreak: false,
    });
    doc.text(
      `chord ${first.number}–${next.number}  ${u.len(first.chordToNextMm)} ${u.length}`,
      lx,
      ly + 7.5,
      { lineBreak: false },
    );
  }
  doc.font("sans").fontSize(6.5).fillColor(C.ink500);
  doc.text(
    `Scale 1:${n} when printed at 100 % · view on the bolted face · dimensions in ${u.length} · bolts numbered clockwise from the top`,
    box.x + 6,
    box.y + box.h - 10,
    { lineBreak: false },
  );
  doc.restore();
  return n;
}
