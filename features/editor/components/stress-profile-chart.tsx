import type { ReactNode } from "react";
import { ValueGrid, linePath } from "@/features/ui/chart-grid";
import { linearScale } from "@/features/ui/linear-scale";
import type { UnitSystem } from "@/features/analysis/core/design";
import { decimateMinMax } from "../model/decimate";
import type { ProfileView } from "../model/readout-view";
import { formatQuantity, toDisplay, unitLabel } from "../model/quantities";

/** An FE cross-check's gasket stress along the same path, at minimum preload. */
export interface FeTrace {
  sMm: number[];
  stressMpa: number[];
  minStressMpa: number;
}

const W = 520,
  H = 190,
  M = { l: 52, r: 10, t: 12, b: 26 };

/** A horizontal limit across the plot (seating, crush) with its label at the right end. */
function LimitLine({
  y,
  stroke,
  dash,
  name,
  children,
}: {
  y: number;
  stroke: string;
  dash: string;
  name: string;
  children: ReactNode;
}) {
  return (
    <>
      <line x1={M.l} x2={W - M.r} y1={y} y2={y} stroke={stroke} strokeDasharray={dash} data-line={name} />
      <text x={W - M.r} y={y - 3} textAnchor="end" fontSize="9" fill={stroke}>
        {children}
      </text>
    </>
  );
}

/**
 * The "Seat trace": gasket stress along the gasket path at minimum and target preload, with the
 * required seating stress and the crush limit as lines and the bolt positions as ticks. With a
 * finished FE cross-check of the saved document, its gasket stress at minimum preload as a third curve.
 */
export function StressProfileChart({
  profile,
  seatingMpa,
  crushMpa,
  units,
  fe = null,
}: {
  profile: ProfileView;
  seatingMpa: number;
  crushMpa: number | null;
  units: UnitSystem;
  fe?: FeTrace | null;
}) {
  let feMax = 0;
  if (fe) for (const v of fe.stressMpa) feMax = Math.max(feMax, v);
  const top = Math.max(profile.maxMpa, seatingMpa, crushMpa ?? 0, feMax) * 1.08 || 1;
  const x = linearScale([0, profile.pathLengthMm], [M.l, W - M.r]);
  const y = linearScale([0, top], [H - M.b, M.t]);
  // Two points per pixel column at most (every peak and trough kept): thousands of samples otherwise.
  const trace = decimateMinMax(profile.sMm, profile.stressMpa, 0, profile.pathLengthMm, W - M.l - M.r);
  const line = (f: number) => linePath(trace.xs, trace.ys, x, (v) => y(v * f));
  const feTrace = fe ? decimateMinMax(fe.sMm, fe.stressMpa, 0, profile.pathLengthMm, W - M.l - M.r) : null;
  const unit = unitLabel("stress", units);
  const minAtMin = profile.minMpa * profile.minFactor;
  return (
    <figure aria-label="Gasket stress along the path">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        className="w-full"
        role="img"
        aria-label={`Minimum ${formatQuantity("stress", minAtMin, units)} at minimum preload, maximum ${formatQuantity("stress", profile.maxMpa, units)} at target preload`}
      >
        <ValueGrid
          y={y}
          ticks={y.ticks(4)}
          left={M.l}
          right={W - M.r}
          value={(t) => toDisplay("stress", t, units)}
        />
        <text x={4} y={M.t + 2} fontSize="9" fill="#4c5d7d">
          {unit}
        </text>
        {profile.boltSOnPathMm.map((s, i) => (
          <line key={i} x1={x(s)} x2={x(s)} y1={H - M.b} y2={H - M.b + 5} stroke="#1d2739" />
        ))}
        <LimitLine y={y(seatingMpa)} stroke="#b3261e" dash="5 3" name="seating">
          required seating {formatQuantity("stress", seatingMpa, units, 3)}
        </LimitLine>
        {crushMpa !== null && (
          <LimitLine y={y(crushMpa)} stroke="#1d2739" dash="2 2" name="crush">
            crush limit {formatQuantity("stress", crushMpa, units, 3)}
          </LimitLine>
        )}
        <path d={line(1)} fill="none" stroke="#c98d2b" strokeWidth="1.2" data-series="target" />
        <path
          d={line(profile.minFactor)}
          fill="none"
          stroke="#2b3850"
          strokeWidth="1.5"
          data-series="minimum"
        />
        {feTrace && (
          <path
            d={linePath(feTrace.xs, feTrace.ys, x, y)}
            fill="none"
            stroke="#2f7d5b"
            strokeWidth="1.5"
            strokeDasharray="4 2"
            data-series="fe"
          />
        )}
        <text x={(M.l + W - M.r) / 2} y={H - 4} textAnchor="middle" fontSize="9" fill="#4c5d7d">
          position along the gasket path ({unitLabel("length", units)}), bolts ticked
        </text>
      </svg>
      <figcaption className="num flex flex-wrap gap-x-4 text-micro text-ink-600">
        <span>
          <span className="text-ink-800">━</span> minimum preload: min{" "}
          {formatQuantity("stress", minAtMin, units)}
        </span>
        <span>
          <span className="text-brass-500">━</span> target preload: min{" "}
          {formatQuantity("stress", profile.minMpa, units)}, max{" "}
          {formatQuantity("stress", profile.maxMpa, units)}, mean{" "}
          {formatQuantity("stress", profile.meanMpa, units)}
        </span>
        {fe && (
          <span data-testid="seat-trace-fe">
            <span className="text-[#2f7d5b]">╍</span> FE cross-check, minimum preload: min{" "}
            {formatQuantity("stress", fe.minStressMpa, units)}
          </span>
        )}
      </figcaption>
    </figure>
  );
}
