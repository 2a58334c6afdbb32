"use client";

import type { UnitSystem } from "@/features/analysis/core/design";
import { CHECK_STATUS_LABELS, type CheckStatus, type ReviewCheck } from "../model/review-checks";
import type { JustificationDto } from "../review-dto";
import { formatCheckValue } from "./format-check-value";

const STATUS_STYLE: Record<CheckStatus, string> = {
  pass: "bg-verdict-pass-bg text-verdict-pass",
  warn: "bg-verdict-warn-bg text-verdict-warn",
  fail: "bg-verdict-fail-bg text-verdict-fail",
  "not-applicable": "bg-verdict-na-bg text-verdict-na",
  "accepted-by-rating": "bg-brass-50 text-brass-700",
};
const ORDER: Record<CheckStatus, number> = {
  fail: 0,
  warn: 1,
  "accepted-by-rating": 2,
  pass: 3,
  "not-applicable": 4,
};

/** The frozen checks, failures first, each with its written justification when one was given. */
export function ReviewCheckList(props: {
  checks: ReviewCheck[];
  justifications: JustificationDto[];
  unitSystem: UnitSystem;
  activeCheckId: string | null;
  onPick: (check: ReviewCheck | null) => void;
}) {
  const byCheck = new Map(props.justifications.map((j) => [j.checkId, j]));
  const rows = [...props.checks].sort((a, b) => ORDER[a.status] - ORDER[b.status]);
  if (rows.length === 0)
    return <p className="text-body text-ink-500">No checks were stored with this revision.</p>;
  return (
    <table className="w-full text-table" aria-label="Checks of this revision">
      <thead className="text-left text-micro text-ink-500">
        <tr>
          <th className="py-1">Status</th>
          <th>Check</th>
          <th className="text-right">Value</th>
          <th className="text-right">Limit</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((c) => {
          const active = c.id === props.activeCheckId;
          const justification = byCheck.get(c.id);
          return (
            <tr
              key={c.id}
              data-check-id={c.id}
              aria-selected={active}
              className={`border-t border-ink-100 align-top ${active ? "bg-brass-50" : ""}`}
            >
              <td className="py-1 pr-2">
                <span className={`rounded px-1.5 py-0.5 text-micro font-semibold ${STATUS_STYLE[c.status]}`}>
                  {CHECK_STATUS_LABELS[c.status]}
                </span>
              </td>
              <td>
                <button
                  type="button"
                  className="text-left text-ink-800 hover:underline"
                  aria-pressed={active}
                  onClick={() => props.onPick(active ? null : c)}
                >
                  {c.title}
                </button>
                <span className="ml-1 break-all text-micro text-ink-400">{c.id}</span>
                {c.note ? <p className="text-micro text-ink-500">{c.note}</p> : null}
                {c.source ? <p className="text-micro text-ink-400">Source: {c.source}</p> : null}
                {justification ? (
                  <p
                    className="mt-1 rounded bg-steel-100 px-2 py-1 text-micro text-ink-800"
                    data-testid="justification"
                  >
                    Justified by {justification.authorName}: {justification.text}
                  </p>
                ) : null}
              </td>
              <td className="num text-right">{formatCheckValue(c.value, c.unit, props.unitSystem)}</td>
              <td className="num text-right">{formatCheckValue(c.limit, c.unit, props.unitSystem)}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
