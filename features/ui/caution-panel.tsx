import { CAUTIONS } from "./cautions";

/** The cautions box shown beside every result. */
export function CautionPanel({ compact = false }: { compact?: boolean }) {
  return (
    <aside
      aria-label="Cautions"
      className="rounded-plate border border-brass-300 bg-brass-50 p-3 text-table text-ink-800"
    >
      <p className="font-semibold text-brass-700">Before you rely on these numbers</p>
      <ul className={compact ? "mt-1 list-disc pl-5" : "mt-2 list-disc space-y-1 pl-5"}>
        {CAUTIONS.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </aside>
  );
}
