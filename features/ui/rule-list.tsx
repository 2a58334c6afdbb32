"use client";

import { useState, type ReactNode } from "react";
import {
  countNoun,
  countsText,
  groupByRule,
  ruleStatus,
  subjectLabel,
  type GroupableCheck,
  type RuleRow,
  type RuleStatus,
} from "@/features/analysis/rule-groups";

export interface ListedCheck extends GroupableCheck {
  unit: string;
  note: string;
  source: string;
}

/** What the rule row says about its state, in words (the bar and the edge carry the colour). */
const VERDICT: Record<RuleStatus, string> = {
  fail: "Fails",
  warn: "Warns",
  pass: "Holds",
  "not-applicable": "Not applicable",
  "accepted-by-rating": "Accepted by its rating",
};
const EDGE: Record<RuleStatus, string> = {
  fail: "border-l-verdict-fail",
  warn: "border-l-verdict-warn",
  pass: "border-l-verdict-pass",
  "not-applicable": "border-l-steel-300",
  "accepted-by-rating": "border-l-brass-700",
};
const WORD: Record<RuleStatus, string> = {
  fail: "text-verdict-fail",
  warn: "text-verdict-warn",
  pass: "text-verdict-pass",
  "not-applicable": "text-ink-500",
  "accepted-by-rating": "text-brass-700",
};
const FILL: Record<RuleStatus, string> = {
  fail: "fill-verdict-fail",
  warn: "fill-verdict-warn",
  pass: "fill-verdict-pass",
  "not-applicable": "fill-steel-300",
  "accepted-by-rating": "fill-brass-700",
};

/** The bar spans 0 … 1.5 × the limit; the notch marks the limit itself. */
const BAR_SPAN = 1.5;

/**
 * The Margin bar: how much of its limit the rule's governing check uses (value against a ceiling,
 * or the limit against the value for a floor). SVG attributes only (no inline styles).
 */
export function MarginBar({ row }: { row: RuleRow<GroupableCheck> }) {
  if (row.use === null) return null;
  const used = Math.max(0, Math.min(row.use, BAR_SPAN));
  const pct = Math.round(row.use * 100);
  const notch = (100 / BAR_SPAN).toFixed(2);
  const label =
    row.sense === "at-least"
      ? `needs ${pct} % of what it has (limit is a floor)`
      : `uses ${pct} % of its limit (limit is a ceiling)`;
  return (
    <svg
      viewBox="0 0 100 8"
      preserveAspectRatio="none"
      className="mt-1 block h-2 w-full"
      role="img"
      aria-label={`Margin bar: ${label}`}
      data-use={row.use.toFixed(3)}
    >
      <rect x="0" y="2" width="100" height="4" rx="2" className="fill-steel-100" />
      <rect
        x="0"
        y="2"
        width={((used / BAR_SPAN) * 100).toFixed(2)}
        height="4"
        rx="2"
        className={FILL[row.status]}
      />
      <rect x={notch} y="0" width="0.8" height="8" className="fill-ink-800" />
    </svg>
  );
}

/**
 * Checks as Rule rows: one row per rule with its worst value against its limit, a Margin bar,
 * the tally of pairs (or bolts) by status and, on expand, every pair with its own value. Picking a
 * rule highlights its warning and failing bolts on the drawing; picking a pair highlights that pair.
 */
