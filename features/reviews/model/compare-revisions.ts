import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPoints } from "@/features/analysis/core/geometry";
import { groupByRule } from "@/features/analysis/rule-groups";
import { readChecks, type CheckStatus } from "./review-checks";

// Side-by-side comparison of two revisions: inputs that changed (a deep diff by field path),
// bolts moved (matched by id, not by position in the list) and checks whose status changed.

export interface FieldChange {
  /** e.g. "gasket.material.yMpa", "bolts[b3].sMm", "outline.points[2].x" */
  path: string;
  before: unknown;
  after: unknown;
}

export interface BoltMove {
  boltId: string;
  change: "moved" | "added" | "removed";
  /** Δ of model coordinates and of arc length along the bolt path, mm (after − before). */
  dxMm: number | null;
  dyMm: number | null;
  dsMm: number | null;
}

export interface CheckChange {
  checkId: string;
  title: string;
  before: CheckStatus | null;
  after: CheckStatus | null;
}

const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === "object" && v !== null && !Array.isArray(v);
const isIdList = (v: unknown): v is { id: string }[] =>
  Array.isArray(v) && v.length > 0 && v.every((x) => isObject(x) && typeof x.id === "string");

function walk(before: unknown, after: unknown, path: string, out: FieldChange[]): void {
  if (Object.is(before, after)) return;
  if (isObject(before) && isObject(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
    for (const key of keys) walk(before[key], after[key], path ? `${path}.${key}` : key, out);
    return;
  }
  // Lists of things with ids (bolts) are matched by id so that a deletion does not show as every
  // later item changing.
  if ((isIdList(before) || isIdList(after)) && Array.isArray(before) && Array.isArray(after)) {
    const byId = (list: unknown[]) => new Map((list as { id: string }[]).map((x) => [x.id, x]));
    const a = byId(before);
    const b = byId(after);
    for (const id of [...new Set([...a.keys(), ...b.keys()])])
      walk(a.get(id), b.get(id), `${path}[${id}]`, out);
    return;
  }
  if (Array.isArray(before) && Array.isArray(after)) {
    for (let i = 0; i < Math.max(before.length, after.length); i++)
      walk(before[i], after[i], `${path}[${i}]`, out);
    return;
  }
  out.push({ path, before: before ?? null, after: after ?? null });
}

export function diffDocuments(before: unknown, after: unknown): FieldChange[] {
  const out: FieldChange[] = [];
  walk(before, after, "", out);
  return out;
}

function boltPointsById(design: JointDesign): Map<string, { x: number; y: number; s: number }> {
  let points: { x: number; y: number }[] = [];
  try {
    points = getBoltPoints(design);
  } catch {
    // A document the geometry cannot place (older or damaged snapshot): compare arc lengths only.
  }
  return new Map(
    design.bolts.map((bolt, i) => [
      bolt.id,
      { x: points[i]?.x ?? Number.NaN, y: points[i]?.y ?? Number.NaN, s: bolt.sMm },
    ]),
  );
}

const delta = (a: number, b: number): number | null =>
  Number.isFinite(a) && Number.isFinite(b) ? b - a : null;

/** Bolts whose position changed by more than `toleranceMm`, plus added and removed bolts. */
export function listBoltMoves(before: JointDesign, after: JointDesign, toleranceMm = 1e-6): BoltMove[] {
  const a = boltPointsById(before);
  const b = boltPointsById(after);
  const moves: BoltMove[] = [];
  for (const id of [...new Set([...a.keys(), ...b.keys()])]) {
    const p = a.get(id);
    const q = b.get(id);
    if (p && q) {
      const dx = delta(p.x, q.x);
      const dy = delta(p.y, q.y);
      const ds = q.s - p.s;
      const moved = [dx, dy, ds].some((d) => d !== null && Math.abs(d) > toleranceMm);
      if (moved) moves.push({ boltId: id, change: "moved", dxMm: dx, dyMm: dy, dsMm: ds });
    } else {
      moves.push({ boltId: id, change: p ? "removed" : "added", dxMm: null, dyMm: null, dsMm: null });
    }
  }
  return moves;
}

export function listCheckChanges(beforeResult: unknown, afterResult: unknown): CheckChange[] {
  const a = new Map(readChecks(beforeResult).map((c) => [c.id, c]));
  const b = new Map(readChecks(afterResult).map((c) => [c.id, c]));
  const changes: CheckChange[] = [];
  for (const id of [...new Set([...a.keys(), ...b.keys()])]) {
    const before = a.get(id)?.status ?? null;
    const after = b.get(id)?.status ?? null;
    if (before !== after)
      changes.push({ checkId: id, title: (b.get(id) ?? a.get(id))!.title, before, after });
  }
  return changes;
}

/** The results a reviewer weighs first, read from a stored result (null where it has none). */
export interface KeyResults {
  minSeatStressMpa: number | null;
  seatingMpa: number | null;
  /** ASME VIII-1 Appendix 2: required bolt area Am against the bolts' root area Ab, mm². */
  requiredAreaMm2: number | null;
  actualRootAreaMm2: number | null;
  worstPitchMm: number | null;
  failingRules: number | null;
}

const finite = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

export function readKeyResults(result: unknown): KeyResults {
  const r = (result ?? {}) as {
    gasketStress?: { minMpa?: unknown; seatingMpa?: unknown };
    asmeAppendix2?: { requiredAreaMm2?: unknown; actualRootAreaMm2?: unknown };
    bolts?: { pitchToNextMm?: unknown }[];
    checks?: unknown;
  };
  const pitches = Array.isArray(r.bolts)
    ? r.bolts.map((b) => finite(b?.pitchToNextMm)).filter((p): p is number => p !== null)
    : [];
  const checks = readChecks(result);
  return {
    minSeatStressMpa: finite(r.gasketStress?.minMpa),
    seatingMpa: finite(r.gasketStress?.seatingMpa),
    requiredAreaMm2: finite(r.asmeAppendix2?.requiredAreaMm2),
    actualRootAreaMm2: finite(r.asmeAppendix2?.actualRootAreaMm2),
    worstPitchMm: pitches.length > 0 ? Math.max(...pitches) : null,
    failingRules: Array.isArray(r.checks)
      ? groupByRule(checks).filter((row) => row.status === "fail").length
      : null,
  };
}
