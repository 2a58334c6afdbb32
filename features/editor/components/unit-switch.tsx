"use client";
import type { UnitSystem } from "@/features/analysis/core/design";

/** SI ↔ US switch for every field and every result shown (the document itself stays in mm, N, MPa). */
export function UnitSwitch({
  units,
  onChange,
  pending,
}: {
  units: UnitSystem;
  onChange: (u: UnitSystem) => void;
  pending?: boolean;
}) {
  return (
    <div
      role="radiogroup"
      aria-label="Units"
      className="inline-flex overflow-hidden rounded-plate border border-ink-200 text-table"
    >
      {(["SI", "US"] as const).map((u) => (
        <button
          key={u}
          type="button"
          role="radio"
          aria-checked={units === u}
          disabled={pending}
          className={`px-2.5 py-1 ${units === u ? "bg-ink-800 text-white" : "bg-white text-ink-700 hover:bg-ink-50"}`}
          onClick={() => u !== units && onChange(u)}
        >
          {u === "SI" ? "SI (mm, N, MPa)" : "US (in, lbf, psi)"}
        </button>
      ))}
    </div>
  );
}
