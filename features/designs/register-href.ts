import type { ListDesignsQueryInput } from "./schema";

/** The register's URL for a query with some parameters changed (defaults left out). */
export function registerHref(query: ListDesignsQueryInput, changes: Partial<ListDesignsQueryInput>): string {
  const next = { ...query, ...changes };
  const params = new URLSearchParams();
  if (next.q) params.set("q", next.q);
  if (next.status) params.set("status", next.status);
  if (next.owner) params.set("owner", next.owner);
  if (next.outline) params.set("outline", next.outline);
  if (next.updatedWithinDays) params.set("updatedWithinDays", next.updatedWithinDays);
  if (next.sort !== "updated") params.set("sort", next.sort);
  if (next.dir) params.set("dir", next.dir);
  if (next.page > 1) params.set("page", String(next.page));
  if (next.archived === "only") params.set("archived", "only");
  const text = params.toString();
  return text ? `/designs?${text}` : "/designs";
}
