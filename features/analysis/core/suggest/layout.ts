/**
 * Bolt layouts for the pattern search: n bolts on a closed bolt path of length L (mm, s clockwise
 * from the top centre line), spaced equally between anchors. Anchors are the fixed bolts and the
 * two edges of every keep-out zone (a bolt whose hole just clears the zone), so a keep-out is
 * bridged by one wider gap and the rest of the path keeps the narrowest pitch the count allows.
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
  /** A span across a keep-out holds no bolts. */
  blocked: boolean;
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

function anchorsOf(frame: LayoutFrame): Anchor[] {
  const L = frame.pathLengthMm;
  const list: Anchor[] = frame.fixed.map((b) => ({ sMm: wrap(b.sMm, L), bolt: b }));
  for (const iv of frame.keepOuts)
    for (const s of [iv.fromMm, iv.toMm]) {
      const sw = wrap(s, L);
      if (!list.some((a) => Math.abs(a.sMm - sw) < 1e-6 || Math.abs(Math.abs(a.sMm - sw) - L) < 1e-6))
        list.push({ sMm: sw, bolt: null });
    }
  return list.sort((a, b) => a.sMm - b.sMm);
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
    return { fromMm: a.sMm, lengthMm: len, blocked };
  });
}

/**
 * The counts whose layouts can keep every pitch within [minPitchMm, maxPitchMm] (necessary for
 * the spacing rules: the chord is never longer than the pitch). `lo > hi` when none can; `gapMm`
 * is the widest gap across a keep-out, which no count narrows; `short` is the shortest span
 * between anchors (fixed bolts, keep-out ends) when it is below `minPitchMm`, which no count
 * widens (`acrossKeepOut`: the span bridges a keep-out).
 */
export function countBounds(
  frame: LayoutFrame,
  maxPitchMm: number,
  minPitchMm: number,
): {
  lo: number;
  hi: number;
  gapMm: number;
  short: { lengthMm: number; acrossKeepOut: boolean } | null;
} {
  const L = frame.pathLengthMm;
  const anchors = anchorsOf(frame);
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
      if (!short || s.lengthMm < short.lengthMm) short = { lengthMm: s.lengthMm, acrossKeepOut: s.blocked };
    }
    if (s.blocked) {
      gapMm = Math.max(gapMm, s.lengthMm);
      if (s.lengthMm > maxPitchMm + 1e-9) impossible = true;
      continue;
    }
    lo += Math.max(0, Math.ceil(s.lengthMm / maxPitchMm - 1e-9) - 1);
    hi += Math.max(0, Math.floor(s.lengthMm / minPitchMm + 1e-9) - 1);
  }
  return impossible ? { lo, hi: Math.min(hi, lo - 1), gapMm, short } : { lo, hi, gapMm, short };
}

/**
 * Places `count` bolts. Returns null when the count is below the number of anchors, or when
 * there is no free span to put the extra bolts in. Ids: fixed bolts keep theirs; the others are
 * b1, b2, … in path order, skipping ids the fixed bolts use. The result is sorted by s.
 */
export function layoutBolts(frame: LayoutFrame, count: number): BoltPlacement[] | null {
  const L = frame.pathLengthMm;
  const anchors = anchorsOf(frame);
  const placed: { sMm: number; bolt: BoltPlacement | null }[] = [];
  if (anchors.length === 0) {
    const pitch = L / count;
    for (let i = 0; i < count; i++) placed.push({ sMm: (i + 0.5) * pitch, bolt: null });
  } else {
    if (count < anchors.length) return null;
    const spans = spansOf(frame, anchors);
    const free = spans.map((s, i) => ({ i, s })).filter((x) => !x.s.blocked);
    const extra = count - anchors.length;
    if (extra > 0 && free.length === 0) return null;
    // Give each extra bolt to the free span whose pitch is widest now (ties: the earlier span).
    const k = spans.map(() => 0);
    for (let e = 0; e < extra; e++) {
      let best = free[0].i;
      for (const { i, s } of free)
        if (s.lengthMm / (k[i] + 1) > spans[best].lengthMm / (k[best] + 1) + 1e-9) best = i;
      k[best]++;
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
