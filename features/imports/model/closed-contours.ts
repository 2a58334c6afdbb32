// Closed contours from flattened DXF primitives: circles, closed paths (polylines, ellipses,
// splines), and chains of open pieces (LINE, ARC, open polylines) joined end to end where their
// ends meet within a tolerance. A chain made only of arcs of one circle is that circle again.
import type { Origin, Primitive, Pt } from "./dxf-entities";

export type { Pt };

interface ContourBase {
  /** The entities that make it, by type ("LINE" → 4, "ARC" → 4). */
  parts: Record<string, number>;
  members: Origin[];
  layers: string[];
  viaInsert: boolean;
}

export type Contour =
  | ({ kind: "circle"; cx: number; cy: number; r: number } & ContourBase)
  | ({ kind: "polyline"; points: Pt[] } & ContourBase);

export interface OpenChain {
  parts: Record<string, number>;
  members: Origin[];
  layers: string[];
  gapAt: Pt;
}

function base(members: Origin[]): ContourBase {
  const parts: Record<string, number> = {};
  for (const m of members) parts[m.type] = (parts[m.type] ?? 0) + 1;
  return {
    parts,
    members,
    layers: [...new Set(members.map((m) => m.layer))],
    viaInsert: members.some((m) => m.viaInsert),
  };
}

const dist = (a: Pt, b: Pt) => Math.hypot(a.x - b.x, a.y - b.y);

/** Chains open paths whose ends meet within `tol` (drawing units); closed loops become contours. */
export function collectClosedContours(
  primitives: Primitive[],
  tol: number,
): { contours: Contour[]; open: OpenChain[] } {
  const contours: Contour[] = [];
  const pieces: Extract<Primitive, { kind: "path" }>[] = [];
  for (const p of primitives) {
    if (p.kind === "circle") contours.push({ kind: "circle", cx: p.cx, cy: p.cy, r: p.r, ...base([p]) });
    else if (p.closed) {
      if (p.points.length >= 3) contours.push({ kind: "polyline", points: p.points, ...base([p]) });
    } else pieces.push(p);
  }

  // Spatial hash of piece ends, cell = tol.
  const cell = (q: Pt) => `${Math.floor(q.x / tol)},${Math.floor(q.y / tol)}`;
  const ends = new Map<string, { piece: number; atStart: boolean }[]>();
  pieces.forEach((p, i) => {
    for (const atStart of [true, false]) {
      const q = atStart ? p.points[0] : p.points[p.points.length - 1];
      const k = cell(q);
      ends.set(k, [...(ends.get(k) ?? []), { piece: i, atStart }]);
    }
  });
  const used = new Array<boolean>(pieces.length).fill(false);
  const near = (q: Pt): { piece: number; atStart: boolean } | null => {
    const cx = Math.floor(q.x / tol);
    const cy = Math.floor(q.y / tol);
    let best: { piece: number; atStart: boolean; d: number } | null = null;
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++)
        for (const end of ends.get(`${cx + dx},${cy + dy}`) ?? []) {
          if (used[end.piece]) continue;
          const p = pieces[end.piece].points;
          const d = dist(q, end.atStart ? p[0] : p[p.length - 1]);
          if (d <= tol && (!best || d < best.d)) best = { ...end, d };
        }
    return best;
  };

  const open: OpenChain[] = [];
  for (let i = 0; i < pieces.length; i++) {
    if (used[i]) continue;
    used[i] = true;
    const members = [pieces[i]];
    const points = [...pieces[i].points];
    let closed = false;
    // Extend at the end; when that stops, extend at the start.
    for (const direction of ["end", "start"] as const) {
      for (;;) {
        const tip = direction === "end" ? points[points.length - 1] : points[0];
        const head = direction === "end" ? points[0] : points[points.length - 1];
        if (members.length > 1 && dist(tip, head) <= tol) {
          closed = true;
          break;
        }
        const next = near(tip);
        if (!next) break;
        used[next.piece] = true;
        const p = pieces[next.piece];
        members.push(p);
        const pts = next.atStart ? p.points : [...p.points].reverse();
        if (direction === "end") points.push(...pts.slice(1));
        else points.unshift(...[...pts].reverse().slice(0, -1));
      }
      if (closed) break;
    }
    if (closed) {
      if (dist(points[0], points[points.length - 1]) <= tol) points.pop();
      const arcs = members.map((m) => m.arc);
      const first = arcs[0];
      const oneCircle =
        first &&
        arcs.every(
          (a) => a && Math.hypot(a.cx - first.cx, a.cy - first.cy) <= tol && Math.abs(a.r - first.r) <= tol,
        );
      if (oneCircle)
        contours.push({ kind: "circle", cx: first.cx, cy: first.cy, r: first.r, ...base(members) });
      else if (points.length >= 3) contours.push({ kind: "polyline", points, ...base(members) });
    } else {
      const b = base(members);
      open.push({ parts: b.parts, members, layers: b.layers, gapAt: points[points.length - 1] });
    }
  }
  return { contours, open };
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

function segmentDistance(p: Pt, a: Pt, b: Pt): number {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  return Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy));
}

/** Whether a circle lies wholly inside a contour (touching within `tol` allowed). */
export function circleInside(c: Contour, x: number, y: number, r: number, tol: number): boolean {
  if (c.kind === "circle") return Math.hypot(x - c.cx, y - c.cy) + r <= c.r + tol;
  if (!pointInPolygon(c.points, x, y)) return false;
  for (let i = 0; i < c.points.length; i++)
    if (segmentDistance({ x, y }, c.points[i], c.points[(i + 1) % c.points.length]) < r - tol) return false;
  return true;
}

/** Bounding box of a contour in drawing units. */
export function contourBox(c: Contour): { minX: number; minY: number; maxX: number; maxY: number } {
  if (c.kind === "circle") return { minX: c.cx - c.r, minY: c.cy - c.r, maxX: c.cx + c.r, maxY: c.cy + c.r };
  const xs = c.points.map((p) => p.x);
  const ys = c.points.map((p) => p.y);
  return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
}

/** "4 LINE + 4 ARC" */
export function describeParts(parts: Record<string, number>): string {
  return Object.entries(parts)
    .sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0]))
    .map(([t, n]) => `${n} ${t}`)
    .join(" + ");
}
