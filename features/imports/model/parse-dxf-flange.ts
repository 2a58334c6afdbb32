/**
 * Reads a flange outline and its holes from an ASCII DXF drawing as CAD programs write it.
 *
 * Rules, in this order:
 * 1. Model space is flattened (`flattenDxf`): INSERTs expanded, nested ones too; arcs, ellipses and
 *    splines sampled. Layers switched off (dimension, text and border layers are off by default)
 *    are left out.
 * 2. Closed contours: circles, closed polylines/ellipses/splines, and LINE/ARC/open-polyline pieces
 *    chained end to end where their ends meet within 0.01 % of the drawing's extent.
 * 3. The outline is the contour that holds the hole pattern: the most circles of one diameter lying
 *    wholly inside it (at least two); of equals, the smallest such contour (so a border around the
 *    flange loses). The most common diameter inside it is the bolt holes (ties: the smaller).
 * 4. Of the other circles inside the outline, the largest one that contains its centre is the bore.
 * 5. Every entity is reported by type and layer: used, not used, or skipped with the reason.
 * Coordinates come back in mm with the origin moved to the outline's centre (circle centre, or
 * the middle of the polygon's bounding box), y up as in the DXF.
 */
import {
  circleInside,
  collectClosedContours,
  contourArea,
  contourBox,
  describeParts,
  type Contour,
  type Pt,
} from "./closed-contours";
import { flattenDxf, parseDxfText, unreadEntities, type Origin } from "./dxf-entities";
import { resolveDxfUnits, type AssumedUnit, type DxfUnits } from "./dxf-units";

export interface ImportedHole {
  xMm: number;
  yMm: number;
  diameterMm: number;
}

export type ImportedOutline =
  { kind: "circle"; diameterMm: number } | { kind: "polygon"; points: { x: number; y: number }[] };

export interface LayerChoice {
  name: string;
  entities: number;
  on: boolean;
  /** Why the layer starts switched off ("dimensions", "text", "border or title block"), if it does. */
  offByDefault: string | null;
}

export type TallyStatus = "used" | "not used" | "skipped";

/** One line of the "what was read" report: entities of one type on one layer with one fate. */
export interface EntityTally {
  type: string;
  layer: string;
  count: number;
  fromBlocks: number;
  status: TallyStatus;
  detail: string;
}

export interface DxfReading {
  units: DxfUnits;
  layers: LayerChoice[];
  tally: EntityTally[];
  /** The outline's width and height in drawing units (shown in both units when none is stated). */
  sizeInUnits: { width: number; height: number } | null;
  /** The chosen outline, in words: its entities, layer and size. */
  outlineText: string | null;
}

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
  reading: DxfReading;
}

export type DxfParseResult =
  { ok: true; value: DxfFlangeImport } | { ok: false; message: string; reading?: DxfReading };

export interface DxfReadOptions {
  /** Layers to read; when absent, every layer except those off by default. */
  layersOn?: readonly string[];
  /** The unit of a file that states none. */
  unit?: AssumedUnit;
}

const DIAMETER_KEY_MM = 1e-3;
const CHAIN_TOLERANCE = 1e-4; // of the drawing's extent (diagonal)

const OFF_RULES: [RegExp, string][] = [
  [/dim|cota|bema/i, "dimensions"],
  [/text|txt|note|anno|label|schrift/i, "text"],
  [/title|border|frame|sheet|cartouche|tblock|rahmen|legend/i, "border or title block"],
  [/^defpoints$/i, "dimension points"],
];
const ANNOTATION_TYPES = new Set(["TEXT", "MTEXT", "DIMENSION", "ATTDEF", "ATTRIB", "LEADER", "MULTILEADER"]);

export function defaultLayerOff(name: string, types: ReadonlySet<string>): string | null {
  for (const [re, why] of OFF_RULES) if (re.test(name)) return why;
  if (types.size > 0 && [...types].every((t) => ANNOTATION_TYPES.has(t))) return "text";
  return null;
}

