import "server-only";
import type { BoltRow } from "@/features/exports/model/bolt-rows";
import type { SheetProfile } from "./result-view";
import { C, type Box, type SheetContext } from "./sheet-context";

function niceStep(range: number, targetTicks: number): number {
  const raw = range / Math.max(targetTicks, 1);
  const p = Math.pow(10, Math.floor(Math.log10(raw || 1)));
  const m = raw / p;
  return (m <= 1 ? 1 : m <= 2 ? 2 : m <= 2.5 ? 2.5 : m <= 5 ? 5 : 10) * p;
}

/**
 * Gasket stress along the path (the stored samples), with the seating and crush limits as
 * dashed lines and a tick at every bolt position. Axis units follow the viewer's choice.
 */
export function drawProfileChart(
  ctx: SheetContext,
  box: Box,
  profile: SheetProfile,
  rows: readonly BoltRow[],
): void {
  const { doc, u } = ctx;
  const left = box.x + 42;
  const right = box.x + box.w - 8;
  const top = box.y + 8;
  const bottom = box.y + box.h - 24;
  const L = profile.pathLengthMm;
  const vals = profile.stressMpa.map(u.stressValue);
  // Samples off the gasket (inside a bolt hole on a full-face path) are stored as 0 and drawn so.
  const limits = [profile.seatingMpa, profile.crushMpa]
    .filter((v): v is number => v !== null)
    .map(u.stressValue);
  const yMax = Math.max(...vals, ...limits) * 1.08 || 1;
  const yMin = Math.min(0, ...vals);
  const X = (sMm: number) => left + (sMm / (L || 1)) * (right - left);
  const Y = (v: number) => bottom - ((v - yMin) / (yMax - yMin)) * (bottom - top);

  doc.save();
  doc.rect(left, top, right - left, bottom - top).fill(C.ink50);
  // Grid and axes.
  const yStep = niceStep(yMax - yMin, 5);
  doc.font("mono").fontSize(6).fillColor(C.ink500).lineWidth(0.25).strokeColor(C.ink200);
  for (let v = Math.ceil(yMin / yStep) * yStep; v <= yMax; v += yStep) {
    doc.moveTo(left, Y(v)).lineTo(right, Y(v)).stroke();
    doc.text(v >= 1000 ? v.toFixed(0) : String(Number(v.toPrecision(4))), box.x, Y(v) - 3, {
      width: 38,
      align: "right",
      lineBreak: false,
    });
  }
  const Lu = u.lenValue(L);
  const xStep = niceStep(Lu, 8);
  for (let v = 0; v <= Lu + 1e-9; v += xStep) {
    const x = left + (v / Lu) * (right - left);
    doc.moveTo(x, top).lineTo(x, bottom).stroke();
    doc.text(String(Number(v.toPrecision(4))), x - 15, bottom + 3, {
      width: 30,
      align: "center",
      lineBreak: false,
    });
  }
  doc.font("sans").fontSize(6.5).fillColor(C.ink700);
  doc.text(`position along the gasket path s, ${u.length} (clockwise from the top)`, left, bottom + 12, {
    width: right - left,
    align: "center",
    lineBreak: false,
  });
  doc.save().rotate(-90, { origin: [box.x + 6, (top + bottom) / 2] });
  doc.text(`gasket stress, ${u.stress}`, box.x + 6 - 60, (top + bottom) / 2 - 4, {
    width: 120,
    align: "center",
    lineBreak: false,
  });
  doc.restore();

  // Bolt positions as small ticks on the top edge.
  // Without stored projections the bolt-path arc lengths are scaled to the gasket path (exact for
  // concentric circles, close for offset outlines).
  const boltPathL = rows.reduce((a, r) => a + (r.pitchToNextMm ?? 0), 0);
  const ticks = profile.boltSMm ?? rows.map((r) => (boltPathL > 0 ? (r.sMm / boltPathL) * L : r.sMm));
  doc.lineWidth(0.5).strokeColor(C.ink500);
  for (const s of ticks) doc.moveTo(X(s), top).lineTo(X(s), top + 4);
  doc.stroke();

  // Limits.
  const limit = (v: number | null, label: string, color: string) => {
    if (v === null) return;
    const y = Y(u.stressValue(v));
    doc
      .lineWidth(0.8)
      .strokeColor(color)
      .dash(4, { space: 2 })
      .moveTo(left, y)
      .lineTo(right, y)
      .stroke()
      .undash();
    doc
      .font("sansBold")
      .fontSize(6.2)
      .fillColor(color)
      .text(`${label} ${u.stress1(v)} ${u.stress}`, left + 4, y - 8, { lineBreak: false });
  };
  limit(profile.seatingMpa, "seating", C.warn);
  limit(profile.crushMpa, "crush limit", C.fail);

  // The stored curve at target preload, and the same curve at minimum preload (× minN/targetN).
  const curve = (factor: number, width: number, color: string) => {
    doc.lineWidth(width).strokeColor(color);
    profile.sMm.forEach((s, i) => {
      const x = X(s);
      const y = Y(vals[i] * factor);
      if (i === 0) doc.moveTo(x, y);
      else doc.lineTo(x, y);
    });
    doc.stroke();
  };
  if (profile.minFactor < 0.999) curve(profile.minFactor, 0.6, C.ink300);
  curve(1, 1, C.ink900);
  doc
    .lineWidth(0.5)
    .strokeColor(C.ink700)
    .rect(left, top, right - left, bottom - top)
    .stroke();
  // Legend.
  const lx = right - 190;
  const ly = top + 7;
  doc.rect(lx - 4, ly - 3, 190, profile.minFactor < 0.999 ? 21 : 12).fill("#ffffff");
  // A legend entry's line sample, 14 pt long, in the width and colour of its curve.
  const sample = (y: number, width: number, colour: string) =>
    doc
      .lineWidth(width)
      .strokeColor(colour)
      .moveTo(lx, y)
      .lineTo(lx + 14, y)
      .stroke();
  sample(ly + 3, 1, C.ink900);
  doc
    .font("sans")
    .fontSize(6.2)
    .fillColor(C.ink700)
    .text("at target preload (stored result)", lx + 18, ly, { lineBreak: false });
  if (profile.minFactor < 0.999) {
    sample(ly + 12, 0.6, C.ink300);
    doc.text(`at minimum preload (× ${profile.minFactor.toFixed(2)})`, lx + 18, ly + 9, { lineBreak: false });
  }
  doc.restore();
}
