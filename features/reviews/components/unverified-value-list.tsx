import type { UnverifiedValue } from "@/features/analysis/unverified-values";

/** The list of a result's unverified values (table values from memory): what, value, where from. */
export function UnverifiedValueList({ values, label }: { values: UnverifiedValue[]; label: string }) {
  return (
    <ul aria-label={label} className="flex flex-col gap-1 text-table text-ink-700">
      {values.map((v) => (
        <li key={v.key} className="rounded-plate bg-ink-50 px-2 py-1">
          <span className="font-medium text-ink-900">{v.what}</span>:{" "}
          <span className="tabular-nums">{v.value}</span>
          <span className="block text-micro text-ink-500">{v.source}</span>
        </li>
      ))}
    </ul>
  );
}
