// Flattens a parsed DXF into plane primitives in drawing units: circles, and paths (open or
// closed point lists). INSERTs are expanded through their blocks, nested ones too, with the
// insert's position, scale, rotation and column/row array; entities on layer "0" inside a block
// take the layer of the INSERT that places them (the DXF rule). Arcs, bulges, ellipses and
// splines are sampled at ≤ 2° (splines: 24 points per knot span). Every model-space entity is
// accounted for: it becomes primitives, or it is listed as skipped with the reason.
import DxfParser, { type IDxf, type IEntity } from "dxf-parser";

export interface Pt {
  x: number;
  y: number;
}

/** Where a primitive came from: the entity type as written, and whether an INSERT placed it. */
export interface Origin {
  type: string;
  layer: string;
  viaInsert: boolean;
}

export type Primitive =
  | ({ kind: "circle"; cx: number; cy: number; r: number } & Origin)
  | ({
      kind: "path";
      points: Pt[];
      closed: boolean;
      /** Set when the path is (part of) one circle: lets two half arcs chain back into a circle. */
      arc?: { cx: number; cy: number; r: number };
    } & Origin);

export interface SkippedEntity extends Origin {
  reason: string;
}

/** The members of the entities read here (dxf-parser types them per entity class; our readers add some). */
interface EntityFields {
  inPaperSpace?: boolean;
  center?: Pt;
  radius?: number;
  startAngle?: number;
  endAngle?: number;
  vertices?: BulgeVertex[];
  shape?: boolean;
  is3dPolygonMesh?: boolean;
  isPolyfaceMesh?: boolean;
  majorAxisEndPoint?: Pt;
  axisRatio?: number;
  controlPoints?: Pt[];
  fitPoints?: Pt[];
  knotValues?: number[];
  weights?: number[];
  degreeOfSplineCurve?: number;
  closed?: boolean;
  name?: string;
  position?: Pt;
  xScale?: number;
  yScale?: number;
  rotation?: number;
  columnCount?: number;
  rowCount?: number;
  columnSpacing?: number;
  rowSpacing?: number;
  extrusionDirectionZ?: number;
  extrusionDirection?: { z?: number };
}

/** 2-D affine map x' = a·x + c·y + e, y' = b·x + d·y + f. */
interface Affine {
  a: number;
  b: number;
  c: number;
  d: number;
  e: number;
  f: number;
}

const IDENTITY: Affine = { a: 1, b: 0, c: 0, d: 1, e: 0, f: 0 };
const STEP = Math.PI / 90; // 2°
const MAX_DEPTH = 16;

function compose(outer: Affine, inner: Affine): Affine {
  return {
    a: outer.a * inner.a + outer.c * inner.b,
    b: outer.b * inner.a + outer.d * inner.b,
    c: outer.a * inner.c + outer.c * inner.d,
    d: outer.b * inner.c + outer.d * inner.d,
    e: outer.a * inner.e + outer.c * inner.f + outer.e,
    f: outer.b * inner.e + outer.d * inner.f + outer.f,
  };
}

function apply(m: Affine, p: Pt): Pt {
  return { x: m.a * p.x + m.c * p.y + m.e, y: m.b * p.x + m.d * p.y + m.f };
}

/** The map's uniform scale when it keeps circles circles (a similarity), else null. */
function similarityScale(m: Affine): number | null {
  const sx = Math.hypot(m.a, m.b);
  const sy = Math.hypot(m.c, m.d);
  const dot = m.a * m.c + m.b * m.d;
  if (Math.abs(sx - sy) > 1e-9 * Math.max(sx, sy) || Math.abs(dot) > 1e-9 * sx * sy) return null;
  return sx;
}

/** Entities whose coordinates are in their object coordinate system (LINE, ELLIPSE, SPLINE are in world coordinates). */
const OCS_TYPES = new Set(["CIRCLE", "ARC", "LWPOLYLINE", "POLYLINE", "INSERT"]);

/** An OCS entity whose extrusion points down (a mirrored object in CAD) has its x axis flipped. */
function ocsFlip(type: string, any: EntityFields): Affine {
  if (!OCS_TYPES.has(type)) return IDENTITY;
  const z = any.extrusionDirectionZ ?? any.extrusionDirection?.z ?? 1;
  return z < 0 ? { ...IDENTITY, a: -1 } : IDENTITY;
}

