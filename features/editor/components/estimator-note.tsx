import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { UnitSystem } from "@/features/analysis/core/design";
import { formatQuantity } from "../model/quantities";

/** Which gasket-stress estimator governed, why, and the cone angle used. */
export function EstimatorNote({ analysis, units }: { analysis: JointAnalysis; units: UnitSystem }) {
  const e = analysis.estimator;
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-table" aria-label="Estimator">
      <dt className="text-ink-600">Governing estimate</dt>
      <dd data-testid="governing-estimator">
        {e.governing === "beam" ? "flange as a beam on an elastic foundation" : "cone superposition"}{" "}
        <span className="text-ink-500">({e.requested})</span>
      </dd>
      <dt className="text-ink-600">Why</dt>
      <dd className="text-ink-700">{e.reason}</dd>
      <dt className="text-ink-600">Cone angle</dt>
      <dd>
        <span className="num">{e.coneAngleDeg.toFixed(1)}°</span>{" "}
        {e.coneAngleMode === "fixed" ? "(fixed)" : "(thickness-dependent)"}{" "}
        <span className="text-micro text-ink-500">{e.coneRule}</span>
      </dd>
      <dt className="text-ink-600">Cone radius at gasket</dt>
      <dd className="num">{formatQuantity("length", e.coneRadiusMm, units)}</dd>
    </dl>
  );
}
