/**
 * "accepted-by-rating": a standard flange used within its pressure–temperature rating, on a rule
 * meant for flanges designed by rule (ASME VIII-1 UG-44(a)); neither a pass nor a failure.
 */
export type CheckStatus = "pass" | "warn" | "fail" | "not-applicable" | "accepted-by-rating";

/**
 * One check result. `id` is stable (e.g. "spacing.max-pitch:b3-b4") so the editor can point at
 * the bolts or the field concerned; pair and bolt checks name their bolts in `subject`. Values
 * are in the core's units (mm, N, MPa, mm²) or dimensionless, as `unit` says.
 */
export interface CheckRecord {
  id: string;
  title: string;
  value: number | null;
  limit: number | null;
  unit: string;
  status: CheckStatus;
  source: string;
  note: string;
  subject?: string[];
}

/** Finite number or null: results must never carry NaN or Infinity. */
export function finiteOrNull(v: number | null | undefined): number | null {
  return v === null || v === undefined || !Number.isFinite(v) ? null : v;
}

export function makeCheck(c: CheckRecord): CheckRecord {
  return { ...c, value: finiteOrNull(c.value), limit: finiteOrNull(c.limit) };
}

/** Counts of fail, warn and pass records (not-applicable and accepted-by-rating ones are not counted). */
export function countChecks(checks: readonly { status: CheckStatus }[]): {
  failCount: number;
  warnCount: number;
  passCount: number;
} {
  const counts = { failCount: 0, warnCount: 0, passCount: 0 };
  for (const c of checks) {
    if (c.status === "fail") counts.failCount++;
    else if (c.status === "warn") counts.warnCount++;
    else if (c.status === "pass") counts.passCount++;
  }
  return counts;
}