function sampleArc(cx: number, cy: number, r: number, start: number, sweep: number): Pt[] {
  const steps = Math.max(2, Math.ceil(Math.abs(sweep) / STEP));
  const out: Pt[] = [];
  for (let i = 0; i <= steps; i++) {
    const t = start + (sweep * i) / steps;
    out.push({ x: cx + r * Math.cos(t), y: cy + r * Math.sin(t) });
  }
  return out;
}

interface BulgeVertex {
  x: number;
  y: number;
  bulge?: number;
}

/** The points of a polyline with bulges (arc segments), without the closing repeat. */
function bulgePolyline(vertices: BulgeVertex[], closed: boolean): Pt[] {
  const out: Pt[] = [];
  const n = vertices.length;
  const segments = closed ? n : n - 1;
  for (let i = 0; i < n; i++) {
    out.push({ x: vertices[i].x, y: vertices[i].y });
    if (i >= segments) break;
    const a = vertices[i];
    const b = vertices[(i + 1) % n];
    const bulge = a.bulge ?? 0;
    if (Math.abs(bulge) < 1e-12) continue;
    // Included angle θ = 4·atan(bulge); positive bulge runs counter-clockwise from a to b.
    const theta = 4 * Math.atan(bulge);
    const chord = Math.hypot(b.x - a.x, b.y - a.y);
    if (chord < 1e-12) continue;
    const r = chord / (2 * Math.sin(Math.abs(theta) / 2));
    const h = r * Math.cos(Math.abs(theta) / 2);
    const sign = theta > 0 ? 1 : -1;
    // cos(|θ|/2) < 0 for arcs over 180°, which puts the centre on the other side of the chord.
    const cx = (a.x + b.x) / 2 + (-(b.y - a.y) / chord) * sign * h;
    const cy = (a.y + b.y) / 2 + ((b.x - a.x) / chord) * sign * h;
    const arc = sampleArc(cx, cy, r, Math.atan2(a.y - cy, a.x - cx), theta);
    out.push(...arc.slice(1, -1));
  }
  return out;
}

function sampleEllipse(any: EntityFields): { points: Pt[]; closed: boolean } | null {
  const c = any.center;
  const m = any.majorAxisEndPoint;
  const ratio = Number(any.axisRatio);
  if (!c || !m || !(ratio > 0)) return null;
  const start = Number(any.startAngle ?? 0);
  let end = Number(any.endAngle ?? 2 * Math.PI);
  while (end <= start) end += 2 * Math.PI;
  const sweep = end - start;
  const closed = Math.abs(sweep - 2 * Math.PI) < 1e-9;
  const steps = Math.max(8, Math.ceil(sweep / STEP));
  const points: Pt[] = [];
  for (let i = 0; i < (closed ? steps : steps + 1); i++) {
    const t = start + (sweep * i) / steps;
    points.push({
      x: c.x + Math.cos(t) * m.x - Math.sin(t) * ratio * m.y,
      y: c.y + Math.cos(t) * m.y + Math.sin(t) * ratio * m.x,
    });
  }
  return { points, closed };
}

