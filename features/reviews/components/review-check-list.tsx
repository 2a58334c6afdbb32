"use client";

import type { UnitSystem } from "@/features/analysis/core/design";
import { RuleList } from "@/features/ui/rule-list";
import { coverageText, justificationsByRule } from "@/features/analysis/rule-groups";
import type { ReviewCheck } from "../model/review-checks";
import type { JustificationDto } from "../review-dto";
import { formatCheckValue } from "./format-check-value";

export interface CheckPick {
  id: string;
  title: string;
  boltIds: string[];
}

/** The frozen checks as Rule rows, failing rules first, each with its written justification when one was given. */
export function ReviewCheckList(props: {
  checks: ReviewCheck[];
  justifications: JustificationDto[];
  unitSystem: UnitSystem;
  activeCheckId: string | null;
  onPick: (pick: CheckPick | null) => void;
}) {
  const byRule = justificationsByRule(props.justifications);
  if (props.checks.length === 0)
    return <p className="text-body text-ink-500">No checks were stored with this revision.</p>;
  return (
    <RuleList
      label="Checks of this revision by rule"
      checks={props.checks}
      format={(v, unit) => formatCheckValue(v, unit, props.unitSystem)}
      activeId={props.activeCheckId}
      onPick={props.onPick}
      renderExtra={(row) => {
        const given = byRule.get(row.rule) ?? [];
        if (given.length === 0) return null;
        const cover = coverageText(row);
        return given.map((j, i) => (
          <p
            key={`${j.checkId}-${i}`}
            className="mt-1 rounded bg-steel-100 px-2 py-1 text-micro text-ink-800"
            data-testid="justification"
          >
            Justified by {j.authorName}: {j.text}
            {given.length === 1 && cover ? <span className="block text-ink-500">{cover}</span> : null}
          </p>
        ));
      }}
    />
  );
}
