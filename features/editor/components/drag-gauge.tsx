import type { UnitSystem } from "@/features/analysis/core/design";
import type { DesignIssue } from "@/features/analysis/core/validate";
import { formatQuantity } from "../model/quantities";
import type { ReadoutView } from "../model/readout-view";

/**
 * The "drag gauge": while a bolt is dragged (and the Readout is held), the few numbers that
 * decide where to drop it: the lowest gasket stress at minimum preload against the seating
 * stress, and how many neighbour pairs break a spacing rule. From the live preview; where the
 * core refuses the layout (a hole over its neighbour's), the reason instead.
 */
export function DragGauge({
  view,
  issues,
  units,
}: {
  view: ReadoutView | null;
  issues: DesignIssue[];
  units: UnitSystem;
}) {
  if (!view || issues.length > 0) {
    return (
      <div
        role="status"
        aria-label="Drag gauge"
        className="pointer-events-none absolute right-2 top-2 max-w-xs rounded-plate border border-verdict-fail bg-white/95 px-2 py-1 text-micro text-verdict-fail shadow-plate"
      >
        {issues[0]?.message ?? "The core cannot analyse this layout."}
      </div>
    );
  }
  const seating = view.checks.find((c) => c.id === "gasket.seating");
  let failingPairs = 0;
  const seen = new Set<string>();
  for (const c of view.checks) {
    if (!c.id.startsWith("spacing.") || c.status !== "fail") continue;
    const pair = c.boltIds.join("-");
    if (!seen.has(pair)) {
      seen.add(pair);
      failingPairs++;
    }
  }
  const low = seating?.status === "fail";
  return (
    <div
      role="status"
      aria-label="Drag gauge"
      className="pointer-events-none absolute right-2 top-2 rounded-plate bg-white/90 px-2 py-1 text-micro text-ink-700 shadow-plate"
    >
      {seating?.value != null && (
        <p className={`num ${low ? "text-verdict-fail" : ""}`}>
          lowest seat {formatQuantity("stress", seating.value, units, 3)}
          {seating.limit != null && <> / needs {formatQuantity("stress", seating.limit, units, 3)}</>}
        </p>
      )}
      <p className={`num ${failingPairs > 0 ? "text-verdict-fail" : ""}`}>
        {failingPairs === 0
          ? "spacing: all pairs pass"
          : `spacing: ${failingPairs} pair${failingPairs === 1 ? "" : "s"} fail`}
      </p>
    </div>
  );
}