/** A NURBS curve by de Boor's algorithm over its knot vector (weights default to 1). */
function sampleSpline(any: EntityFields): { points: Pt[]; closed: boolean } | null {
  const ctrl = (any.controlPoints ?? []) as Pt[];
  const p = Number(any.degreeOfSplineCurve ?? 3);
  const knots = (any.knotValues ?? []) as number[];
  if (ctrl.length < 2 || !(p >= 1) || knots.length !== ctrl.length + p + 1) {
    const fit = (any.fitPoints ?? []) as Pt[];
    if (fit.length < 2) return null;
    const closed = Boolean(any.closed) || dist(fit[0], fit[fit.length - 1]) < 1e-9;
    return { points: closed && fit.length > 2 ? fit.slice(0, -1) : fit, closed };
  }
  const w = (any.weights ?? []).length === ctrl.length ? any.weights! : null;
  const lo = knots[p];
  const hi = knots[ctrl.length];
  const spans = Math.max(1, ctrl.length - p);
  const steps = Math.min(4000, spans * 24);
  const points: Pt[] = [];
  for (let i = 0; i <= steps; i++) {
    const u = lo + ((hi - lo) * i) / steps;
    let k = p;
    while (k < ctrl.length - 1 && u >= knots[k + 1]) k++;
    const d = Array.from({ length: p + 1 }, (_, j) => {
      const q = ctrl[j + k - p];
      const wt = w ? w[j + k - p] : 1;
      return { x: q.x * wt, y: q.y * wt, w: wt };
    });
    for (let r = 1; r <= p; r++) {
      for (let j = p; j >= r; j--) {
        const denom = knots[j + 1 + k - r] - knots[j + k - p];
        const alpha = denom === 0 ? 0 : (u - knots[j + k - p]) / denom;
        d[j] = {
          x: (1 - alpha) * d[j - 1].x + alpha * d[j].x,
          y: (1 - alpha) * d[j - 1].y + alpha * d[j].y,
          w: (1 - alpha) * d[j - 1].w + alpha * d[j].w,
        };
      }
    }
    points.push({ x: d[p].x / d[p].w, y: d[p].y / d[p].w });
  }
  const closed = Boolean(any.closed) || dist(points[0], points[points.length - 1]) < 1e-9;
  return { points: closed ? points.slice(0, -1) : points, closed };
}

function dist(a: Pt, b: Pt): number {
  return Math.hypot(a.x - b.x, a.y - b.y);
}

/** Entity types that are annotation by nature: skipped without a second look. */
const ANNOTATION = new Set(["TEXT", "MTEXT", "DIMENSION", "ATTDEF", "ATTRIB", "LEADER", "MULTILEADER"]);

export interface FlatDrawing {
  primitives: Primitive[];
  skipped: SkippedEntity[];
  /** Every INSERT that was expanded, with its block's name. */
  inserts: (Origin & { block: string })[];
}