export function parseDxfFlange(text: string, options: DxfReadOptions = {}): DxfParseResult {
  let parsed: ReturnType<typeof parseDxfText>;
  try {
    parsed = parseDxfText(text);
  } catch (err) {
    return {
      ok: false,
      message: `This file could not be read as a DXF drawing (${(err as Error).message}).`,
    };
  }
  if (!parsed) return { ok: false, message: "This file could not be read as a DXF drawing." };
  const units = resolveDxfUnits(parsed.header as Record<string, unknown> | undefined, options.unit);
  if ("error" in units) return { ok: false, message: units.error };
  const k = units.mmPerUnit;

  const flat = flattenDxf(parsed);
  const readTypes = new Set((parsed.entities ?? []).map((e) => e.type));
  const unread = unreadEntities(text, readTypes);

  // Layers: every layer an entity sits on, with what it holds.
  const layerTypes = new Map<string, Set<string>>();
  const layerCount = new Map<string, number>();
  for (const o of [...flat.primitives, ...flat.skipped, ...flat.inserts, ...unread]) {
    layerTypes.set(o.layer, (layerTypes.get(o.layer) ?? new Set()).add(o.type));
    layerCount.set(o.layer, (layerCount.get(o.layer) ?? 0) + 1);
  }
  const layers: LayerChoice[] = [...layerTypes.keys()]
    .sort((a, b) => a.localeCompare(b))
    .map((name) => {
      const offByDefault = defaultLayerOff(name, layerTypes.get(name)!);
      const on = options.layersOn ? options.layersOn.includes(name) : offByDefault === null;
      return { name, entities: layerCount.get(name) ?? 0, on, offByDefault };
    });
  const isOn = new Map(layers.map((l) => [l.name, l.on]));

  const tally = new Tally();
  for (const s of [...flat.skipped, ...unread]) tally.add(s, "skipped", s.reason);
  for (const i of flat.inserts) tally.add(i, "used", `expanded: block ${i.block}`);
  const primitives = flat.primitives.filter((p) => {
    if (isOn.get(p.layer)) return true;
    tally.add(p, "skipped", "layer switched off");
    return false;
  });

  const box = extents(primitives);
  const diag = box ? Math.hypot(box.maxX - box.minX, box.maxY - box.minY) : 0;
  const tol = Math.max(diag * CHAIN_TOLERANCE, 1e-9);
  const { contours, open } = collectClosedContours(primitives, tol);
  for (const chain of open)
    for (const m of chain.members)
      tally.add(
        m,
        "not used",
        chain.members.length === 1
          ? "open, not part of any closed contour"
          : `open chain of ${describeParts(chain.parts)}: its ends do not meet`,
      );

  const reading = (outline: Contour | null): DxfReading => ({
    units,
    layers,
    tally: tally.lines(),
    sizeInUnits: outline ? sizeOf(outline) : null,
    outlineText: outline ? describeContour(outline, k) : null,
  });

  if (contours.length === 0) {
    const gap = open[0]
      ? ` The nearest miss: a chain of ${describeParts(open[0].parts)} on ${layerList(open[0].layers)} ends at (${fmt(open[0].gapAt.x)}, ${fmt(open[0].gapAt.y)}) without meeting its start.`
      : "";
    return {
      ok: false,
      message: `The drawing has no closed outline: no circle, closed polyline or chain of lines and arcs that closes. Looked at: ${looked(tally)}.${gap}`,
      reading: reading(null),
    };
  }

  // Score each contour by the largest group of equal circles wholly inside it.
  const circles = contours.filter((c): c is Extract<Contour, { kind: "circle" }> => c.kind === "circle");
  const scored = contours.map((c) => {
    const inside = circles.filter((h) => h !== c && circleInside(c, h.cx, h.cy, h.r, tol));
    const groups = new Map<number, typeof inside>();
    for (const h of inside) {
      const key = Math.round((2 * h.r * k) / DIAMETER_KEY_MM);
      groups.set(key, [...(groups.get(key) ?? []), h]);
    }
    const ranked = [...groups.entries()].sort((a, b) => b[1].length - a[1].length || a[0] - b[0]);
    return { contour: c, inside, ranked, best: ranked[0]?.[1].length ?? 0, area: contourArea(c) };
  });
  const withHoles = scored.filter((s) => s.best >= 2).sort((a, b) => b.best - a.best || a.area - b.area);
  if (withHoles.length === 0) {
    for (const c of contours)
      for (const m of c.members)
        tally.add(m, "not used", "closed contour with no two circles of one diameter inside");
    const biggest = [...scored].sort((a, b) => b.area - a.area).slice(0, 3);
    return {
      ok: false,
      message: `No bolt holes found: no closed contour holds two or more circles of one diameter. Contours looked at: ${biggest
        .map((s) => `${describeContour(s.contour, k)} (${s.inside.length} circle(s) inside)`)
        .join(
          "; ",
        )}${scored.length > 3 ? ` and ${scored.length - 3} smaller` : ""}. Entities: ${looked(tally)}.`,
      reading: reading(biggest[0]?.contour ?? null),
    };
  }
  const chosen = withHoles[0];
  const outline = chosen.contour;
  const centre = contourCentre(outline);
  const holes = chosen.ranked[0][1];
  const rest = chosen.ranked.slice(1).flatMap(([, cs]) => cs);
  const boreCircle = rest
    .filter((c) => Math.hypot(c.cx - centre.x, c.cy - centre.y) < c.r && c.r > holes[0].r)
    .sort((a, b) => b.r - a.r)[0];

  const usedSet = new Set<Contour>([outline, ...holes, ...(boreCircle ? [boreCircle] : [])]);
  for (const m of outline.members) tally.add(m, "used", "outline");
  for (const h of holes) for (const m of h.members) tally.add(m, "used", "bolt hole");
  if (boreCircle) for (const m of boreCircle.members) tally.add(m, "used", "bore");
  const insideSet = new Set<Contour>(chosen.inside);
  let ignoredCircles = 0;
  let otherContours = 0;
  for (const c of contours) {
    if (usedSet.has(c)) continue;
    const detail =
      c.kind === "circle" && insideSet.has(c)
        ? "circle inside the outline, neither a bolt hole nor the bore"
        : circleInside(outline, ...anyPoint(c), 0, tol)
          ? "other closed contour inside the outline"
          : "outside the outline";
    if (c.kind === "circle" && insideSet.has(c)) ignoredCircles++;
    else otherContours++;
    for (const m of c.members) tally.add(m, "not used", detail);
  }

  const warnings: string[] = [];
  if (ignoredCircles > 0)
    warnings.push(
      `${ignoredCircles} other circle(s) inside the outline were not used (neither bolt holes nor the bore).`,
    );
  if (otherContours > 0) warnings.push(`${otherContours} other closed contour(s) were not used.`);
  if (withHoles.length > 1 && withHoles[1].best === chosen.best)
    warnings.push(
      `${describeContour(withHoles[1].contour, k)} holds the same holes; the smaller contour was taken as the outline.`,
    );

  const toMm = (p: Pt) => ({ x: (p.x - centre.x) * k, y: (p.y - centre.y) * k });
  const importedOutline: ImportedOutline =
    outline.kind === "circle"
      ? { kind: "circle", diameterMm: 2 * outline.r * k }
      : { kind: "polygon", points: outline.points.map(toMm) };
  const lines = tally.lines();
  return {
    ok: true,
    value: {
      unitsLabel: units.label,
      mmPerUnit: k,
      centreMm: { x: centre.x * k, y: centre.y * k },
      outline: importedOutline,
      boltHoles: holes.map((c) => {
        const p = toMm({ x: c.cx, y: c.cy });
        return { xMm: p.x, yMm: p.y, diameterMm: 2 * c.r * k };
      }),
      bore: boreCircle ? { diameterMm: 2 * boreCircle.r * k } : null,
      ignoredCircles,
      ignoredEntities: lines.filter((l) => l.status !== "used").reduce((s, l) => s + l.count, 0),
      warnings,
      reading: { ...reading(outline), tally: lines },
    },
  };
}

