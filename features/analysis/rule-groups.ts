/**
 * Rule rows: the checks of a result grouped by the rule they apply. The core writes one record per
 * pair or per bolt ("spacing.max-pitch:b3-b4"); the part before the colon names the rule. Every
 * screen and sheet that lists checks (Readout, sign-off sheet, bolt-spacing sheet) shows one row
 * per rule through this module, and approvals are justified per rule. Pure: no React, no server.
 * Works for any rule id, including ones this module has never heard of.
 */
export type RuleStatus = "pass" | "warn" | "fail" | "not-applicable" | "accepted-by-rating";

/** The least a check needs to be grouped (the core's record, the review's and the sheet's all fit). */
export interface GroupableCheck {
  id: string;
  title: string;
  status: string;
  value: number | string | null;
  limit: number | string | null;
  boltIds: string[];
}

export interface RuleRow<C extends GroupableCheck> {
  /** The rule id ("spacing.max-pitch"): a key, never shown. */
  rule: string;
  title: string;
  /** Worst status over the rule's checks. */
  status: RuleStatus;
  /** Every check of the rule, in stored order. */
  checks: C[];
  /** The governing check: worst status, then the smallest margin against its limit. */
  worst: C;
  counts: Record<RuleStatus, number>;
  /** Checks that warn or fail (the ones a justification covers). */
  open: C[];
  /** Bolts of the open checks (of every check when none is open), for the drawing. */
  boltIds: string[];
  /** What one check of this rule is about: a pair of bolts, one bolt, or the whole joint. */
  subject: "pair" | "bolt" | "joint";
  /**
   * Value over limit as a use of the limit (1 = at the limit, above 1 = beyond it) for the worst
   * check, when both are numbers and the direction of the limit is known; null otherwise.
   */
  use: number | null;
  /** Whether the limit is a floor ("at-least") or a ceiling ("at-most"), when it can be told. */
  sense: "at-least" | "at-most" | null;
}

// "accepted-by-rating": a rule meant for flanges designed by rule, on a catalogue flange used within its
// pressure-temperature rating (ASME VIII-1 UG-44(a)); neither a pass nor a fail, and never asks for a justification.
const RANK: Record<RuleStatus, number> = {
  fail: 4,
  warn: 3,
  "accepted-by-rating": 2,
  pass: 1,
  "not-applicable": 0,
};
export const RULE_ORDER: Record<RuleStatus, number> = {
  fail: 0,
  warn: 1,
  "accepted-by-rating": 2,
  pass: 3,
  "not-applicable": 4,
};

/** The rule a check id belongs to: the part before the first colon (the whole id when there is none). */
export function ruleOf(checkId: string): string {
  const i = checkId.indexOf(":");
  return i < 0 ? checkId : checkId.slice(0, i);
}

export function ruleStatus(raw: string): RuleStatus {
  if (
    raw === "pass" ||
    raw === "warn" ||
    raw === "fail" ||
    raw === "not-applicable" ||
    raw === "accepted-by-rating"
  )
    return raw;
  if (raw === "rated") return "accepted-by-rating";
  if (raw === "na" || raw === "n/a") return "not-applicable";
  return "fail";
}

const num = (v: unknown): number | null => (typeof v === "number" && Number.isFinite(v) ? v : null);

/**
 * Whether the rule's limit is a floor or a ceiling, read from checks whose status decides it:
 * a pass above the limit (or a fail below it) means a floor, and the other way round a ceiling.
 */
function senseOf(checks: GroupableCheck[]): "at-least" | "at-most" | null {
  for (const c of checks) {
    const v = num(c.value);
    const l = num(c.limit);
    if (v === null || l === null || v === l) continue;
    const st = ruleStatus(c.status);
    if (st === "pass") return v > l ? "at-least" : "at-most";
    if (st === "fail") return v < l ? "at-least" : "at-most";
  }
  return null;
}

function limitUseOf(c: GroupableCheck, sense: "at-least" | "at-most" | null): number | null {
  const v = num(c.value);
  const l = num(c.limit);
  if (v === null || l === null || sense === null) return null;
  if (sense === "at-most") return l === 0 ? null : v / l;
  return v === 0 ? (l > 0 ? Infinity : null) : l / v;
}

