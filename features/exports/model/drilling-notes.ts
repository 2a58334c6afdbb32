import type Drawing from "dxf-writer";
import type { JointDesign } from "@/features/analysis/core/design";
import type { RevisionStatus } from "@/db/tables/designs";
import { CAUTIONS } from "@/features/ui/cautions";
import { UNVERIFIED_MARK } from "@/features/analysis/unverified-values";
import type { BoltRow } from "./bolt-rows";
import { fixed, type LengthUnit } from "./length-unit";

/** What the drilling template's title block names (the stored revision's facts). */
export interface DrillingTitle {
  designName: string;
  equipmentTag: string;
  revisionNumber: number;
  status: RevisionStatus;
  /** ISO 8601 of the approval, null when not approved. */
  approvedAt: string | null;
  /** Display name of the approver, null when not approved. */
  approver: string | null;
  /** ISO 8601 of the export (the template's date). */
  exportedAt: string;
  /** True while the stored result holds table values taken from memory. */
  unverified: boolean;
}

const STATUS_WORDS: Record<RevisionStatus, string> = {
  draft: "DRAFT - NOT APPROVED",
  in_review: "IN REVIEW - NOT APPROVED",
  returned: "RETURNED - NOT APPROVED",
  approved: "APPROVED",
};

/**
 * DXF R12 text is one code page: Ø, ° and ± as DXF's control codes (%%C, %%D, %%P), accents
 * dropped, anything else outside ASCII as "?". Example: "Flänge Ø500" → "Flange %%C500".
 */
export function dxfText(text: string): string {
  return text
    .replace(/%/g, "%%%")
    .replace(/[Ø⌀]/g, "%%C")
    .replace(/°/g, "%%D")
    .replace(/±/g, "%%P")
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .replace(/[\u2010-\u2015]/g, "-")
    .replace(/[\u2018\u2019]/g, "'")
    .replace(/[\u201c\u201d]/g, '"')
    .replace(/[^\x20-\x7e]/g, "?");
}

type Extent = { minX: number; minY: number; maxX: number; maxY: number };

/** Where the notes go: the drawing, its length unit, the outline's extent (mm) and the text height. */
export interface NoteFrame {
  d: Drawing;
  u: LengthUnit;
  ext: Extent;
  h: number;
}

/** True when the bolts sit on the bolt circle at equal pitch (within 0.001 mm). */
function equallySpacedOnCircle(design: JointDesign, rows: readonly BoltRow[]): boolean {
  if (design.boltPath.kind !== "circle" || rows.length < 2) return false;
  if (design.bolts.some((b) => Math.abs(b.offPathMm ?? 0) > 1e-3)) return false;
  const pitch = (Math.PI * design.boltPath.diameterMm) / rows.length;
  return rows.every((r) => r.pitchToNextMm !== null && Math.abs(r.pitchToNextMm - pitch) < 1e-3);
}

/**
 * Hole callouts on the HOLE-NOTES layer: the size and count of the holes, the bolt circle (or the
 * bolt path), the first hole's angle, a leader to hole 1, and a table of every hole's position
 * (number, x, y, angle clockwise from the top), in the template's length unit. Returns the lines.
 */