/** All model-space geometry of a parsed drawing, in drawing units. */
export function flattenDxf(parsed: IDxf): FlatDrawing {
  const primitives: Primitive[] = [];
  const skipped: SkippedEntity[] = [];
  const inserts: FlatDrawing["inserts"] = [];
  const blocks = (parsed.blocks ?? {}) as Record<string, { position?: Pt; entities?: IEntity[] }>;

  const walk = (entities: IEntity[], m: Affine, insertLayer: string | null, depth: number, via: boolean) => {
    for (const e of entities) {
      const any: EntityFields = e;
      if (any.inPaperSpace) continue;
      const rawLayer = e.layer ?? "0";
      const layer = insertLayer !== null && rawLayer === "0" ? insertLayer : rawLayer;
      const origin: Origin = { type: e.type, layer, viaInsert: via };
      const skip = (reason: string) => skipped.push({ ...origin, reason });
      const mm = compose(m, ocsFlip(e.type, any));
      const path = (pts: Pt[], closed: boolean, arc?: { cx: number; cy: number; r: number }) => {
        const s = similarityScale(mm);
        primitives.push({
          kind: "path",
          points: pts.map((q) => apply(mm, q)),
          closed,
          ...(arc && s !== null ? { arc: { ...centreOf(mm, arc), r: arc.r * s } } : {}),
          ...origin,
        });
      };
      switch (e.type) {
        case "CIRCLE": {
          const c = any.center;
          const radius = any.radius ?? 0;
          if (!(radius > 0) || !c) {
            skip("no radius");
            break;
          }
          const s = similarityScale(mm);
          if (s !== null)
            primitives.push({
              kind: "circle",
              ...centreOf(mm, { cx: c.x, cy: c.y }),
              r: radius * s,
              ...origin,
            });
          else {
            const pts = sampleArc(c.x, c.y, radius, 0, 2 * Math.PI).slice(0, -1);
            path(pts, true);
          }
          break;
        }
        case "ARC": {
          const c = any.center;
          const radius = any.radius ?? 0;
          if (!(radius > 0) || !c) {
            skip("no radius");
            break;
          }
          let sweep = (any.endAngle ?? 0) - (any.startAngle ?? 0);
          while (sweep <= 0) sweep += 2 * Math.PI;
          path(sampleArc(c.x, c.y, radius, any.startAngle ?? 0, sweep), false, {
            cx: c.x,
            cy: c.y,
            r: radius,
          });
          break;
        }
        case "LINE": {
          const v: Pt[] = any.vertices ?? [];
          if (v.length < 2 || dist(v[0], v[1]) === 0) skip("zero length");
          else path([v[0], v[1]], false);
          break;
        }
        case "LWPOLYLINE":
        case "POLYLINE": {
          if (any.is3dPolygonMesh || any.isPolyfaceMesh) {
            skip("a mesh, not a plane outline");
            break;
          }
          const vs = (any.vertices ?? []).filter((v) => Number.isFinite(v.x) && Number.isFinite(v.y));
          if (vs.length < 2) {
            skip("fewer than two vertices");
            break;
          }
          const repeats = vs.length > 2 && dist(vs[0], vs[vs.length - 1]) < 1e-9;
          const closed = Boolean(any.shape) || repeats;
          const pts = bulgePolyline(repeats ? vs.slice(0, -1) : vs, closed);
          if (closed && pts.length < 3) skip("fewer than three vertices");
          else path(pts, closed);
          break;
        }
        case "ELLIPSE": {
          const s = sampleEllipse(any);
          if (!s) skip("incomplete ellipse");
          else path(s.points, s.closed);
          break;
        }
        case "SPLINE": {
          const s = sampleSpline(any);
          if (!s) skip("a spline without usable control or fit points");
          else path(s.points, s.closed);
          break;
        }
        case "INSERT": {
          const block = blocks[any.name ?? ""];
          if (!block) {
            skip(`block "${String(any.name)}" is not in the file`);
            break;
          }
          if (depth >= MAX_DEPTH) {
            skip(`blocks nested deeper than ${MAX_DEPTH}`);
            break;
          }
          const base = block.position ?? { x: 0, y: 0 };
          const sx = Number(any.xScale ?? 1);
          const sy = Number(any.yScale ?? 1);
          const rot = (Number(any.rotation ?? 0) * Math.PI) / 180;
          const cos = Math.cos(rot);
          const sin = Math.sin(rot);
          const cols = Math.max(1, Number(any.columnCount ?? 1));
          const rows = Math.max(1, Number(any.rowCount ?? 1));
          const pos = any.position ?? { x: 0, y: 0 };
          inserts.push({ ...origin, block: String(any.name) });
          for (let i = 0; i < cols; i++) {
            for (let j = 0; j < rows; j++) {
              const ox = i * Number(any.columnSpacing ?? 0);
              const oy = j * Number(any.rowSpacing ?? 0);
              // world = pos + R·(offset + S·(p − base))
              const local: Affine = {
                a: cos * sx,
                b: sin * sx,
                c: -sin * sy,
                d: cos * sy,
                e: pos.x + cos * (ox - sx * base.x) - sin * (oy - sy * base.y),
                f: pos.y + sin * (ox - sx * base.x) + cos * (oy - sy * base.y),
              };
              walk(block.entities ?? [], compose(mm, local), layer, depth + 1, true);
            }
          }
          break;
        }
        default:
          skip(ANNOTATION.has(e.type) ? "annotation" : "not an outline or hole entity");
      }
    }
  };
  walk(parsed.entities ?? [], IDENTITY, null, 0, false);
  return { primitives, skipped, inserts };
}

function centreOf(m: Affine, c: { cx: number; cy: number }): { cx: number; cy: number } {
  const p = apply(m, { x: c.cx, y: c.cy });
  return { cx: p.x, cy: p.y };
}

/**
 * Model-space entity types and layers that dxf-parser drops without a trace (HATCH, SOLID
 * fills it does not know, IMAGE, …), counted from the raw group codes of the ENTITIES section.
 */
export function unreadEntities(text: string, read: ReadonlySet<string>): SkippedEntity[] {
  const lines = text.split(/\r\n|\r|\n/);
  const out: SkippedEntity[] = [];
  let inEntities = false;
  let current: SkippedEntity | null = null;
  for (let i = 0; i + 1 < lines.length; i += 2) {
    const code = lines[i].trim();
    const value = lines[i + 1].trim();
    if (code === "2" && !inEntities && value === "ENTITIES" && lines[i - 1]?.trim() === "SECTION")
      inEntities = true;
    if (!inEntities) continue;
    if (code === "0") {
      if (current) out.push(current);
      current = null;
      if (value === "ENDSEC") break;
      if (!read.has(value) && value !== "VERTEX" && value !== "SEQEND")
        current = { type: value, layer: "0", viaInsert: false, reason: "not read by the DXF reader" };
    } else if (code === "8" && current) current.layer = value;
  }
  return out;
}