export function RuleList<C extends ListedCheck>(props: {
  checks: readonly C[];
  format: (value: number | string | null, unit: string) => string;
  /** Id of the picked rule or check (rule ids and check ids never collide: check ids of pairs carry a colon). */
  activeId: string | null;
  onPick?: (pick: { id: string; title: string; boltIds: string[] } | null) => void;
  /** Extra content under a rule (the sign-off sheet shows the justification here). */
  renderExtra?: (row: RuleRow<C>) => ReactNode;
  label: string;
}) {
  const rows = groupByRule(props.checks);
  const [open, setOpen] = useState<ReadonlySet<string>>(new Set());
  const toggle = (rule: string) =>
    setOpen((s) => {
      const next = new Set(s);
      if (next.has(rule)) next.delete(rule);
      else next.add(rule);
      return next;
    });
  if (rows.length === 0) return <p className="text-body text-ink-500">No checks.</p>;
  return (
    <ul className="flex flex-col gap-2" aria-label={props.label}>
      {rows.map((row) => {
        const w = row.worst;
        const many = row.checks.length > 1;
        const expanded = open.has(row.rule);
        const active = props.activeId === row.rule;
        return (
          <li
            key={row.rule}
            data-rule={row.rule}
            data-status={row.status}
            aria-current={active || undefined}
            className={`rounded-plate border border-l-4 border-ink-100 px-2 py-1.5 ${EDGE[row.status]} ${active ? "bg-brass-50" : "bg-white"}`}
          >
            <div className="flex flex-wrap items-baseline justify-between gap-x-3">
              <button
                type="button"
                className="min-w-0 text-left text-table font-semibold text-ink-800 hover:underline"
                aria-pressed={active}
                onClick={() =>
                  props.onPick?.(active ? null : { id: row.rule, title: row.title, boltIds: row.boltIds })
                }
              >
                {row.title}
              </button>
              <span className={`text-micro font-semibold uppercase tracking-wide ${WORD[row.status]}`}>
                {VERDICT[row.status]}
              </span>
            </div>
            <p className="num text-table text-ink-700" data-testid="rule-worst">
              {many ? "Worst: " : ""}
              {props.format(w.value, w.unit)}
              {w.limit !== null ? ` against ${props.format(w.limit, w.unit)}` : ""}
              {many && subjectLabel(w) ? ` (${subjectLabel(w)})` : ""}
            </p>
            <MarginBar row={row} />
            {many ? (
              <p className="text-micro text-ink-600" data-testid="rule-counts">
                {countNoun(row.checks.length, row.subject)}: {countsText(row.counts)}
              </p>
            ) : null}
            {w.note ? <p className="text-micro text-ink-500">{w.note}</p> : null}
            {w.source ? <p className="text-micro text-ink-400">{w.source}</p> : null}
            {many ? (
              <button
                type="button"
                className="mt-0.5 text-micro text-brass-700 hover:underline"
                aria-expanded={expanded}
                onClick={() => toggle(row.rule)}
              >
                {expanded ? "Hide" : "Show"} the {countNoun(row.checks.length, row.subject)}
              </button>
            ) : null}
            {many && expanded ? (
              <ol
                className="mt-1 grid grid-cols-[auto_1fr_auto] gap-x-3 text-micro"
                aria-label={`${row.title}: each`}
              >
                {row.checks.map((c) => {
                  const st = ruleStatus(c.status);
                  const picked = props.activeId === c.id;
                  return (
                    <li key={c.id} data-check-id={c.id} data-status={c.status} className="contents">
                      <button
                        type="button"
                        className={`num text-left hover:underline ${picked ? "font-semibold text-brass-700" : "text-ink-700"}`}
                        aria-pressed={picked}
                        onClick={() =>
                          props.onPick?.(
                            picked
                              ? null
                              : { id: c.id, title: `${row.title} (${subjectLabel(c)})`, boltIds: c.boltIds },
                          )
                        }
                      >
                        {subjectLabel(c) || "joint"}
                      </button>
                      <span className="num text-ink-600">
                        {props.format(c.value, c.unit)}
                        {c.limit !== null ? ` / ${props.format(c.limit, c.unit)}` : ""}
                      </span>
                      <span className={WORD[st]}>{VERDICT[st]}</span>
                    </li>
                  );
                })}
              </ol>
            ) : null}
            {props.renderExtra?.(row)}
          </li>
        );
      })}
    </ul>
  );
}
