import type { JointDesign } from "@/features/analysis/core/design";
import { BeforeAfterTable } from "@/features/ui/before-after-table";
import { describeInputChanges, summarisePattern } from "../model/revision-delta";

/** What happened to the pattern, in sentences, and the changed inputs under the form's labels. */
export function RevisionInputChanges({ before, after }: { before: JointDesign; after: JointDesign }) {
  const pattern = summarisePattern(before, after);
  const inputs = describeInputChanges(before, after);
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
          <BeforeAfterTable
            label="Inputs that changed"
            headers={["Input", "Before", "After"]}
            rows={inputs.map((c) => ({ key: c.key, label: c.label, before: c.before, after: c.after }))}
          />
        )}
      </section>
    </div>
  );
}
