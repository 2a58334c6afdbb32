import { ValueGrid, linePath } from "@/features/ui/chart-grid";
import { linearScale } from "@/features/ui/linear-scale";
import type { UnitSystem } from "@/features/analysis/core/design";
import { mmToIn, mpaToPsi } from "@/features/analysis/core/units";
import type { PressurePoint } from "../joint-stack";
import type { GasketPathSummary } from "../fe-check-result";

const W = 520,
  H = 170,
  M = { l: 52, r: 10, t: 12, b: 28 };

/** One FE curve (solid) against the estimate (dashed), x a length in mm, y a stress in MPa. */
function FeEstimateChart({
  xMm,
  feMpa,
  estimateMpa,
  units,
  xLabel,
  label,
  caption,
}: {
  xMm: number[];
  feMpa: number[];
  estimateMpa: number[];
  units: UnitSystem;
  xLabel: string;
  label: string;
  caption: string;
}) {
  if (xMm.length < 2) return null;
  const len = (mm: number) => (units === "US" ? mmToIn(mm) : mm);
  const st = (mpa: number) => (units === "US" ? mpaToPsi(mpa) : mpa);
  let top = 0;
  for (let i = 0; i < xMm.length; i++) top = Math.max(top, st(feMpa[i]), st(estimateMpa[i]));
  const x = linearScale([len(xMm[0]), len(xMm[xMm.length - 1])], [M.l, W - M.r]);
  const y = linearScale([0, top * 1.08 || 1], [H - M.b, M.t]);
  const path = (v: number[]) =>
    linePath(
      xMm,
      v,
      (mm) => x(len(mm)),
      (mpa) => y(st(mpa)),
    );
  return (
    <figure aria-label={label}>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={label}>
        <ValueGrid y={y} ticks={y.ticks(4)} left={M.l} right={W - M.r} value={(t) => t} />
        {x.ticks(6).map((t) => (
          <text key={t} x={x(t)} y={H - M.b + 12} textAnchor="middle" fontSize="9" fill="#4c5d7d">
            {Number(t.toPrecision(3))}
          </text>
        ))}
        <text x={4} y={M.t + 2} fontSize="9" fill="#4c5d7d">
          {units === "US" ? "psi" : "MPa"}
        </text>
        <text x={W - M.r} y={H - 2} textAnchor="end" fontSize="9" fill="#4c5d7d">
          {xLabel} ({units === "US" ? "in" : "mm"})
        </text>
        <path d={path(estimateMpa)} fill="none" stroke="#a8701c" strokeWidth={1.5} strokeDasharray="5 3" />
        <path d={path(feMpa)} fill="none" stroke="#1d2739" strokeWidth={1.75} />
      </svg>
      <figcaption className="text-micro text-ink-600">{caption}</figcaption>
    </figure>
  );
}

/** p(r) at the gasket plane under one bolt: the FE cells (solid) against the estimate's footprint (dashed). */
export function InterfacePressureChart({ points, units }: { points: PressurePoint[]; units: UnitSystem }) {
  return (
    <FeEstimateChart
      xMm={points.map((q) => q.rMm)}
      feMpa={points.map((q) => q.feMpa)}
      estimateMpa={points.map((q) => q.estimateMpa)}
      units={units}
      xLabel="radius from the bolt axis"
      label="Interface pressure under one bolt, FE against the estimate"
      caption="Solid: FE, per interface cell. Dashed: the estimate's pressure-cone footprint at the same bolt force."
    />
  );
}

/** Gasket stress along the path at minimum preload: the gasket path model (solid) against the governing estimate (dashed). */
export function GasketPathChart({ path, units }: { path: GasketPathSummary; units: UnitSystem }) {
  return (
    <FeEstimateChart
      xMm={path.sMm}
      feMpa={path.stressMpa}
      estimateMpa={path.estimateMpa}
      units={units}
      xLabel={path.pathKind === "bolt-path" ? "along the bolt path" : "along the gasket centre line"}
      label="Gasket stress along the path, FE against the estimate"
      caption={`Solid: FE gasket stress (${path.elements.toLocaleString("en-GB")} elements, ${path.linearRuns} contact run${path.linearRuns === 1 ? "" : "s"}). Dashed: the ${path.estimate.estimator} estimate, both at minimum preload. Zero inside holes and where the gasket lifts.`}
    />
  );
}
