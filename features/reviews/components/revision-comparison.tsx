import Link from "next/link";
import { CHECK_STATUS_LABELS } from "../model/review-checks";
import { STATUS_LABELS } from "../model/review-states";
import { revisionPath } from "../cache-keys";
import type { RevisionComparisonDto } from "../review-dto";

const show = (v: unknown): string => {
  if (v === null || v === undefined) return "—";
  if (typeof v === "number") return String(Number(v.toPrecision(6)));
  if (typeof v === "string") return v;
  return JSON.stringify(v);
};
const mm = (v: number | null): string =>
  v === null ? "—" : `${v >= 0 ? "+" : ""}${Number(v.toFixed(3))} mm`;

/** Revision against revision: changed inputs, moved bolts, checks whose status changed. */
export function RevisionComparison({ comparison }: { comparison: RevisionComparisonDto }) {
  const { from, to } = comparison;
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

      <section aria-labelledby="inputs-heading">
        <h2 id="inputs-heading" className="text-lead font-semibold">
          Inputs that changed ({comparison.fieldChanges.length})
        </h2>
        {comparison.fieldChanges.length === 0 ? (
          <p className="text-body text-ink-500">No input changed.</p>
        ) : (
          <div className="max-w-full overflow-x-auto">
            <table className="mt-2 w-full text-table" aria-label="Inputs that changed">
              <thead>
                <tr>
                  <th className={th}>Field</th>
                  <th className={th}>Before</th>
                  <th className={th}>After</th>
                </tr>
              </thead>
              <tbody>
                {comparison.fieldChanges.map((c) => (
                  <tr key={c.path}>
                    <td className={`${td} num`}>{c.path}</td>
                    <td className={`${td} num break-all`}>{show(c.before)}</td>
                    <td className={`${td} num break-all`}>{show(c.after)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section aria-labelledby="bolts-heading">
        <h2 id="bolts-heading" className="text-lead font-semibold">
          Bolts moved ({comparison.boltMoves.length})
        </h2>
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
      </section>

      <section aria-labelledby="checks-changed-heading">
        <h2 id="checks-changed-heading" className="text-lead font-semibold">
          Checks whose status changed ({comparison.checkChanges.length})
        </h2>
        {comparison.checkChanges.length === 0 ? (
          <p className="text-body text-ink-500">Every check kept its status.</p>
        ) : (
          <div className="max-w-full overflow-x-auto">
            <table className="mt-2 w-full text-table" aria-label="Checks whose status changed">
              <thead>
                <tr>
                  <th className={th}>Check</th>
                  <th className={th}>Before</th>
                  <th className={th}>After</th>
                </tr>
              </thead>
              <tbody>
                {comparison.checkChanges.map((c) => (
                  <tr key={c.checkId}>
                    <td className={td}>
                      {c.title} <span className="text-micro text-ink-400">{c.checkId}</span>
                    </td>
                    <td className={td}>{c.before ? CHECK_STATUS_LABELS[c.before] : "absent"}</td>
                    <td className={td}>{c.after ? CHECK_STATUS_LABELS[c.after] : "absent"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