/** Groups checks by rule: failing rules first, then warning, passing and not-applicable ones. */
export function groupByRule<C extends GroupableCheck>(checks: readonly C[]): RuleRow<C>[] {
  const byRule = new Map<string, C[]>();
  for (const c of checks) {
    const key = ruleOf(c.id);
    const list = byRule.get(key);
    if (list) list.push(c);
    else byRule.set(key, [c]);
  }
  const rows: RuleRow<C>[] = [];
  for (const [rule, list] of byRule) {
    const sense = senseOf(list);
    const counts: Record<RuleStatus, number> = {
      pass: 0,
      warn: 0,
      fail: 0,
      "not-applicable": 0,
      "accepted-by-rating": 0,
    };
    let worst = list[0]!;
    let worstUse = limitUseOf(worst, sense);
    for (const c of list) {
      counts[ruleStatus(c.status)]++;
      const r = RANK[ruleStatus(c.status)] - RANK[ruleStatus(worst.status)];
      const u = limitUseOf(c, sense);
      if (r > 0 || (r === 0 && u !== null && (worstUse === null || u > worstUse))) {
        worst = c;
        worstUse = u;
      }
    }
    const open = list.filter((c) => c.status === "warn" || c.status === "fail");
    const maxBolts = Math.max(0, ...list.map((c) => c.boltIds.length));
    rows.push({
      rule,
      title: worst.title || list.find((c) => c.title)?.title || "Check",
      status: ruleStatus(worst.status),
      checks: list,
      worst,
      counts,
      open,
      boltIds: [...new Set((open.length ? open : list).flatMap((c) => c.boltIds))],
      subject: maxBolts >= 2 ? "pair" : maxBolts === 1 ? "bolt" : "joint",
      use: worstUse !== null && Number.isFinite(worstUse) ? worstUse : worstUse === null ? null : 9.99,
      sense,
    });
  }
  return rows.sort((a, b) => RULE_ORDER[a.status] - RULE_ORDER[b.status]);
}

/** "12 pairs", "1 bolt", "3 checks": how many of the rule's subjects. */
export function countNoun(n: number, subject: RuleRow<GroupableCheck>["subject"]): string {
  const word = subject === "pair" ? "pair" : subject === "bolt" ? "bolt" : "check";
  return `${n} ${word}${n === 1 ? "" : "s"}`;
}

/** "2 fail · 10 warn · 4 pass" (statuses with no checks left out). */
export function countsText(counts: Record<RuleStatus, number>): string {
  const parts: string[] = [];
  if (counts.fail) parts.push(`${counts.fail} fail`);
  if (counts.warn) parts.push(`${counts.warn} warn`);
  if (counts["accepted-by-rating"]) parts.push(`${counts["accepted-by-rating"]} accepted by its rating`);
  if (counts.pass) parts.push(`${counts.pass} pass`);
  if (counts["not-applicable"]) parts.push(`${counts["not-applicable"]} not applicable`);
  return parts.join(" · ");
}

/** What a check is about, for people: "b3–b4", "b7", or "" for a whole-joint check. */
export function subjectLabel(c: GroupableCheck): string {
  return c.boltIds.join("–");
}

/** What one justification of this rule covers: "Covers 12 pairs that warn or fail (2 fail, 10 warn)." */
export function coverageText(row: RuleRow<GroupableCheck>): string {
  if (row.open.length === 0) return "";
  if (row.subject === "joint" && row.checks.length === 1) return "";
  const f = row.counts.fail;
  const w = row.counts.warn;
  const which = f && w ? "warn or fail" : f ? "fail" : "warn";
  const tally = f && w ? ` (${f} fail, ${w} warn)` : "";
  return `Covers ${countNoun(row.open.length, row.subject)} that ${row.open.length === 1 && which !== "warn or fail" ? which + "s" : which}${tally}.`;
}

/** Rules whose open checks an approver must justify: one justification per rule. */
export function rulesNeedingJustification<C extends GroupableCheck>(checks: readonly C[]): RuleRow<C>[] {
  return groupByRule(checks).filter((r) => r.open.length > 0);
}

/**
 * Justifications keyed by rule. Older approvals stored one per pair ("spacing.max-pitch:b1-b2"):
 * those are mapped to their rule, so they stay readable beside the rule's row.
 */
export function justificationsByRule<J extends { checkId: string }>(list: readonly J[]): Map<string, J[]> {
  const out = new Map<string, J[]>();
  for (const j of list) {
    const key = ruleOf(j.checkId);
    const l = out.get(key);
    if (l) l.push(j);
    else out.set(key, [j]);
  }
  return out;
}
