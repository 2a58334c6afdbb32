import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { UnitSystem } from "@/features/analysis/core/design";
import { nmToNmm } from "@/features/analysis/core/units";
import { formatQuantity } from "../model/quantities";

/** Tightening passes with torque per pass, and the cross-pattern sequence. */
export function AssemblyPlanView({ analysis, units }: { analysis: JointAnalysis; units: UnitSystem }) {
  const plan = analysis.assemblyPlan;
  return (
    <div className="space-y-2 text-table">
      <div className="max-w-full overflow-x-auto">
        <table className="w-full" aria-label="Tightening passes">
          <thead className="text-left text-micro text-ink-500">
            <tr>
              <th>Pass</th>
              <th>Pattern</th>
              <th className="text-right">Of target</th>
              <th className="text-right">Torque</th>
              <th>Note</th>
            </tr>
          </thead>
          <tbody>
            {plan.passes.map((p) => (
              <tr key={p.pass} className="border-t border-ink-100 align-top">
                <td className="py-0.5">{p.name}</td>
                <td>{p.pattern}</td>
                <td className="num text-right">{Math.round(p.fractionOfTarget * 100)} %</td>
                <td className="num text-right">{formatQuantity("torque", nmToNmm(p.torqueNm), units)}</td>
                <td className="text-micro text-ink-600">{p.note}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p>
        <span className="text-ink-600">Sequence ({plan.sequenceNote ?? plan.sequenceRule}): </span>
        <span className="num" data-testid="tightening-sequence">
          {plan.sequence.join(" → ")}
        </span>
      </p>
      <p className="text-micro text-ink-500">
        Nut factor {plan.nutFactor} ({plan.nutFactorSource}). {plan.source}
      </p>
    </div>
  );
}
