import Link from "next/link";
import { buttonStyles } from "@/features/ui/button-styles";
import { OUTLINE_LABELS, STATUS_LABELS, UPDATED_LABELS } from "../model/labels";
import type { OwnerOption } from "../queries";
import { OUTLINE_KINDS, REVISION_STATUSES, UPDATED_WITHIN_DAYS, type ListDesignsQueryInput } from "../schema";

const selectClass = "rounded-plate border border-ink-200 bg-white px-2 py-2 text-body";

function Select({
  name,
  label,
  value,
  options,
}: {
  name: string;
  label: string;
  value: string | undefined;
  options: [string, string][];
}) {
  return (
    <label className="flex flex-col gap-1 text-table font-medium text-ink-800">
      {label}
      <select name={name} defaultValue={value ?? ""} className={selectClass}>
        <option value="">Any</option>
        {options.map(([v, text]) => (
          <option key={v} value={v}>
            {text}
          </option>
        ))}
      </select>
    </label>
  );
}

/** A plain GET form: filters live in the URL, so the register is server-rendered and shareable. */
export function RegisterFilters({ query, owners }: { query: ListDesignsQueryInput; owners: OwnerOption[] }) {
  // The choice lists: field name, label, current value, [value, text] options.
  const choices: [string, string, string | undefined, [string, string][]][] = [
    ["status", "Status", query.status, REVISION_STATUSES.map((s) => [s, STATUS_LABELS[s]])],
    ["owner", "Owner", query.owner, owners.map((o) => [o.userId, o.displayName])],
    ["outline", "Outline", query.outline, OUTLINE_KINDS.map((k) => [k, OUTLINE_LABELS[k]])],
    [
      "updatedWithinDays",
      "Updated",
      query.updatedWithinDays,
      UPDATED_WITHIN_DAYS.map((d) => [d, UPDATED_LABELS[d]]),
    ],
  ];
  return (
    <form
      method="get"
      action="/designs"
      role="search"
      aria-label="Filter the register"
      className="flex flex-wrap items-end gap-3 rounded-plate bg-steel-50 p-panel"
    >
      <label className="flex min-w-56 flex-1 flex-col gap-1 text-table font-medium text-ink-800">
        Search
        <input
          type="search"
          name="q"
          defaultValue={query.q ?? ""}
          placeholder="Name or equipment tag"
          className="rounded-plate border border-ink-200 bg-white px-3 py-2 text-body"
        />
      </label>
      {choices.map(([name, label, value, options]) => (
        <Select key={name} name={name} label={label} value={value} options={options} />
      ))}
      {query.sort !== "updated" ? <input type="hidden" name="sort" value={query.sort} /> : null}
      {query.dir ? <input type="hidden" name="dir" value={query.dir} /> : null}
      {query.archived === "only" ? <input type="hidden" name="archived" value="only" /> : null}
      <button type="submit" className={buttonStyles.secondary}>
        Apply
      </button>
      <Link
        href={query.archived === "only" ? "/designs?archived=only" : "/designs"}
        className={buttonStyles.quiet}
      >
        Clear
      </Link>
    </form>
  );
}
