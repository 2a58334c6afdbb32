import Link from "next/link";
import type { ReactNode } from "react";
import { ruleOf } from "@/features/analysis/rule-groups";
import { BeforeAfterTable } from "@/features/ui/before-after-table";
import type { CheckChange, KeyResults } from "../model/compare-revisions";
import { CHECK_STATUS_LABELS, type CheckStatus } from "../model/review-checks";
import { STATUS_LABELS } from "../model/review-states";
import { revisionPath } from "../cache-keys";
import type { RevisionComparisonDto } from "../review-dto";

// One row per rule and change of status: a turned pattern moves a dozen pair checks the same way.
function groupCheckChanges(changes: CheckChange[]) {
  const rows = new Map<
    string,
    { key: string; title: string; before: CheckStatus | null; after: CheckStatus | null; count: number }
  >();
  for (const c of changes) {
    const key = `${ruleOf(c.checkId)}|${c.before}|${c.after}`;
    const row = rows.get(key);
    if (row) row.count++;
    else rows.set(key, { key, title: c.title, before: c.before, after: c.after, count: 1 });
  }
  return [...rows.values()];
}

const num = (v: number | null, unit: string, digits = 4) =>
  v === null ? "—" : `${Number(v.toPrecision(digits))} ${unit}`;

function KeyResultsTable({ comparison }: { comparison: RevisionComparisonDto }) {
  const a = comparison.from.keyResults;
  const b = comparison.to.keyResults;
  const amAb = (k: KeyResults) =>
    k.actualRootAreaMm2 === null
      ? "—"
      : `${k.requiredAreaMm2 === null ? "no allowable" : num(k.requiredAreaMm2, "mm²")} against ${num(k.actualRootAreaMm2, "mm²")}`;
  const rows: { label: string; before: string; after: string }[] = [
    {
      label: "Lowest seat stress",
      before: num(a.minSeatStressMpa, "MPa", 3),
      after: num(b.minSeatStressMpa, "MPa", 3),
    },
    { label: "Am against Ab (Appendix 2)", before: amAb(a), after: amAb(b) },
    { label: "Largest pitch", before: num(a.worstPitchMm, "mm"), after: num(b.worstPitchMm, "mm") },
    {
      label: "Failing rules",
      before: a.failingRules === null ? "—" : String(a.failingRules),
      after: b.failingRules === null ? "—" : String(b.failingRules),
    },
  ];
  return (
    <section aria-labelledby="key-results-heading">
      <h2 id="key-results-heading" className="text-lead font-semibold">
        Key results
      </h2>
      <BeforeAfterTable
        label="Key results"
        headers={["Result", `Revision ${comparison.from.number}`, `Revision ${comparison.to.number}`]}
        rows={rows.map((r) => ({ key: r.label, ...r }))}
      />
    </section>
  );
}
const mm = (v: number | null): string =>
  v === null ? "—" : `${v >= 0 ? "+" : ""}${Number(v.toFixed(3))} mm`;

/** Revision against revision: changed inputs, moved bolts, checks whose status changed. */
export function RevisionComparison({
  comparison,
  drawing,
  inputs,
}: {
  comparison: RevisionComparisonDto;
  /** The two drawings overlaid and the changed inputs in the form's words (the editor draws both). */
  drawing: ReactNode;
  inputs: ReactNode;
}) {
  const { from, to } = comparison;
  const changedRules = groupCheckChanges(comparison.checkChanges);
  const th = "py-1 pr-3 text-left text-micro font-semibold text-ink-500";
  const td = "border-t border-ink-100 py-1 pr-3 align-top";
  return (
    <div className="flex flex-col gap-6">
      <form method="get" className="flex flex-wrap items-end gap-3 text-table" aria-label="Choose revisions">
        {(["from", "to"] as const).map((side) => (
          <label key={side} className="text-ink-700">
            {side === "from" ? "Before" : "After"}
            <select
              name={side}
              defaultValue={comparison[side].number}
              className="ml-2 rounded-plate border border-ink-200 bg-white p-1.5"
            >
              {comparison.revisionNumbers.map((n) => (
                <option key={n} value={n}>
                  Revision {n}
                </option>
              ))}
            </select>
          </label>
        ))}
        <button type="submit" className="rounded-plate border border-ink-200 bg-white px-3 py-1.5">
          Compare
        </button>
      </form>
      <p className="text-body text-ink-700">
        <Link className="underline" href={revisionPath(comparison.designId, from.number)}>
          Revision {from.number}
        </Link>{" "}
        ({STATUS_LABELS[from.status]}) →{" "}
        <Link className="underline" href={revisionPath(comparison.designId, to.number)}>
          Revision {to.number}
        </Link>{" "}
        ({STATUS_LABELS[to.status]})
      </p>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,640px)_minmax(0,1fr)]">
        <div className="min-w-0">{drawing}</div>
        <div className="flex min-w-0 flex-col gap-6">
          <KeyResultsTable comparison={comparison} />
          {inputs}
        </div>
      </div>

      <details aria-labelledby="bolts-heading">
        <summary id="bolts-heading" className="cursor-pointer text-lead font-semibold">
          Bolt by bolt ({comparison.boltMoves.length} moved, added or removed)
        </summary>
        {comparison.boltMoves.length === 0 ? (
          <p className="text-body text-ink-500">No bolt moved.</p>
        ) : (
          <div className="max-w-full overflow-x-auto">
            <table className="mt-2 w-full text-table" aria-label="Bolts moved">
              <thead>
                <tr>
                  <th className={th}>Bolt</th>
                  <th className={th}>Change</th>
                  <th className={th}>Δx</th>
                  <th className={th}>Δy</th>
                  <th className={th}>Δs along the path</th>
                </tr>
              </thead>
              <tbody>
                {comparison.boltMoves.map((m) => (
                  <tr key={m.boltId}>
                    <td className={td}>{m.boltId}</td>
                    <td className={td}>{m.change}</td>
                    <td className={`${td} num`}>{mm(m.dxMm)}</td>
                    <td className={`${td} num`}>{mm(m.dyMm)}</td>
                    <td className={`${td} num`}>{mm(m.dsMm)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </details>

      <section aria-labelledby="checks-changed-heading">
        <h2 id="checks-changed-heading" className="text-lead font-semibold">
          Rules whose status changed ({changedRules.length})
        </h2>
        {changedRules.length === 0 ? (
          <p className="text-body text-ink-500">Every check kept its status.</p>
        ) : (
          <BeforeAfterTable
            label="Rules whose status changed"
            headers={["Rule", "Before", "After"]}
            rows={changedRules.map((c) => ({
              key: c.key,
              label: (
                <>
                  {c.title}
                  {c.count > 1 && <span className="text-micro text-ink-500"> ({c.count} checks)</span>}
                </>
              ),
              before: c.before ? CHECK_STATUS_LABELS[c.before] : "absent",
              after: c.after ? CHECK_STATUS_LABELS[c.after] : "absent",
            }))}
          />
        )}
      </section>
    </div>
  );
}
