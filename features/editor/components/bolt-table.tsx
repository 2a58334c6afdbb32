import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { UnitSystem } from "@/features/analysis/core/design";
import { formatQuantity } from "../model/quantities";

/** Per-bolt rows: position, pitch to the next bolt, preload window and torque. */
export function BoltTable({
  analysis,
  units,
  onPick,
}: {
  analysis: JointAnalysis;
  units: UnitSystem;
  onPick?: (boltId: string) => void;
}) {
  const rows = [...analysis.bolts].sort((a, b) => a.sMm - b.sMm);
  const f = (q: "length" | "force" | "torque", v: number | null) =>
    v === null ? "—" : formatQuantity(q, v, units);
  return (
    <div className="max-h-72 overflow-auto">
      <table className="w-full text-table" aria-label="Bolts">
        <thead className="sticky top-0 bg-white text-left text-micro text-ink-500">
          <tr>
            <th>Bolt</th>
            <th className="text-right">x</th>
            <th className="text-right">y</th>
            <th className="text-right">Arc</th>
            <th className="text-right">Pitch to next</th>
            <th className="text-right">Preload min–max</th>
            <th className="text-right">Torque</th>
          </tr>
        </thead>
        <tbody className="num">
          {rows.map((b) => (
            <tr
              key={b.id}
              className="border-t border-ink-100 hover:bg-steel-50"
              onClick={() => onPick?.(b.id)}
            >
              <td className="py-0.5 font-medium">{b.id}</td>
              <td className="text-right">{f("length", b.xMm)}</td>
              <td className="text-right">{f("length", b.yMm)}</td>
              <td className="text-right">{f("length", b.sMm)}</td>
              <td className="text-right">{f("length", b.pitchToNextMm)}</td>
              <td className="text-right">
                {f("force", b.preloadMinN)} – {f("force", b.preloadMaxN)}
              </td>
              <td className="text-right">{f("torque", b.torqueNmm)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
