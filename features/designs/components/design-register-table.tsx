import Link from "next/link";
import type { ActionResult } from "@/features/forms/action-result";
import { OUTLINE_LABELS, STATUS_LABELS, formatUtcMinute } from "../model/labels";
import { canArchiveDesign, canDuplicateDesign, type PolicyViewer } from "../policies";
import type { DesignListPage } from "../queries";
import { registerHref } from "../register-href";
import type { DESIGN_SORTS, ListDesignsQueryInput } from "../schema";
import { DesignRowActions } from "./design-row-actions";

type Sort = (typeof DESIGN_SORTS)[number];
type RowAction<T> = (state: ActionResult<T> | null, formData: FormData) => Promise<ActionResult<T> | null>;

const STATUS_TONE: Record<string, string> = {
  draft: "bg-steel-100 text-ink-700",
  in_review: "bg-brass-50 text-brass-700",
  returned: "bg-verdict-warn-bg text-verdict-warn",
  approved: "bg-verdict-pass-bg text-verdict-pass",
};

function SortHeader({ label, sort, query }: { label: string; sort: Sort; query: ListDesignsQueryInput }) {
  const active = query.sort === sort;
  const currentDir = query.dir ?? (sort === "updated" ? "desc" : "asc");
  const nextDir = active ? (currentDir === "asc" ? "desc" : "asc") : sort === "updated" ? "desc" : "asc";
  return (
    <th
      scope="col"
      aria-sort={active ? (currentDir === "asc" ? "ascending" : "descending") : "none"}
      className="px-3 py-2 text-left font-medium"
    >
      <Link href={registerHref(query, { sort, dir: nextDir, page: 1 })} className="hover:text-brass-700">
        {label} {active ? (currentDir === "asc" ? "↑" : "↓") : ""}
      </Link>
    </th>
  );
}

/** The Joint register: one row per design, its working revision's status in plain words. */
export function DesignRegisterTable({
  page,
  query,
  viewer,
  duplicateDesignAction,
  setDesignArchivedAction,
}: {
  page: DesignListPage;
  query: ListDesignsQueryInput;
  viewer: PolicyViewer;
  duplicateDesignAction: RowAction<{ designId: string }>;
  setDesignArchivedAction: RowAction<{ archived: boolean }>;
}) {
  if (page.items.length === 0) {
    return (
      <p className="rounded-plate border border-dashed border-ink-200 p-panel text-body text-ink-600">
        No joints match these filters.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="overflow-x-auto rounded-plate border border-ink-100 bg-white shadow-plate">
        <table className="w-full text-table">
          <caption className="sr-only">Joint register</caption>
          <thead className="bg-steel-50 text-ink-700">
            <tr>
              <SortHeader label="Name" sort="name" query={query} />
              <th scope="col" className="px-3 py-2 text-left font-medium">
                Equipment tag
              </th>
              <th scope="col" className="px-3 py-2 text-left font-medium">
                Outline
              </th>
              <th scope="col" className="px-3 py-2 text-left font-medium">
                Owner
              </th>
              <th scope="col" className="px-3 py-2 text-right font-medium">
                Rev.
              </th>
              <SortHeader label="Status" sort="status" query={query} />
              <SortHeader label="Updated" sort="updated" query={query} />
              <th scope="col" className="px-3 py-2 text-right font-medium">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {page.items.map((d) => (
              <tr key={d.designId} className="border-t border-ink-100 align-top">
                <td className="px-3 py-2">
                  <Link
                    href={`/designs/${d.designId}`}
                    className="font-medium text-ink-900 underline-offset-2 hover:underline"
                  >
                    {d.name}
                  </Link>
                </td>
                <td className="num px-3 py-2">{d.equipmentTag || "—"}</td>
                <td className="px-3 py-2">{OUTLINE_LABELS[d.outlineKind] ?? d.outlineKind}</td>
                <td className="px-3 py-2">{d.ownerName}</td>
                <td className="num px-3 py-2 text-right">{d.revisionNumber}</td>
                <td className="px-3 py-2">
                  <span
                    className={`rounded-plate px-2 py-0.5 text-micro font-medium ${STATUS_TONE[d.status]}`}
                  >
                    {STATUS_LABELS[d.status]}
                  </span>
                </td>
                <td className="num px-3 py-2 whitespace-nowrap">{formatUtcMinute(d.updatedAt)}</td>
                <td className="px-3 py-2">
                  <DesignRowActions
                    designId={d.designId}
                    name={d.name}
                    archived={d.archived}
                    canDuplicate={canDuplicateDesign(viewer)}
                    canArchive={canArchiveDesign(viewer, d)}
                    duplicateDesignAction={duplicateDesignAction}
                    setDesignArchivedAction={setDesignArchivedAction}
                  />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <nav aria-label="Register pages" className="flex items-center justify-between text-table text-ink-700">
        <span>
          {page.total} {page.total === 1 ? "joint" : "joints"} · page {page.page} of {page.pageCount}
        </span>
        <span className="flex gap-3">
          {page.page > 1 ? (
            <Link href={registerHref(query, { page: page.page - 1 })} className="hover:text-brass-700">
              ← Previous
            </Link>
          ) : null}
          {page.page < page.pageCount ? (
            <Link href={registerHref(query, { page: page.page + 1 })} className="hover:text-brass-700">
              Next →
            </Link>
          ) : null}
        </span>
      </nav>
    </div>
  );
}
