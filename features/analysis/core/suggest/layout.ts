/**
 * Bolt layouts for the pattern search: n bolts on a closed bolt path of length L (mm, s clockwise
 * from the top centre line), spaced equally between anchors. Anchors are the fixed bolts and, by
 * default, the two edges of every keep-out zone (a bolt whose hole just clears the zone), so a
 * keep-out is bridged by one wider gap and the rest of the path keeps the narrowest pitch the
 * count allows. An edge anchor may be dropped (`EdgeAnchors`): the span then reaches into the zone
 * and holds only counts whose equally spaced bolts leave it free (none: one gap bridges it).
 * Without anchors the bolts straddle the centre lines (the first half a pitch after s = 0).
 *
 * Example: L = 400, n = 4, no anchors → s = 50, 150, 250, 350.
 */
import type { BoltPlacement } from "../design";

/** A closed interval of the path that must hold no bolt hole, s from `fromMm` clockwise to `toMm` (wraps). */
export interface PathInterval {
  fromMm: number;
  toMm: number;
}

export interface LayoutFrame {
  pathLengthMm: number;
  /** Fixed bolts on this path (their s; id and off-path distance are kept). */
  fixed: BoltPlacement[];
  /** Keep-out intervals already widened by half the hole diameter, merged, on this path. */
  keepOuts: PathInterval[];
}

interface Span {
  fromMm: number;
  lengthMm: number;
  /** A span inside a keep-out holds no bolts. */
  blocked: boolean;
  /** Keep-outs that reach into the span (an edge anchor of theirs was dropped), or none. */
  zones: PathInterval[];
}

const wrap = (s: number, L: number) => ((s % L) + L) % L;

/** Length of an interval clockwise from `fromMm` to `toMm`, mm. */
export function intervalLengthMm(iv: PathInterval, L: number): number {
  const len = wrap(iv.toMm - iv.fromMm, L);
  return len === 0 && iv.toMm !== iv.fromMm ? L : len;
}

/** True when s lies in the interval (ends included, with a tolerance of 1 µm). */
export function inInterval(sMm: number, iv: PathInterval, L: number): boolean {
  return wrap(sMm - iv.fromMm, L) <= intervalLengthMm(iv, L) + 1e-3 || wrap(iv.fromMm - sMm, L) < 1e-3;
}

/** Widens each interval by `marginMm` at both ends and merges overlapping ones (sorted by start). */
export function widenAndMerge(intervals: PathInterval[], marginMm: number, L: number): PathInterval[] {
  const items = intervals
    .map((iv) => {
      const len = Math.min(L, intervalLengthMm(iv, L) + 2 * marginMm);
      return { from: wrap(iv.fromMm - marginMm, L), len };
    })
    .sort((a, b) => a.from - b.from);
  if (items.some((x) => x.len >= L)) return [{ fromMm: 0, toMm: L }];
  const merged: { from: number; len: number }[] = [];
  for (const it of items) {
    const last = merged[merged.length - 1];
    if (last && it.from <= last.from + last.len) last.len = Math.max(last.len, it.from + it.len - last.from);
    else merged.push({ ...it });
  }
  // The last interval may wrap over s = 0 into the first.
  if (merged.length > 1) {
    const first = merged[0];
    const last = merged[merged.length - 1];
    if (last.from + last.len >= first.from + L) {
      last.len = Math.max(last.len, first.from + L + first.len - last.from);
      merged.shift();
    }
  }
  if (merged.some((x) => x.len >= L)) return [{ fromMm: 0, toMm: L }];
  return merged.map((x) => ({ fromMm: x.from, toMm: wrap(x.from + x.len, L) }));
}

interface Anchor {
  sMm: number;
  bolt: BoltPlacement | null;
}

/**
 * Which keep-out edges are anchors: entry 2i is zone i's start edge, 2i + 1 its end edge (zones
 * in `frame.keepOuts` order). Omitted: every edge (the first variant of `edgeVariants`).
 */
export type EdgeAnchors = readonly boolean[];

/** Zones with optional edge anchors at most (4^3 − 1 variants); beyond, every edge is an anchor. */
export const OPTIONAL_EDGE_ZONES = 3;

