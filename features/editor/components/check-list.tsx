import type { UnitSystem } from "@/features/analysis/core/design";
import type { CheckView } from "../model/readout-view";
import { quantityOfUnit, toDisplay, unitLabel } from "../model/quantities";

const STATUS_STYLE: Record<CheckView["status"], string> = {
  pass: "bg-verdict-pass-bg text-verdict-pass",
  warn: "bg-verdict-warn-bg text-verdict-warn",
  fail: "bg-verdict-fail-bg text-verdict-fail",
  "not-applicable": "bg-verdict-na-bg text-verdict-na",
  "accepted-by-rating": "bg-brass-50 text-brass-700",
};
const STATUS_TEXT: Record<CheckView["status"], string> = {
  pass: "pass",
  warn: "warn",
  fail: "fail",
  "not-applicable": "n/a",
  "accepted-by-rating": "accepted by its rating",
};
const ORDER: Record<CheckView["status"], number> = {
  fail: 0,
  warn: 1,
  "accepted-by-rating": 2,
  pass: 3,
  "not-applicable": 4,
};

function shown(v: number | null, unit: string, units: UnitSystem): string {
  if (v === null) return "—";
  const q = quantityOfUnit(unit);
  const d = q ? toDisplay(q, v, units) : v;
  return String(Number(d.toPrecision(4)));
}

/** The check list, failures first. Clicking a row highlights its bolts on the drawing. */
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
  const rows = [...checks].sort((a, b) => ORDER[a.status] - ORDER[b.status]);
  return (
    <table className="w-full text-table" aria-label="Checks">
      <thead className="text-left text-micro text-ink-500">
        <tr>
          <th className="py-1">Status</th>
          <th>Check</th>
          <th className="text-right">Value</th>
          <th className="text-right">Limit</th>
          <th>Unit</th>
        </tr>
      </thead>
      <tbody>
        {rows.map((c) => {
          const q = quantityOfUnit(c.unit);
          const unit = q ? unitLabel(q, units) : c.unit;
          const active = c.id === activeId;
          return (
            <tr
              key={c.id}
              data-check-id={c.id}
              data-status={c.status}
              aria-selected={active}
              className={`cursor-pointer border-t border-ink-100 align-top ${active ? "bg-brass-50" : "hover:bg-steel-50"}`}
              onClick={() => onPick?.(active ? null : c.id)}
            >
              <td className="py-1">
                <span className={`rounded px-1.5 py-0.5 text-micro font-semibold ${STATUS_STYLE[c.status]}`}>
                  {STATUS_TEXT[c.status]}
                </span>
              </td>
              <td>
                <button
                  type="button"
                  className="text-left text-ink-800 hover:underline"
                  onClick={(e) => {
                    e.stopPropagation();
                    onPick?.(active ? null : c.id);
                  }}
                >
                  {c.title}
                  {c.boltIds.length > 0 && <span className="num text-ink-500"> · {c.boltIds.join("–")}</span>}
                </button>
                <p className="text-micro text-ink-500">
                  {c.source}
                  {c.note ? ` — ${c.note}` : ""}
                </p>
              </td>
              <td className="num text-right">{shown(c.value, c.unit, units)}</td>
              <td className="num text-right">{shown(c.limit, c.unit, units)}</td>
              <td className="num pl-1">{unit}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