class Tally {
  private map = new Map<string, EntityTally>();
  add(o: Origin, status: TallyStatus, detail: string): void {
    const key = `${o.type}|${o.layer}|${status}|${detail}`;
    const line = this.map.get(key) ?? {
      type: o.type,
      layer: o.layer,
      count: 0,
      fromBlocks: 0,
      status,
      detail,
    };
    line.count++;
    if (o.viaInsert) line.fromBlocks++;
    this.map.set(key, line);
  }
  lines(): EntityTally[] {
    const order: Record<TallyStatus, number> = { used: 0, "not used": 1, skipped: 2 };
    return [...this.map.values()].sort(
      (a, b) =>
        order[a.status] - order[b.status] || a.layer.localeCompare(b.layer) || a.type.localeCompare(b.type),
    );
  }
}

const fmt = (v: number) => String(Math.round(v * 1000) / 1000);

function layerList(layers: string[]): string {
  return layers.length === 1 ? `layer ${layers[0]}` : `layers ${layers.join(", ")}`;
}

/** "8 LINE, 4 ARC, 24 CIRCLE (24 from blocks) on OUTLINE, HOLES; skipped 12 TEXT (layer switched off)". */
function looked(tally: Tally): string {
  const lines = tally.lines();
  const read = lines.filter((l) => l.status !== "skipped");
  const skipped = lines.filter((l) => l.status === "skipped");
  const byType = (ls: EntityTally[]) => {
    const m = new Map<string, { n: number; blocks: number }>();
    for (const l of ls) {
      const t = m.get(l.type) ?? { n: 0, blocks: 0 };
      t.n += l.count;
      t.blocks += l.fromBlocks;
      m.set(l.type, t);
    }
    return [...m.entries()]
      .map(([t, v]) => `${v.n} ${t}${v.blocks ? ` (${v.blocks} from blocks)` : ""}`)
      .join(", ");
  };
  const parts: string[] = [];
  if (read.length) parts.push(`${byType(read)} on ${layerList([...new Set(read.map((l) => l.layer))])}`);
  else parts.push("no outline or hole entities on the layers switched on");
  if (skipped.length) {
    const reasons = [...new Set(skipped.map((l) => l.detail))].join(", ");
    parts.push(`skipped ${byType(skipped)} (${reasons})`);
  }
  return parts.join("; ");
}

