import Drawing from "dxf-writer";
import type { JointDesign, Outline } from "@/features/analysis/core/design";
import { getBoltPath, outlineToPolyline } from "@/features/analysis/core/geometry";
import { pathToPolyline } from "@/features/analysis/core/path";
import type { BoltRow } from "./bolt-rows";
import { lengthUnitFor } from "./length-unit";
import { drawHoleCallouts, drawTitleBlock, type DrillingTitle } from "./drilling-notes";

/** Bounding box of an outline, mm. */
export function outlineExtentMm(outline: Outline): {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
} {
  const pts = outlineToPolyline(outline, 1);
  return {
    minX: Math.min(...pts.map((p) => p.x)),
    minY: Math.min(...pts.map((p) => p.y)),
    maxX: Math.max(...pts.map((p) => p.x)),
    maxY: Math.max(...pts.map((p) => p.y)),
  };
}

/** Layer names of the drilling template (our own; documented in DEVELOPERS.md). */
export const DXF_LAYERS = {
  outline: "OUTLINE",
  bore: "BORE",
  gasket: "GASKET",
  boltPath: "BOLT-PATH",
  holes: "HOLES",
  centreMarks: "CENTRE-MARKS",
  labels: "LABELS",
  holeNotes: "HOLE-NOTES",
  title: "TITLE",
} as const;

// Circles stay true circles (exact for the CAD user); other outlines go out as fine polylines.
function drawOutline(d: Drawing, outline: Outline, k: (mm: number) => number): void {
  if (outline.kind === "circle") {
    d.drawCircle(0, 0, k(outline.diameterMm / 2));
    return;
  }
  const pts = outlineToPolyline(outline, 1).map((p) => [k(p.x), k(p.y)] as [number, number]);
  d.drawPolyline(pts, true);
}

/**
 * The drilling template as DXF (R12-style entities written by dxf-writer): outline, bore, gasket,
 * bolt path, one circle per hole at the hole diameter, a centre cross per hole, bolt numbers, hole
 * callouts with a table of positions (HOLE-NOTES) and a title block (TITLE), both on layers a CAD
 * user (and our Drawing intake) can switch off.
 * Coordinates in the design's length unit with $INSUNITS set to match (4 = mm, 1 = in).
 */
export function buildDrillingTemplateDxf(
  design: JointDesign,
  rows: readonly BoltRow[],
  title: DrillingTitle,
): string {
  const u = lengthUnitFor(design.units);
  const k = u.fromMm;
  const d = new Drawing();
  d.setUnits(u.suffix === "mm" ? "Millimeters" : "Inches");
  d.addLayer(DXF_LAYERS.outline, Drawing.ACI.WHITE, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.bore, Drawing.ACI.WHITE, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.gasket, Drawing.ACI.GREEN, "DASHED");
  d.addLayer(DXF_LAYERS.boltPath, Drawing.ACI.CYAN, "DASHED");
  d.addLayer(DXF_LAYERS.holes, Drawing.ACI.RED, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.centreMarks, Drawing.ACI.YELLOW, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.labels, Drawing.ACI.WHITE, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.holeNotes, Drawing.ACI.WHITE, "CONTINUOUS");
  d.addLayer(DXF_LAYERS.title, Drawing.ACI.WHITE, "CONTINUOUS");

  d.setActiveLayer(DXF_LAYERS.outline);
  drawOutline(d, design.outline, k);
  if (design.bore) {
    d.setActiveLayer(DXF_LAYERS.bore);
    drawOutline(d, design.bore, k);
  }
  const g = design.gasket;
  if (g.kind === "ring") {
    d.setActiveLayer(DXF_LAYERS.gasket);
    if (g.geometry.kind === "annulus") {
      d.drawCircle(0, 0, k(g.geometry.innerDiameterMm / 2));
      d.drawCircle(0, 0, k(g.geometry.outerDiameterMm / 2));
    } else {
      const { centreOffsetMm, widthMm } = g.geometry;
      for (const inward of [centreOffsetMm - widthMm / 2, centreOffsetMm + widthMm / 2]) {
        const pts = pathToPolyline(getBoltPath(design.outline, { kind: "offset", offsetMm: inward }), 1);
        d.drawPolyline(
          pts.map((p) => [k(p.x), k(p.y)] as [number, number]),
          true,
        );
      }
    }
  }
  d.setActiveLayer(DXF_LAYERS.boltPath);
  if (design.boltPath.kind === "circle") d.drawCircle(0, 0, k(design.boltPath.diameterMm / 2));
  else {
    const pts = pathToPolyline(getBoltPath(design.outline, design.boltPath), 1);
    d.drawPolyline(
      pts.map((p) => [k(p.x), k(p.y)] as [number, number]),
      true,
    );
  }

  const r = k(design.fastener.holeDiameterMm / 2);
  const arm = r * 1.4;
  d.setActiveLayer(DXF_LAYERS.holes);
  for (const row of rows) d.drawCircle(k(row.xMm), k(row.yMm), r);
  d.setActiveLayer(DXF_LAYERS.centreMarks);
  for (const row of rows) {
    const x = k(row.xMm);
    const y = k(row.yMm);
    d.drawLine(x - arm, y, x + arm, y);
    d.drawLine(x, y - arm, x, y + arm);
  }
  d.setActiveLayer(DXF_LAYERS.labels);
  for (const row of rows)
    d.drawText(k(row.xMm) + r * 1.1, k(row.yMm) + r * 1.1, r * 0.9, 0, String(row.number));
  // Text sized to the part (2.5–6 mm), callouts above it, the hole table right, the title block below.
  const ext = outlineExtentMm(design.outline);
  const h = k(Math.max(2.5, Math.min(6, (ext.maxX - ext.minX) / 60)));
  const frame = { d, u, ext, h };
  drawHoleCallouts(frame, design, rows, DXF_LAYERS.holeNotes);
  drawTitleBlock(frame, title, DXF_LAYERS.title);
  return d.toDxfString();
}
