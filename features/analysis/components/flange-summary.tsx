import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { UnitSystem } from "@/features/analysis/core/design";
import { flangeSummaryLines } from "../flange-summary";

/** The Readout's (and sign-off sheet's) "Flange" section: Appendix 2 and UG-34 numbers behind the flange checks. */
export function FlangeSummary({ analysis, units }: { analysis: JointAnalysis; units: UnitSystem }) {
  const lines = flangeSummaryLines(analysis, units);
  return (
    <div data-testid="flange-summary">
      <dl className="grid grid-cols-[minmax(8rem,auto)_1fr] gap-x-3 gap-y-0.5 text-table">
        {lines.map((l) => (
          <div key={l.label} className="contents">
            <dt className="text-ink-500">{l.label}</dt>
            <dd className="num text-ink-800">{l.value}</dd>
          </div>
        ))}
      </dl>
      <p className="mt-1 text-micro text-ink-500">
        Flange design rules are code-specific (ASME VIII-1 Appendix 2 and UG-34 here); the flange checks are
        listed with the other checks, and a competent engineer signs the flange design off.
      </p>
    </div>
  );
}