export function describeContour(c: Contour, mmPerUnit: number): string {
  const single = Object.values(c.parts).reduce((s, n) => s + n, 0) === 1;
  const what = single ? Object.keys(c.parts)[0] : `closed chain of ${describeParts(c.parts)}`;
  const size =
    c.kind === "circle"
      ? `Ø ${fmt(2 * c.r * mmPerUnit)} mm`
      : (() => {
          const s = sizeOf(c);
          return `${fmt(s.width * mmPerUnit)} × ${fmt(s.height * mmPerUnit)} mm`;
        })();
  return `${what}${c.viaInsert ? " from a block" : ""} on ${layerList(c.layers)}, ${size}`;
}

function sizeOf(c: Contour): { width: number; height: number } {
  const b = contourBox(c);
  return { width: b.maxX - b.minX, height: b.maxY - b.minY };
}

function anyPoint(c: Contour): [number, number] {
  return c.kind === "circle" ? [c.cx, c.cy] : [c.points[0].x, c.points[0].y];
}

function extents(ps: { kind: string }[]): { minX: number; minY: number; maxX: number; maxY: number } | null {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const p of ps as (
    { kind: "circle"; cx: number; cy: number; r: number } | { kind: "path"; points: Pt[] }
  )[]) {
    const pts =
      p.kind === "circle"
        ? [
            { x: p.cx - p.r, y: p.cy - p.r },
            { x: p.cx + p.r, y: p.cy + p.r },
          ]
        : p.points;
    for (const q of pts) {
      minX = Math.min(minX, q.x);
      minY = Math.min(minY, q.y);
      maxX = Math.max(maxX, q.x);
      maxY = Math.max(maxY, q.y);
    }
  }
  return Number.isFinite(minX) ? { minX, minY, maxX, maxY } : null;
}

function contourCentre(c: Contour): Pt {
  if (c.kind === "circle") return { x: c.cx, y: c.cy };
  const b = contourBox(c);
  return { x: (b.minX + b.maxX) / 2, y: (b.minY + b.maxY) / 2 };
}
