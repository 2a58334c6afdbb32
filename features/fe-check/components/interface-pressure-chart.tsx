import { scaleLinear } from "d3-scale";
import type { UnitSystem } from "@/features/analysis/core/design";
import { mmToIn, mpaToPsi } from "@/features/analysis/core/units";
import type { PressurePoint } from "../joint-stack";

const W = 520,
  H = 170,
  M = { l: 52, r: 10, t: 12, b: 28 };

/** p(r) at the gasket plane under one bolt: the FE cells (solid) against the estimate's footprint (dashed). */
export function InterfacePressureChart({ points, units }: { points: PressurePoint[]; units: UnitSystem }) {
  if (points.length < 2) return null;
  const r = (mm: number) => (units === "US" ? mmToIn(mm) : mm);
  const p = (mpa: number) => (units === "US" ? mpaToPsi(mpa) : mpa);
  const rMax = r(points[points.length - 1].rMm);
  const top = Math.max(...points.map((q) => Math.max(p(q.feMpa), p(q.estimateMpa)))) * 1.08 || 1;
  const x = scaleLinear()
    .domain([r(points[0].rMm), rMax])
    .range([M.l, W - M.r]);
  const y = scaleLinear()
    .domain([0, top])
    .range([H - M.b, M.t]);
  const path = (v: (q: PressurePoint) => number) =>
    points.map((q, i) => `${i ? "L" : "M"}${x(r(q.rMm)).toFixed(1)},${y(v(q)).toFixed(1)}`).join("");
  return (
    <figure aria-label="Interface pressure under one bolt, FE against the estimate">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label="p(r) at the gasket plane">
        {y.ticks(4).map((t) => (
          <g key={t}>
            <line x1={M.l} x2={W - M.r} y1={y(t)} y2={y(t)} stroke="#e2e7ef" />
            <text x={M.l - 4} y={y(t) + 3} textAnchor="end" fontSize="9" fill="#4c5d7d">
              {Number(t.toPrecision(3))}
            </text>
          </g>
        ))}
        {x.ticks(6).map((t) => (
          <text key={t} x={x(t)} y={H - M.b + 12} textAnchor="middle" fontSize="9" fill="#4c5d7d">
            {Number(t.toPrecision(3))}
          </text>
        ))}
        <text x={4} y={M.t + 2} fontSize="9" fill="#4c5d7d">
          {units === "US" ? "psi" : "MPa"}
        </text>
        <text x={W - M.r} y={H - 2} textAnchor="end" fontSize="9" fill="#4c5d7d">
          radius from the bolt axis ({units === "US" ? "in" : "mm"})
        </text>
        <path
          d={path((q) => p(q.estimateMpa))}
          fill="none"
          stroke="#a8701c"
          strokeWidth={1.5}
          strokeDasharray="5 3"
        />
        <path d={path((q) => p(q.feMpa))} fill="none" stroke="#1d2739" strokeWidth={1.75} />
      </svg>
      <figcaption className="text-micro text-ink-600">
        Solid: FE, per interface cell. Dashed: the estimate&apos;s pressure-cone footprint at the same bolt
        force.
      </figcaption>
    </figure>
  );
}