interface Group {
  code: number;
  value: string & number & boolean;
}
interface Scanner {
  next(): Group;
  peek(): Group;
  isEOF(): boolean;
}

/** The groups every entity has (handle, layer, paper space); true when `curr` was one of them. */
function readCommonGroup(e: EntityFields & { handle?: string; layer?: string }, curr: Group): boolean {
  if (curr.code === 5) e.handle = curr.value;
  else if (curr.code === 8) e.layer = curr.value;
  else if (curr.code === 67) e.inPaperSpace = curr.value !== 0;
  else return false;
  return true;
}

/**
 * dxf-parser's SPLINE reader drops the weights (group 41), which makes every rational spline
 * (a NURBS arc or circle) the wrong curve; this one reads them, and the rest of the entity.
 */
class SplineReader {
  ForEntityName = "SPLINE";
  parseEntity(scanner: Scanner, curr: Group): object {
    const e: EntityFields & {
      type: string;
      handle?: string;
      layer?: string;
      periodic?: boolean;
      normalVector?: Pt;
    } & {
      controlPoints: Pt[];
      fitPoints: Pt[];
      knotValues: number[];
      weights: number[];
    } = {
      type: curr.value,
      controlPoints: [],
      fitPoints: [],
      knotValues: [],
      weights: [],
    };
    const point = (first: Group): Pt & { z?: number } => {
      const p: Pt & { z?: number } = { x: first.value, y: scanner.next().value };
      if (scanner.peek().code === first.code + 20) p.z = scanner.next().value;
      return p;
    };
    for (curr = scanner.next(); !scanner.isEOF() && curr.code !== 0; curr = scanner.next()) {
      if (readCommonGroup(e, curr)) continue;
      switch (curr.code) {
        case 10:
          e.controlPoints.push(point(curr));
          break;
        case 11:
          e.fitPoints.push(point(curr));
          break;
        case 12:
        case 13:
          point(curr);
          break;
        case 40:
          e.knotValues.push(curr.value);
          break;
        case 41:
          e.weights.push(curr.value);
          break;
        case 70:
          e.closed = (curr.value & 1) !== 0;
          e.periodic = (curr.value & 2) !== 0;
          break;
        case 71:
          e.degreeOfSplineCurve = curr.value;
          break;
        case 210:
          e.normalVector = point(curr);
          break;
        default:
          break;
      }
    }
    return e;
  }
}

/** dxf-parser's CIRCLE reader drops the extrusion (groups 210–230), so a mirrored circle lands on the wrong side. */
class CircleReader {
  ForEntityName = "CIRCLE";
  parseEntity(scanner: Scanner, curr: Group): object {
    const e: EntityFields & { type: string; handle?: string; layer?: string } = { type: curr.value };
    for (curr = scanner.next(); !scanner.isEOF() && curr.code !== 0; curr = scanner.next()) {
      if (readCommonGroup(e, curr)) continue;
      switch (curr.code) {
        case 10:
          e.center = { x: curr.value, y: 0 };
          break;
        case 20:
          if (e.center) e.center.y = curr.value;
          break;
        case 40:
          e.radius = curr.value;
          break;
        case 230:
          e.extrusionDirectionZ = curr.value;
          break;
        default:
          break;
      }
    }
    return e;
  }
}

// dxf-parser types a handler's entity as IEntity with every field required (and the handle a
// number); its own readers leave fields out and keep the handle as text, as ours do.
type Handler = Parameters<DxfParser["registerEntityHandler"]>[0];

/** dxf-parser with the SPLINE and CIRCLE readers above. */
export function parseDxfText(text: string): IDxf | null {
  const parser = new DxfParser();
  parser.registerEntityHandler(SplineReader as unknown as Handler);
  parser.registerEntityHandler(CircleReader as unknown as Handler);
  return parser.parseSync(text);
}