function anchorsOf(frame: LayoutFrame, edges?: EdgeAnchors): Anchor[] {
  const L = frame.pathLengthMm;
  const list: Anchor[] = frame.fixed.map((b) => ({ sMm: wrap(b.sMm, L), bolt: b }));
  frame.keepOuts.forEach((iv, z) =>
    [iv.fromMm, iv.toMm].forEach((s, e) => {
      if (edges && !edges[2 * z + e]) return;
      const sw = wrap(s, L);
      if (!list.some((a) => Math.abs(a.sMm - sw) < 1e-6 || Math.abs(Math.abs(a.sMm - sw) - L) < 1e-6))
        list.push({ sMm: sw, bolt: null });
    }),
  );
  return list.sort((a, b) => a.sMm - b.sMm);
}

/** True when s lies strictly inside the interval (a hole centred on its end just clears it). */
function strictlyInside(sMm: number, iv: PathInterval, L: number): boolean {
  const t = wrap(sMm - iv.fromMm, L);
  return t > 1e-6 && t < intervalLengthMm(iv, L) - 1e-6;
}

function spansOf(frame: LayoutFrame, anchors: Anchor[]): Span[] {
  const L = frame.pathLengthMm;
  return anchors.map((a, i) => {
    const next = anchors[(i + 1) % anchors.length];
    let len = next.sMm - a.sMm;
    if (i === anchors.length - 1) len += L;
    const mid = a.sMm + len / 2;
    const blocked = frame.keepOuts.some(
      (iv) => inInterval(mid, iv, L) && intervalLengthMm(iv, L) >= len - 1e-6,
    );
    // A zone reaches into the span when it starts inside it or runs over its start.
    const zones = blocked
      ? []
      : frame.keepOuts.filter((iv) => {
          const o = wrap(iv.fromMm - a.sMm, L);
          return o < len - 1e-6 || o + intervalLengthMm(iv, L) > L + 1e-6;
        });
    return { fromMm: a.sMm, lengthMm: len, blocked, zones };
  });
}

/** True when k bolts spaced equally inside the span leave its keep-outs free. */
function clearWith(span: Span, k: number, L: number): boolean {
  if (span.zones.length === 0) return true;
  const pitch = span.lengthMm / (k + 1);
  for (let j = 1; j <= k; j++) {
    const s = span.fromMm + j * pitch;
    if (span.zones.some((iv) => strictlyInside(s, iv, L))) return false;
  }
  return true;
}

/**
 * The edge-anchor variants the search tries, the first with every edge (today's layout), then
 * by the number of dropped edges and in a fixed order: each keep-out's edges may be dropped, so
 * a span across it, or across two close zones, may hold fewer bolts or none. Variants with no
 * anchor at all, and ones giving the same anchors as an earlier variant, are left out. With
 * more than `OPTIONAL_EDGE_ZONES` zones only the first variant is tried.
 */
export function edgeVariants(frame: LayoutFrame): EdgeAnchors[] {
  const K = frame.keepOuts.length;
  const all = Array.from({ length: 2 * K }, () => true);
  if (K === 0 || K > OPTIONAL_EDGE_ZONES) return [all];
  const masks = Array.from({ length: 1 << (2 * K) }, (_, m) => m);
  const dropped = (m: number) => m.toString(2).replace(/0/g, "").length;
  masks.sort((a, b) => dropped(a) - dropped(b) || a - b);
  const seen = new Set<string>();
  const out: EdgeAnchors[] = [];
  for (const m of masks) {
    const edges = all.map((_, i) => (m & (1 << i)) === 0);
    const anchors = anchorsOf(frame, edges);
    if (anchors.length === 0) continue;
    const key = anchors.map((a) => a.sMm.toFixed(6)).join(",");
    if (seen.has(key)) continue;
    seen.add(key);
    out.push(edges);
  }
  return out;
}

/**
 * The counts whose layouts can keep every pitch within [minPitchMm, maxPitchMm] (necessary for
 * the spacing rules: the chord is never longer than the pitch). `lo > hi` when none can; `gapMm`
 * is the widest gap across a keep-out, which no count narrows; `short` is the shortest span
 * between anchors (fixed bolts, keep-out ends) when it is below `minPitchMm`, which no count
 * widens (`acrossKeepOut`: the span bridges a keep-out). `edges`: the keep-out edges that are
 * anchors (default every one); a span a keep-out reaches into counts only the bolt counts that
 * leave the zone free.
 */
