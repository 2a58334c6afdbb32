import type { UnitSystem } from "@/features/analysis/core/design";
import type { HeatScale } from "../model/heat-scale";
import { formatQuantity } from "../model/quantities";

/** Colour key of the heat map, with the stress at each stop in the chosen units. Drawn below the drawing, never over bolts. */
export function StressLegend({
  scale,
  units,
  basis,
}: {
  scale: HeatScale;
  units: UnitSystem;
  basis: string;
}) {
  const top = scale.maxMpa || 1;
  const gradient = scale.stops
    .map((s) => `${s.colour} ${((s.stressMpa / top) * 100).toFixed(1)}%`)
    .join(", ");
  return (
    <figure
      aria-label="Gasket stress colour key"
      className="w-full max-w-xs rounded-plate bg-white p-2 text-micro text-ink-700"
    >
      <figcaption className="mb-1 font-medium">Gasket stress ({basis})</figcaption>
      <div className="h-2.5 rounded" style={{ background: `linear-gradient(to right, ${gradient})` }} />
      <div className="relative mt-1 h-8">
        {scale.stops
          .filter((s) => s.label)
          .map((s) => (
            <span
              key={s.label + s.stressMpa}
              className="num absolute -translate-x-1/2 whitespace-nowrap text-center"
              style={{ left: `${Math.min(96, Math.max(4, (s.stressMpa / top) * 100))}%` }}
            >
              {s.label}
              <br />
              {formatQuantity("stress", s.stressMpa, units, 3)}
            </span>
          ))}
      </div>
    </figure>
  );
}
