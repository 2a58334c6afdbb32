/**
 * How the pattern search reads an analysis: which checks disqualify a layout, the margin of each
 * rule, the governing rule, and which way a failing rule moves with the bolt count.
 *
 * Counting, decided for the search (and stated in every result's `policy`):
 * - "fail" disqualifies, whatever the rule;
 * - "warn" disqualifies on the rules the layout decides (spacing, edge distances, gasket stresses):
 *   a suggestion must hold them outright, unless the request allows layout warnings
 *   (`allowLayoutWarnings`: then they are carried, like the next kind); the pipe-flange pattern
 *   rules (multiple of 4, straddling) disqualify whenever straddling is asked for;
 * - "warn" on rules the layout does not decide (Appendix 2 scope, the assembly stress window, bolt
 *   length, flange design) is carried with the candidate and listed, since no pattern changes it;
 * - "accepted-by-rating" counts as holding (the code accepts a standard flange by its rating) and
 *   is listed with the candidate too; "not-applicable" counts as holding.
 */
import type { CheckRecord } from "../checks/check-record";

export type Check = CheckRecord & { boltIds?: string[] };

/** The rule of a check: its id before the colon ("spacing.max-pitch:b3-b4" → "spacing.max-pitch"). */
export const ruleOf = (id: string): string => id.split(":")[0];

const LAYOUT_PREFIXES = ["spacing.", "edge.", "gasket."];

export interface JudgeOptions {
  /** The multiple-of-4 and straddling rules must hold (a circular pipe flange with straddling asked for). */
  pipePattern: boolean;
  /** Warnings on layout rules are carried instead of disqualifying. */
  allowLayoutWarnings?: boolean;
}

/** Rules whose records hold when value ≤ limit (the others with both numbers are floors). */
const CEILINGS = new Set([
  "gasket.crush",
  "spacing.max-pitch",
  "spacing.cone-overlap",
  "bolt.assembly-stress-max",
  "bolt.service-stress",
  "joint.separation",
]);

/** Rules that more bolts (a shorter pitch, a larger total bolt area) move towards holding. */
const MORE_BOLTS_HELP = new Set([
  "gasket.seating",
  "gasket.operating-m-p",
  "gasket.operating-qs-min",
  "asme.app2.bolt-area",
  "spacing.max-pitch",
  "spacing.cone-overlap",
  "joint.separation",
  "bolt.service-stress",
]);

/** Rules that fewer bolts move towards holding. */
const FEWER_BOLTS_HELP = new Set(["spacing.min-pitch", "gasket.crush"]);

/** True when a warning of this rule keeps a layout from being suggested. */
export function warningDisqualifies(rule: string, o: JudgeOptions): boolean {
  if (rule.startsWith("pattern.")) return o.pipePattern;
  return !o.allowLayoutWarnings && LAYOUT_PREFIXES.some((p) => rule.startsWith(p));
}

/** The check's margin: how far inside its limit it is (0.12 = 12 % inside; negative outside); null without numbers. */
export function marginOf(c: Check): number | null {
  const rule = ruleOf(c.id);
  if (rule === "spacing.pitch-band") return c.value === null ? null : Math.min(c.value / 3, 6 / c.value) - 1;
  if (c.value === null || c.limit === null || c.limit === 0 || c.value === 0) return null;
  if (CEILINGS.has(rule)) return c.limit / c.value - 1;
  return c.value / c.limit - 1;
}

export interface RuleMargin {
  rule: string;
  title: string;
  /** Worst status of the rule's records. */
  status: CheckRecord["status"];
  /** Smallest margin of its records (null: no numbers). */
  margin: number | null;
  /** The record that gave that margin. */
  checkId: string;
  value: number | null;
  limit: number | null;
  unit: string;
}

const RANK: Record<CheckRecord["status"], number> = {
  "not-applicable": 0,
  pass: 1,
  "accepted-by-rating": 2,
  warn: 3,
  fail: 4,
};

/** One line per rule: worst status, smallest margin. Order: as the rules first appear. */
export function ruleMargins(checks: readonly Check[]): RuleMargin[] {
  const byRule = new Map<string, RuleMargin>();
  for (const c of checks) {
    const rule = ruleOf(c.id);
    const m = c.status === "not-applicable" ? null : marginOf(c);
    const cur = byRule.get(rule);
    if (!cur) {
      byRule.set(rule, {
        rule,
        title: c.title,
        status: c.status,
        margin: m,
        checkId: c.id,
        value: c.value,
        limit: c.limit,
        unit: c.unit,
      });
      continue;
    }
    if (RANK[c.status] > RANK[cur.status]) cur.status = c.status;
    if (m !== null && (cur.margin === null || m < cur.margin)) {
      Object.assign(cur, { margin: m, checkId: c.id, value: c.value, limit: c.limit });
    }
  }
  return [...byRule.values()];
}

export interface Verdict {
  ok: boolean;
  /** Checks that keep this layout from being suggested. */
  blocking: Check[];
  /** Warnings and rating acceptances the candidate carries (rules no layout changes). */
  carried: string[];
  /** True when every blocking check belongs to a rule that more bolts move towards holding. */
  moreBoltsMayHelp: boolean;
}

/** True when more bolts move this blocking check towards holding (a pitch band above 6·d, seating, …). */
export function moreBoltsHelp(c: Check): boolean {
  const rule = ruleOf(c.id);
  if (rule === "spacing.pitch-band") return (c.value ?? 0) > 6;
  return MORE_BOLTS_HELP.has(rule) && !FEWER_BOLTS_HELP.has(rule);
}

/** Applies the counting above. */
export function judge(checks: readonly Check[], o: JudgeOptions): Verdict {
  const blocking: Check[] = [];
  const carried = new Set<string>();
  for (const c of checks) {
    const rule = ruleOf(c.id);
    if (c.status === "fail" || (c.status === "warn" && warningDisqualifies(rule, o))) blocking.push(c);
    else if (c.status === "warn" || c.status === "accepted-by-rating") carried.add(rule);
  }
  const moreBoltsMayHelp = blocking.length > 0 && blocking.every(moreBoltsHelp);
  return { ok: blocking.length === 0, blocking, carried: [...carried], moreBoltsMayHelp };
}

/** What a rule asks of a pattern, as the end of "no size up to M36 …". */
export function ruleAsk(rule: string): string {
  switch (rule) {
    case "gasket.seating":
      return "seats the gasket";
    case "gasket.crush":
      return "keeps the gasket below its crush stress";
    case "gasket.operating-m-p":
    case "gasket.operating-qs-min":
      return "keeps the gasket tight under pressure";
    case "asme.app2.bolt-area":
      return "gives the bolt area Ab ≥ Am";
    case "spacing.max-pitch":
      return "keeps the pitch within 2a + t";
    case "spacing.min-pitch":
      return "leaves room for the tool";
    case "spacing.pitch-band":
      return "keeps the pitch between 3 and 6 bolt diameters";
    case "spacing.cone-overlap":
      return "closes the gaps between the pressure cones";
    case "joint.separation":
      return "keeps the joint from separating";
    case "bolt.service-stress":
      return "keeps the bolt stress in service below proof";
    default:
      return rule.startsWith("edge.") ? "keeps its nuts on the flange" : `holds the rule ${rule}`;
  }
}
