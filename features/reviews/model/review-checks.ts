// Reads the checks out of a stored JointAnalysis. The result is JSON from the core
// (features/analysis/core/analyze.ts: each check `{id, title, value, limit, unit, status, source,
// note}`); it is read defensively because a frozen snapshot may come from an older core version.
import {
  ruleStatus,
  rulesNeedingJustification,
  type GroupableCheck,
  type RuleRow,
  type RuleStatus,
} from "@/features/analysis/rule-groups";

/** A check's status is one of its rule's: the same words everywhere. */
export type CheckStatus = RuleStatus;

/** A stored check; its bolt ids come from `boltIds` in the core's record, or `subject` in older results. */
export interface ReviewCheck extends GroupableCheck {
  status: CheckStatus;
  unit: string;
  source: string;
  note: string;
}

export const CHECK_STATUS_LABELS: Record<CheckStatus, string> = {
  pass: "Pass",
  warn: "Warn",
  fail: "Fail",
  "not-applicable": "Not applicable",
  "accepted-by-rating": "Accepted by its rating",
};

// In the rule's words (`ruleStatus`, so "rated" reads as accepted by its rating here too); anything
// unknown is a failure, so it can never slip through an approval.
const normaliseStatus = (raw: unknown): CheckStatus => (typeof raw === "string" ? ruleStatus(raw) : "fail");

const scalar = (v: unknown): number | string | null =>
  typeof v === "number" || typeof v === "string" ? v : null;
const text = (v: unknown): string => (typeof v === "string" ? v : "");

function boltIdsOf(check: Record<string, unknown>): string[] {
  for (const key of ["boltIds", "subject", "bolts"]) {
    const list = check[key];
    if (Array.isArray(list)) return list.filter((x): x is string => typeof x === "string");
  }
  if (typeof check.boltId === "string") return [check.boltId];
  return [];
}

export function readChecks(result: unknown): ReviewCheck[] {
  const list = (result as { checks?: unknown } | null)?.checks;
  if (!Array.isArray(list)) return [];
  return list
    .filter(
      (c): c is Record<string, unknown> =>
        typeof c === "object" && c !== null && typeof (c as { id?: unknown }).id === "string",
    )
    .map((c) => ({
      id: c.id as string,
      title: text(c.title) || (c.id as string),
      status: normaliseStatus(c.status),
      value: scalar(c.value),
      limit: scalar(c.limit),
      unit: text(c.unit),
      source: text(c.source),
      note: text(c.note),
      boltIds: boltIdsOf(c),
    }));
}

/** Checks an approver must justify in writing before approving (every warn and fail). */
export function checksNeedingJustification(checks: ReviewCheck[]): ReviewCheck[] {
  return checks.filter((c) => c.status === "warn" || c.status === "fail");
}

/**
 * Rules (see rule-groups.ts) with a warn/fail check and no non-blank justification. One written
 * justification per rule covers every pair or bolt of that rule that warns or fails.
 */
export function missingJustifications(
  checks: ReviewCheck[],
  justifications: Record<string, string>,
): RuleRow<ReviewCheck>[] {
  return rulesNeedingJustification(checks).filter((r) => !(justifications[r.rule] ?? "").trim());
}
