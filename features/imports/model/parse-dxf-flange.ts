/**
 * Reads a flange outline and its holes from an ASCII DXF drawing (model space entities only).
 *
 * Rules, in this order:
 * 1. The outline is the closed entity (CIRCLE, closed LWPOLYLINE/POLYLINE) with the largest area.
 * 2. Every CIRCLE whose centre lies inside the outline is a hole candidate.
 * 3. Candidates are grouped by diameter (to 1 µm); the most common diameter is the bolt holes
 *    (ties: the smaller diameter, since a drawing rarely has more bores than bolts).
 * 4. Of the other circles, the largest one that contains the outline's centre is the bore.
 * 5. Everything else is reported as ignored, never silently used.
 * Coordinates come back in mm with the origin moved to the outline's centre (circle centre, or
 * the middle of the polygon's bounding box), y up as in the DXF.
 */
import DxfParser from "dxf-parser";
import { collectClosedContours, contourArea, pointInPolygon, type Contour, type Pt } from "./closed-contours";
import { resolveDxfUnits } from "./dxf-units";

export interface ImportedHole {
  xMm: number;
  yMm: number;
  diameterMm: number;
}

export type ImportedOutline =
  { kind: "circle"; diameterMm: number } | { kind: "polygon"; points: { x: number; y: number }[] };

export interface DxfFlangeImport {
  unitsLabel: string;
  mmPerUnit: number;
  /** Where the drawing's origin was moved (in mm, drawing coordinates). */
  centreMm: { x: number; y: number };
  outline: ImportedOutline;
  boltHoles: ImportedHole[];
  bore: { diameterMm: number } | null;
  ignoredCircles: number;
  ignoredEntities: number;
  warnings: string[];
}

export type ParseResult<T> = { ok: true; value: T } | { ok: false; message: string };

const DIAMETER_KEY_MM = 1e-3;

export function parseDxfFlange(text: string): ParseResult<DxfFlangeImport> {
  let parsed: ReturnType<DxfParser["parseSync"]>;
  try {
    parsed = new DxfParser().parseSync(text);
  } catch (err) {
    return {
      ok: false,
      message: `This file could not be read as a DXF drawing (${(err as Error).message}).`,
    };
  }
  if (!parsed) return { ok: false, message: "This file could not be read as a DXF drawing." };
  const units = resolveDxfUnits((parsed.header as Record<string, unknown> | undefined)?.$INSUNITS);
  if ("error" in units) return { ok: false, message: units.error };
  const k = units.mmPerUnit;

  const { contours, skipped } = collectClosedContours(parsed.entities ?? []);
  if (contours.length === 0)
    return {
      ok: false,
      message: "The drawing has no closed outline: draw the flange as a closed polyline or a circle.",
    };

  const outline = contours.reduce((best, c) => (contourArea(c) > contourArea(best) ? c : best));
  const centre = contourCentre(outline);
  const inside = (x: number, y: number) =>
    outline.kind === "circle"
      ? Math.hypot(x - outline.cx, y - outline.cy) < outline.r
      : pointInPolygon(outline.points, x, y);

  const circles = contours.filter(
    (c): c is Extract<Contour, { kind: "circle" }> =>
      c !== outline && c.kind === "circle" && inside(c.cx, c.cy),
  );
  const otherContours = contours.length - 1 - circles.length;

  const groups = new Map<number, typeof circles>();
  for (const c of circles) {
    const key = Math.round((2 * c.r * k) / DIAMETER_KEY_MM);
    groups.set(key, [...(groups.get(key) ?? []), c]);
  }
  const ranked = [...groups.entries()].sort((a, b) => b[1].length - a[1].length || a[0] - b[0]);
  const warnings: string[] = [];
  if (ranked.length === 0 || ranked[0][1].length < 2) {
    return {
      ok: false,
      message:
        "No bolt holes found: the drawing needs at least two circles of one diameter inside the outline.",
    };
  }
  const [, holes] = ranked[0];
  const rest = ranked.slice(1).flatMap(([, cs]) => cs);
  const boreCircle = rest
    .filter((c) => Math.hypot(c.cx - centre.x, c.cy - centre.y) < c.r && c.r > holes[0].r)
    .sort((a, b) => b.r - a.r)[0];
  const ignoredCircles = rest.length - (boreCircle ? 1 : 0);
  if (ignoredCircles > 0)
    warnings.push(
      `${ignoredCircles} other circle(s) inside the outline were not used (neither bolt holes nor the bore).`,
    );
  if (otherContours > 0) warnings.push(`${otherContours} other closed contour(s) were not used.`);

  const toMm = (p: Pt) => ({ x: (p.x - centre.x) * k, y: (p.y - centre.y) * k });
  const importedOutline: ImportedOutline =
    outline.kind === "circle"
      ? { kind: "circle", diameterMm: 2 * outline.r * k }
      : { kind: "polygon", points: outline.points.map(toMm) };

  return {
    ok: true,
    value: {
      unitsLabel: units.label,
      mmPerUnit: k,
      centreMm: { x: centre.x * k, y: centre.y * k },
      outline: importedOutline,
      boltHoles: holes.map((c) => ({ ...xy(toMm({ x: c.cx, y: c.cy })), diameterMm: 2 * c.r * k })),
      bore: boreCircle ? { diameterMm: 2 * boreCircle.r * k } : null,
      ignoredCircles,
      ignoredEntities: skipped,
      warnings,
    },
  };
}

function xy(p: Pt): { xMm: number; yMm: number } {
  return { xMm: p.x, yMm: p.y };
}

function contourCentre(c: Contour): Pt {
  if (c.kind === "circle") return { x: c.cx, y: c.cy };
  const xs = c.points.map((p) => p.x);
  const ys = c.points.map((p) => p.y);
  return { x: (Math.min(...xs) + Math.max(...xs)) / 2, y: (Math.min(...ys) + Math.max(...ys)) / 2 };
}
