import type { LinearScale } from "./linear-scale";

/**
 * The value axis of the on-screen line charts (the Seat trace, FE against the estimate): a light
 * gridline across the plot from `left` to `right` at each tick, its value in the margin left of it.
 */
export function ValueGrid({
  y,
  ticks,
  left,
  right,
  value,
}: {
  y: LinearScale;
  ticks: number[];
  left: number;
  right: number;
  /** The number printed for tick t (in the chart's display unit). */
  value: (t: number) => number;
}) {
  return ticks.map((t) => (
    <g key={t}>
      <line x1={left} x2={right} y1={y(t)} y2={y(t)} stroke="#e2e7ef" />
      <text x={left - 4} y={y(t) + 3} textAnchor="end" fontSize="9" fill="#4c5d7d">
        {Number(value(t).toPrecision(3))}
      </text>
    </g>
  ));
}

/** The SVG path data of a line through the points (x(xs[i]), y(ys[i])), to a tenth of a pixel. */
export function linePath(
  xs: readonly number[],
  ys: readonly number[],
  x: (v: number) => number,
  y: (v: number) => number,
): string {
  return xs.map((s, i) => `${i ? "L" : "M"}${x(s).toFixed(1)},${y(ys[i]).toFixed(1)}`).join("");
}
