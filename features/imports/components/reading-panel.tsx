"use client";

import type { AssumedUnit } from "../model/dxf-units";
import type { DxfReading } from "../model/parse-dxf-flange";

// What the Drawing intake read from the DXF, for the user to confirm: the Drawing unit switch
// (only when the file states no unit), the Layer switches, and the Reading report (every entity
// by type and layer: used, not used, or skipped, and why).
const r1 = (v: number) => Math.round(v * 10) / 10;

export function ReadingPanel({
  reading,
  onLayers,
  onUnit,
}: {
  reading: DxfReading;
  onLayers: (on: string[]) => void;
  onUnit: (unit: AssumedUnit) => void;
}) {
  const on = reading.layers.filter((l) => l.on).map((l) => l.name);
  const size = reading.sizeInUnits;
  return (
    <div className="flex flex-col gap-3 rounded-plate border border-ink-100 bg-steel-50 p-panel">
      {!reading.units.stated ? (
        <fieldset className="flex flex-col gap-1" aria-label="Drawing unit switch">
          <legend className="text-table font-semibold text-ink-800">
            Drawing unit: the file states none
          </legend>
          <div className="flex gap-4 text-table">
            {(["mm", "in"] as const).map((u) => (
              <label key={u} className="flex items-center gap-1">
                <input
                  type="radio"
                  name="dxfUnitChoice"
                  value={u}
                  checked={reading.units.assumed === u}
                  onChange={() => onUnit(u)}
                />
                {u === "mm" ? "millimetres" : "inches"}
              </label>
            ))}
          </div>
          {size ? (
            <p className="num text-table text-ink-700" data-testid="size-read">
              Outline read as {r1(size.width)} × {r1(size.height)} drawing units: {r1(size.width)} ×{" "}
              {r1(size.height)} mm if millimetres, {r1(size.width * 25.4)} × {r1(size.height * 25.4)} mm if
              inches.
            </p>
          ) : null}
        </fieldset>
      ) : null}
      <fieldset className="flex flex-col gap-1" aria-label="Layer switches">
        <legend className="text-table font-semibold text-ink-800">Layer switches</legend>
        <ul className="flex flex-wrap gap-x-4 gap-y-1 text-table">
          {reading.layers.map((l) => (
            <li key={l.name}>
              <label className="flex items-center gap-1">
                <input
                  type="checkbox"
                  checked={l.on}
                  onChange={(ev) =>
                    onLayers(ev.target.checked ? [...on, l.name] : on.filter((n) => n !== l.name))
                  }
                />
                <span className="num">{l.name}</span>
                <span className="text-ink-500">
                  ({l.entities}
                  {l.offByDefault ? `; ${l.offByDefault}, off by default` : ""})
                </span>
              </label>
            </li>
          ))}
        </ul>
      </fieldset>
      <details open>
        <summary className="cursor-pointer text-table font-semibold text-ink-800">Reading report</summary>
        <div className="max-h-64 overflow-auto">
          <table className="w-full text-table" aria-label="Reading report">
            <thead className="text-left text-ink-600">
              <tr>
                <th className="px-2 py-1 font-medium">Status</th>
                <th className="px-2 py-1 font-medium">Entity</th>
                <th className="px-2 py-1 font-medium">Layer</th>
                <th className="px-2 py-1 font-medium">Count</th>
                <th className="px-2 py-1 font-medium">What</th>
              </tr>
            </thead>
            <tbody>
              {reading.tally.map((t) => (
                <tr key={`${t.status}|${t.type}|${t.layer}|${t.detail}`} className="border-t border-ink-100">
                  <td
                    className={`px-2 py-1 ${t.status === "used" ? "text-verdict-pass" : t.status === "skipped" ? "text-ink-500" : "text-verdict-warn"}`}
                  >
                    {t.status}
                  </td>
                  <td className="num px-2 py-1">{t.type}</td>
                  <td className="num px-2 py-1">{t.layer}</td>
                  <td className="num px-2 py-1">
                    {t.count}
                    {t.fromBlocks ? ` (${t.fromBlocks} from blocks)` : ""}
                  </td>
                  <td className="px-2 py-1">{t.detail}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </details>
    </div>
  );
}
