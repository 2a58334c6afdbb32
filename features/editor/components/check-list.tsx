"use client";

import type { UnitSystem } from "@/features/analysis/core/design";
import { RuleList } from "@/features/ui/rule-list";
import type { CheckView } from "../model/readout-view";
import { quantityOfUnit, toDisplay, unitLabel } from "../model/quantities";

function shown(v: number | string | null, unit: string, units: UnitSystem): string {
  if (v === null) return "—";
  if (typeof v === "string") return v;
  const q = quantityOfUnit(unit);
  const d = q ? toDisplay(q, v, units) : v;
  const label = q ? unitLabel(q, units) : unit;
  return `${Number(d.toPrecision(4))}${label ? ` ${label}` : ""}`;
}

/** The Readout's checks as Rule rows, failing rules first. Picking a rule or a pair highlights its bolts. */
export function CheckList({
  checks,
  units,
  activeId,
  onPick,
}: {
  checks: CheckView[];
  units: UnitSystem;
  activeId: string | null;
  onPick?: (id: string | null) => void;
}) {
  return (
    <RuleList
      label="Checks by rule"
      checks={checks}
      format={(v, unit) => shown(v, unit, units)}
      activeId={activeId}
      onPick={(p) => onPick?.(p?.id ?? null)}
    />
  );
}
