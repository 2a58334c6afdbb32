import type { JointDesign, PointMm } from "@/features/analysis/core/design";
import { buildBoltScene, buildStaticScene } from "../model/canvas-scene";

/**
 * The two revisions' drawings on one sheet: the earlier one ghosted (dashed, pale), the later one
 * solid, an arrow from where each kept bolt was to where it is now, added bolts ringed in brass
 * and removed ones crossed out. Plain SVG from the editor's own scene geometry, so it renders on
 * the server and prints; model y is up, so y is flipped into the picture.
 */
export function RevisionOverlay({
  before,
  after,
  labels,
}: {
  before: JointDesign;
  after: JointDesign;
  labels: { before: string; after: string };
}) {
  const draw = (d: JointDesign) => {
    const s = buildStaticScene(d);
    return { ...s, ...buildBoltScene(d, s.boltPath) };
  };
  let a: ReturnType<typeof draw>;
  let b: ReturnType<typeof draw>;
  try {
    a = draw(before);
    b = draw(after);
  } catch {
    return <p className="text-body text-ink-500">The drawings of these revisions cannot be overlaid.</p>;
  }
  const xMin = Math.min(a.bounds.xMinMm, b.bounds.xMinMm);
  const xMax = Math.max(a.bounds.xMaxMm, b.bounds.xMaxMm);
  const yMin = Math.min(a.bounds.yMinMm, b.bounds.yMinMm);
  const yMax = Math.max(a.bounds.yMaxMm, b.bounds.yMaxMm);
  const size = Math.max(xMax - xMin, yMax - yMin);
  const pad = size * 0.06;
  const sw = size / 450;
  const r = Math.max(a.holeRadiusMm, b.holeRadiusMm);
  const X = (p: PointMm) => p.x - xMin + pad;
  const Y = (p: PointMm) => yMax - p.y + pad;
  const poly = (pts: PointMm[] | null) =>
    pts ? `M${pts.map((p) => `${X(p).toFixed(2)},${Y(p).toFixed(2)}`).join("L")}Z` : "";
  const beforeById = new Map(a.bolts.map((x) => [x.id, x.p]));
  const afterIds = new Set(b.bolts.map((x) => x.id));
  const width = xMax - xMin + 2 * pad;
  const height = yMax - yMin + 2 * pad;
  const ghost = "#98a6bf";
  const solid = "#1d2739";
  const accent = "#c98d2b";
  const arrows = b.bolts.flatMap((x) => {
    const from = beforeById.get(x.id);
    if (!from || Math.hypot(from.x - x.p.x, from.y - x.p.y) < 1e-6) return [];
    return [{ id: x.id, from, to: x.p }];
  });
  return (
    <figure className="flex flex-col gap-2" aria-label="Drawings overlaid">
      <svg
        viewBox={`0 0 ${width.toFixed(2)} ${height.toFixed(2)}`}
        className="h-auto w-full max-w-[640px] rounded-plate bg-white shadow-plate"
        role="img"
        aria-label={`${labels.before} ghosted under ${labels.after}; ${arrows.length} bolts moved`}
        data-testid="revision-overlay"
      >
        <defs>
          <marker
            id="moved-arrow"
            viewBox="0 0 10 10"
            refX="9"
            refY="5"
            markerWidth="5"
            markerHeight="5"
            orient="auto"
          >
            <path d="M0,0L10,5L0,10Z" fill={accent} />
          </marker>
        </defs>
        <g
          fill="none"
          stroke={ghost}
          strokeWidth={sw}
          strokeDasharray={`${sw * 6} ${sw * 4}`}
          data-layer="before"
        >
          <path d={poly(a.outline)} />
          <path d={poly(a.bore)} />
          <path d={poly(a.gasketOuter)} fill="#e2e7ef" fillOpacity={0.5} />
          <path d={poly(a.gasketInner)} fill="#ffffff" />
          {a.bolts.map((x) => (
            <circle key={x.id} cx={X(x.p)} cy={Y(x.p)} r={a.holeRadiusMm} />
          ))}
        </g>
        <g fill="none" stroke={solid} strokeWidth={sw * 1.6} data-layer="after">
          <path d={poly(b.outline)} />
          <path d={poly(b.bore)} />
          <path d={poly(b.gasketOuter)} strokeWidth={sw} />
          <path d={poly(b.gasketInner)} strokeWidth={sw} />
          <path
            d={poly(b.boltPathLine)}
            strokeWidth={sw * 0.6}
            strokeDasharray={`${sw * 10} ${sw * 3} ${sw} ${sw * 3}`}
          />
          {b.bolts.map((x) => (
            <circle
              key={x.id}
              cx={X(x.p)}
              cy={Y(x.p)}
              r={b.holeRadiusMm}
              stroke={beforeById.has(x.id) ? solid : accent}
              strokeWidth={beforeById.has(x.id) ? sw * 1.6 : sw * 3}
            />
          ))}
        </g>
        <g stroke={accent} strokeWidth={sw * 1.8} fill="none">
          {arrows.map((m) => (
            <line
              key={m.id}
              x1={X(m.from)}
              y1={Y(m.from)}
              x2={X(m.to)}
              y2={Y(m.to)}
              markerEnd="url(#moved-arrow)"
            />
          ))}
          {a.bolts
            .filter((x) => !afterIds.has(x.id))
            .map((x) => (
              <path
                key={x.id}
                d={`M${X(x.p) - r},${Y(x.p) - r}L${X(x.p) + r},${Y(x.p) + r}M${X(x.p) - r},${Y(x.p) + r}L${X(x.p) + r},${Y(x.p) - r}`}
                stroke="#b3261e"
              />
            ))}
        </g>
        <g fill={solid} fontSize={size / 40} textAnchor="middle" dominantBaseline="central">
          {b.bolts.map((x) => {
            const len = Math.hypot(x.p.x, x.p.y) || 1;
            const out = { x: x.p.x + (x.p.x / len) * r * 2.4, y: x.p.y + (x.p.y / len) * r * 2.4 };
            return (
              <text key={x.id} x={X(out)} y={Y(out)}>
                {x.id}
              </text>
            );
          })}
        </g>
      </svg>
      <figcaption className="flex flex-wrap gap-4 text-micro text-ink-600">
        <Swatch stroke={ghost} dashed label={labels.before} />
        <Swatch stroke={solid} label={labels.after} />
        <span>
          <svg width="28" height="8" aria-hidden className="mr-1 inline">
            <line x1="0" y1="4" x2="24" y2="4" stroke={accent} strokeWidth="2" />
            <path d="M22,0L28,4L22,8Z" fill={accent} />
          </svg>
          bolt moved
        </span>
        <span className="text-brass-700">◯ bolt added</span>
        <span className="text-verdict-fail">✕ bolt removed</span>
      </figcaption>
    </figure>
  );
}

function Swatch({ stroke, dashed, label }: { stroke: string; dashed?: boolean; label: string }) {
  return (
    <span>
      <svg width="28" height="8" aria-hidden className="mr-1 inline">
        <line
          x1="0"
          y1="4"
          x2="28"
          y2="4"
          stroke={stroke}
          strokeWidth="2"
          strokeDasharray={dashed ? "6 4" : undefined}
        />
      </svg>
      {label}
    </span>
  );
}
