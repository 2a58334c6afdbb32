import { getBoltPath, getBoltPoints } from "@/features/analysis/core/geometry";
import { pathToPolyline } from "@/features/analysis/core/path";
import { outlineToPolyline } from "@/features/analysis/core/geometry";
import type { JointDesign } from "@/features/analysis/core/design";

// A still picture of what the import would create: outline, bore, fitted bolt path (dashed) and
// the holes at their drawn positions. Model coordinates are y-up, so the group is flipped.
export function GeometryPreview({ design, holeDiameterMm }: { design: JointDesign; holeDiameterMm: number }) {
  const outline = outlineToPolyline(design.outline, 2);
  const path = pathToPolyline(getBoltPath(design.outline, design.boltPath), 2);
  const bolts = getBoltPoints(design);
  const xs = outline.map((p) => p.x);
  const ys = outline.map((p) => p.y);
  const pad = 0.06 * Math.max(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
  const vb = [
    Math.min(...xs) - pad,
    -(Math.max(...ys) + pad),
    Math.max(...xs) - Math.min(...xs) + 2 * pad,
    Math.max(...ys) - Math.min(...ys) + 2 * pad,
  ];
  const stroke = vb[2] / 400;
  const pts = (list: { x: number; y: number }[]) => list.map((p) => `${p.x},${p.y}`).join(" ");
  return (
    <svg
      viewBox={vb.join(" ")}
      role="img"
      aria-label={`Preview: ${bolts.length} bolt holes`}
      className="h-80 w-full rounded-plate border border-ink-100 bg-white"
      data-testid="import-preview"
    >
      <g transform="scale(1,-1)">
        <polygon points={pts(outline)} fill="#eeeeea" stroke="#1d2739" strokeWidth={stroke * 1.5} />
        {design.bore ? (
          <polygon
            points={pts(outlineToPolyline(design.bore, 2))}
            fill="#ffffff"
            stroke="#394864"
            strokeWidth={stroke}
          />
        ) : null}
        <polygon
          points={pts(path)}
          fill="none"
          stroke="#c98d2b"
          strokeWidth={stroke}
          strokeDasharray={`${stroke * 6} ${stroke * 4}`}
        />
        {bolts.map((b, i) => (
          <circle
            key={i}
            cx={b.x}
            cy={b.y}
            r={holeDiameterMm / 2}
            fill="#ffffff"
            stroke="#121a28"
            strokeWidth={stroke}
            data-testid="import-hole"
          />
        ))}
      </g>
    </svg>
  );
}
