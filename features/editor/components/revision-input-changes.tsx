import type { JointDesign } from "@/features/analysis/core/design";
import { describeInputChanges, summarisePattern } from "../model/revision-delta";

/** What happened to the pattern, in sentences, and the changed inputs under the form's labels. */
export function RevisionInputChanges({ before, after }: { before: JointDesign; after: JointDesign }) {
  const pattern = summarisePattern(before, after);
  const inputs = describeInputChanges(before, after);
  const th = "py-1 pr-3 text-left text-micro font-semibold text-ink-500";
  const td = "border-t border-ink-100 py-1 pr-3 align-top";
  return (
    <div className="flex flex-col gap-4">
      <section aria-labelledby="pattern-heading">
        <h2 id="pattern-heading" className="text-lead font-semibold">
          Bolt pattern
        </h2>
        {pattern.length === 0 ? (
          <p className="text-body text-ink-500">The bolt pattern did not change.</p>
        ) : (
          <ul className="mt-1 list-disc pl-5 text-body" aria-label="Pattern changes">
            {pattern.map((line) => (
              <li key={line}>{line.charAt(0).toUpperCase() + line.slice(1)}.</li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="inputs-heading">
        <h2 id="inputs-heading" className="text-lead font-semibold">
          Inputs that changed ({inputs.length})
        </h2>
        {inputs.length === 0 ? (
          <p className="text-body text-ink-500">No other input changed.</p>
        ) : (
          <div className="max-w-full overflow-x-auto">
            <table className="mt-2 w-full text-table" aria-label="Inputs that changed">
              <thead>
                <tr>
                  <th className={th}>Input</th>
                  <th className={th}>Before</th>
                  <th className={th}>After</th>
                </tr>
              </thead>
              <tbody>
                {inputs.map((c) => (
                  <tr key={c.key}>
                    <td className={td}>{c.label}</td>
                    <td className={`${td} num break-words`}>{c.before}</td>
                    <td className={`${td} num break-words`}>{c.after}</td>
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