export function countBounds(
  frame: LayoutFrame,
  maxPitchMm: number,
  minPitchMm: number,
  edges?: EdgeAnchors,
): {
  lo: number;
  hi: number;
  gapMm: number;
  short: { lengthMm: number; acrossKeepOut: boolean } | null;
} {
  const L = frame.pathLengthMm;
  const anchors = anchorsOf(frame, edges);
  if (anchors.length === 0)
    return {
      lo: Math.ceil(L / maxPitchMm - 1e-9),
      hi: Math.floor(L / minPitchMm + 1e-9),
      gapMm: 0,
      short: null,
    };
  const spans = spansOf(frame, anchors);
  let lo = anchors.length;
  let hi = anchors.length;
  let gapMm = 0;
  let impossible = false;
  let short: { lengthMm: number; acrossKeepOut: boolean } | null = null;
  for (const s of spans) {
    if (s.lengthMm < minPitchMm - 1e-9) {
      impossible = true;
      const across = s.blocked || s.zones.length > 0;
      if (!short || s.lengthMm < short.lengthMm) short = { lengthMm: s.lengthMm, acrossKeepOut: across };
    }
    if (s.blocked) {
      gapMm = Math.max(gapMm, s.lengthMm);
      if (s.lengthMm > maxPitchMm + 1e-9) impossible = true;
      continue;
    }
    const kLo = Math.max(0, Math.ceil(s.lengthMm / maxPitchMm - 1e-9) - 1);
    const kHi = Math.max(0, Math.floor(s.lengthMm / minPitchMm + 1e-9) - 1);
    if (s.zones.length === 0) {
      lo += kLo;
      hi += kHi;
      continue;
    }
    let a = kLo;
    while (a <= kHi && !clearWith(s, a, L)) a++;
    let b = kHi;
    while (b >= a && !clearWith(s, b, L)) b--;
    if (a > kHi) {
      impossible = true;
      continue;
    }
    lo += a;
    hi += b;
  }
  return impossible ? { lo, hi: Math.min(hi, lo - 1), gapMm, short } : { lo, hi, gapMm, short };
}

/**
 * Places `count` bolts. Returns null when the count is below the number of anchors, or when
 * there is no span to put the extra bolts in. Ids: fixed bolts keep theirs; the others are
 * b1, b2, … in path order, skipping ids the fixed bolts use. The result is sorted by s.
 * `edges`: the keep-out edges that are anchors (default every one); an extra bolt goes only
 * where the span's bolts, spaced equally, leave every keep-out free.
 */
export function layoutBolts(frame: LayoutFrame, count: number, edges?: EdgeAnchors): BoltPlacement[] | null {
  const L = frame.pathLengthMm;
  const anchors = anchorsOf(frame, edges);
  const placed: { sMm: number; bolt: BoltPlacement | null }[] = [];
  if (anchors.length === 0) {
    if (frame.keepOuts.length > 0) return null;
    const pitch = L / count;
    for (let i = 0; i < count; i++) placed.push({ sMm: (i + 0.5) * pitch, bolt: null });
  } else {
    if (count < anchors.length) return null;
    const spans = spansOf(frame, anchors);
    const free = spans.map((s, i) => ({ i, s })).filter((x) => !x.s.blocked);
    const extra = count - anchors.length;
    if (extra > 0 && free.length === 0) return null;
    // Give each extra bolt to the free span whose pitch is widest now (ties: the earlier span).
    // A span a keep-out reaches into takes the next count whose bolts leave it free (maybe several at once).
    const k = spans.map(() => 0);
    const nextClear = (i: number, left: number): number => {
      for (let q = k[i] + 1; q <= k[i] + left; q++) if (clearWith(spans[i], q, L)) return q;
      return -1;
    };
    for (let left = extra; left > 0;) {
      let best = -1;
      let bestK = -1;
      for (const { i, s } of free) {
        if (best >= 0 && !(s.lengthMm / (k[i] + 1) > spans[best].lengthMm / (k[best] + 1) + 1e-9)) continue;
        const q = s.zones.length === 0 ? k[i] + 1 : nextClear(i, left);
        if (q > 0) [best, bestK] = [i, q];
      }
      if (best < 0) return null;
      left -= bestK - k[best];
      k[best] = bestK;
    }
    spans.forEach((s, i) => {
      placed.push({ sMm: s.fromMm, bolt: anchors[i].bolt });
      const pitch = s.lengthMm / (k[i] + 1);
      for (let j = 1; j <= k[i]; j++) placed.push({ sMm: wrap(s.fromMm + j * pitch, L), bolt: null });
    });
  }
  placed.sort((a, b) => a.sMm - b.sMm);
  const used = new Set(frame.fixed.map((b) => b.id));
  let next = 1;
  return placed.map((p) => {
    if (p.bolt) return p.bolt;
    while (used.has(`b${next}`)) next++;
    const id = `b${next++}`;
    return { id, sMm: p.sMm };
  });
}
