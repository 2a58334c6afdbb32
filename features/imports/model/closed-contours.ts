// Closed contours of a parsed DXF (circles and closed polylines) as point lists in drawing units.
// Polyline bulges (arc segments) are sampled at ≤ 2° so rounded corners keep their shape.
import type { IEntity } from "dxf-parser";

export interface Pt {
  x: number;
  y: number;
}

/** The members of CIRCLE and (LW)POLYLINE entities read here (dxf-parser types them per entity class). */
interface DxfFields {
  center?: Pt;
  radius?: number;
  vertices?: unknown[];
  shape?: boolean;
}

export type Contour =
  | { kind: "circle"; cx: number; cy: number; r: number; layer: string }
  | { kind: "polyline"; points: Pt[]; layer: string };

interface BulgeVertex {
  x: number;
  y: number;
  bulge?: number;
}

function sampleBulge(a: BulgeVertex, b: BulgeVertex, out: Pt[]): void {
  const bulge = a.bulge ?? 0;
  if (Math.abs(bulge) < 1e-12) return;
  // Included angle θ = 4·atan(bulge); positive bulge runs counter-clockwise from a to b.
  const theta = 4 * Math.atan(bulge);
  const chord = Math.hypot(b.x - a.x, b.y - a.y);
  const r = chord / (2 * Math.sin(Math.abs(theta) / 2));
  const mx = (a.x + b.x) / 2;
  const my = (a.y + b.y) / 2;
  const h = r * Math.cos(Math.abs(theta) / 2);
  const sign = theta > 0 ? 1 : -1;
  const nx = (-(b.y - a.y) / chord) * sign;
  const ny = ((b.x - a.x) / chord) * sign;
  // cos(|θ|/2) < 0 for arcs over 180°, which puts the centre on the other side of the chord.
  const cx = mx + nx * h;
  const cy = my + ny * h;
  const start = Math.atan2(a.y - cy, a.x - cx);
  const steps = Math.max(2, Math.ceil(Math.abs(theta) / (Math.PI / 90)));
  for (let i = 1; i < steps; i++) {
    const t = start + (theta * i) / steps;
    out.push({ x: cx + r * Math.cos(t), y: cy + r * Math.sin(t) });
  }
}

function polylinePoints(vertices: BulgeVertex[], closedFlag: boolean): Pt[] | null {
  if (vertices.length < 3) return null;
  const first = vertices[0];
  const last = vertices[vertices.length - 1];
  const repeatsFirst = Math.hypot(first.x - last.x, first.y - last.y) < 1e-9;
  if (!closedFlag && !repeatsFirst) return null;
  const vs = repeatsFirst ? vertices.slice(0, -1) : vertices;
  const out: Pt[] = [];
  for (let i = 0; i < vs.length; i++) {
    out.push({ x: vs[i].x, y: vs[i].y });
    sampleBulge(vs[i], vs[(i + 1) % vs.length], out);
  }
  return out.length >= 3 ? out : null;
}

export function collectClosedContours(entities: IEntity[]): { contours: Contour[]; skipped: number } {
  const contours: Contour[] = [];
  let skipped = 0;
  for (const e of entities) {
    const fields = e as IEntity & DxfFields;
    if (e.type === "CIRCLE" && fields.center && fields.radius !== undefined && fields.radius > 0) {
      contours.push({
        kind: "circle",
        cx: fields.center.x,
        cy: fields.center.y,
        r: fields.radius,
        layer: e.layer ?? "0",
      });
    } else if (e.type === "LWPOLYLINE" || e.type === "POLYLINE") {
      const pts = polylinePoints((fields.vertices ?? []) as BulgeVertex[], Boolean(fields.shape));
      if (pts) contours.push({ kind: "polyline", points: pts, layer: e.layer ?? "0" });
      else skipped++;
    } else {
      skipped++;
    }
  }
  return { contours, skipped };
}

export function polygonArea(points: Pt[]): number {
  let a = 0;
  for (let i = 0; i < points.length; i++) {
    const p = points[i];
    const q = points[(i + 1) % points.length];
    a += p.x * q.y - q.x * p.y;
  }
  return Math.abs(a) / 2;
}

export function contourArea(c: Contour): number {
  return c.kind === "circle" ? Math.PI * c.r * c.r : polygonArea(c.points);
}

export function pointInPolygon(points: Pt[], x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = points.length - 1; i < points.length; j = i++) {
    const a = points[i];
    const b = points[j];
    if (a.y > y !== b.y > y && x < ((b.x - a.x) * (y - a.y)) / (b.y - a.y) + a.x) inside = !inside;
  }
  return inside;
}