export function drawHoleCallouts(
  { d, u, ext, h }: NoteFrame,
  design: JointDesign,
  rows: readonly BoltRow[],
  layer: string,
): string[] {
  const k = u.fromMm;
  const dec = u.suffix === "mm" ? 2 : 4;
  const len = (mm: number) => fixed(k(mm), dec);
  const unit = u.suffix.toUpperCase();
  const n = rows.length;
  // "%%C" is DXF's control code for the diameter sign.
  const size = `${n} X %%C${len(design.fastener.holeDiameterMm)} ${unit} THRU FOR ${dxfText(design.fastener.designation)}${design.fastener.threadSeries === "metric-coarse" ? "" : " IN"} BOLTS`;
  const first = rows.find((r) => r.number === 1);
  const lines: string[] = [];
  if (design.boltPath.kind === "circle") {
    const spaced = equallySpacedOnCircle(design, rows);
    lines.push(
      `${size} ON PCD %%C${len(design.boltPath.diameterMm)} ${unit}${spaced ? ", EQUALLY SPACED" : ""}`,
      first
        ? `HOLE 1 AT ${fixed(first.angleDeg, 2)} DEG CLOCKWISE FROM TOP${spaced ? "" : "; POSITIONS AS TABLED"}`
        : "POSITIONS AS TABLED",
    );
  } else {
    lines.push(
      `${size} ON THE BOLT PATH ${len(design.boltPath.offsetMm)} ${unit} INSIDE THE OUTLINE`,
      "POSITIONS AS TABLED (FROM THE FLANGE CENTRE, Y UP)",
    );
  }
  d.setActiveLayer(layer);
  const top = k(ext.maxY) + 3.2 * h;
  lines.forEach((line, i) => d.drawText(k(ext.minX), top - i * 1.6 * h, h, 0, line));
  if (first) d.drawLine(k(ext.minX) + 4 * h, top - 1.6 * h - 0.4 * h, k(first.xMm), k(first.yMm));
  // The hole table, to the right of the outline.
  const x0 = k(ext.maxX) + 4 * h;
  const th = h * 0.8;
  d.drawText(
    x0,
    k(ext.maxY),
    th,
    0,
    `HOLE   X ${u.suffix.toUpperCase()}   Y ${u.suffix.toUpperCase()}   ANGLE DEG`,
  );
  [...rows]
    .sort((a, b) => a.number - b.number)
    .forEach((r, i) =>
      d.drawText(
        x0,
        k(ext.maxY) - (i + 1) * 1.5 * th,
        th,
        0,
        `${r.number}   ${fixed(k(r.xMm), u.decimals)}   ${fixed(k(r.yMm), u.decimals)}   ${fixed(r.angleDeg, 3)}`,
      ),
    );
  return lines;
}

/**
 * The title block on the TITLE layer, below the outline: a frame with the design, tag, revision,
 * status, approval date, units, the unverified-values mark while any remain, and the cautions.
 * Returns its lines of text.
 */
export function drawTitleBlock({ d, u, ext, h }: NoteFrame, title: DrillingTitle, layer: string): string[] {
  const k = u.fromMm;
  const lines = [
    "SEALPITCH DRILLING TEMPLATE",
    `DESIGN: ${dxfText(title.designName)}${title.equipmentTag ? `   TAG: ${dxfText(title.equipmentTag)}` : ""}`,
    `REVISION: ${title.revisionNumber}   STATUS: ${STATUS_WORDS[title.status]}`,
    title.status === "approved" && title.approvedAt
      ? `APPROVED: ${title.approvedAt.slice(0, 10)}${title.approver ? ` BY ${dxfText(title.approver).toUpperCase()}` : ""}`
      : "APPROVER: NONE - THIS REVISION IS NOT APPROVED",
    `DATE: ${title.exportedAt.slice(0, 10)} (EXPORTED)   UNITS: ${u.suffix.toUpperCase()}, SCALE 1:1`,
    ...(title.unverified ? [UNVERIFIED_MARK.toUpperCase()] : []),
    "CAUTIONS:",
    ...CAUTIONS.map((c) => `- ${dxfText(c)}`),
  ];
  const step = 1.7 * h;
  const x0 = k(ext.minX);
  const top = k(ext.minY) - 3 * h;
  const longest = Math.max(...lines.map((l) => l.length));
  const w = Math.max(k(ext.maxX) - x0, longest * h * 0.62 + 2 * h);
  const height = lines.length * step + h;
  d.setActiveLayer(layer);
  d.drawRect(x0, top - height, x0 + w, top);
  lines.forEach((line, i) =>
    d.drawText(x0 + h, top - h - (i + 1) * step + 0.6 * h, i === 0 ? h * 1.2 : h, 0, line),
  );
  return lines;
}
