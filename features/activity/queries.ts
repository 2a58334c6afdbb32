import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { ActivityEntryDto, ActivityKind } from "./activity-kinds";
import { isoString } from "@/db/dates";

// The append-only activity log of a design (table design_activity; the database refuses UPDATE
// and DELETE). Anyone may record into it: pass the transaction you are in so the entry commits or
// rolls back with the change it describes.

export interface ActivityInput {
  organizationId: string;
  designId: string;
  revisionId?: string | null;
  actorId: string;
  kind: ActivityKind;
  /** Short human text, e.g. "sheet.pdf", "Returned: bolt b4 too close to the pass partition". */
  detail?: string;
}

/** Appends one entry. `executor` is the db or the transaction of the change it records. */
export async function recordActivity(executor: Kysely<Database>, input: ActivityInput): Promise<void> {
  await executor
    .insertInto("design_activity")
    .values({
      organization_id: input.organizationId,
      design_id: input.designId,
      revision_id: input.revisionId ?? null,
      actor_id: input.actorId,
      kind: input.kind,
      detail: (input.detail ?? "").slice(0, 2000),
    })
    .execute();
}

/** Newest first. Another organisation's design yields an empty list. */
export async function listActivity(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  options: { revisionId?: string; limit?: number } = {},
): Promise<ActivityEntryDto[]> {
  let query = db
    .selectFrom("design_activity as a")
    .innerJoin("users as u", "u.id", "a.actor_id")
    .leftJoin("design_revisions as r", "r.id", "a.revision_id")
    .select(["a.id", "a.kind", "a.detail", "a.created_at", "u.display_name", "r.number"])
    .where("a.organization_id", "=", organizationId)
    .where("a.design_id", "=", designId);
  if (options.revisionId) query = query.where("a.revision_id", "=", options.revisionId);
  const rows = await query
    .orderBy("a.created_at", "desc")
    .orderBy("a.id", "desc")
    .limit(options.limit ?? 100)
    .execute();
  return rows.map((row) => ({
    id: row.id,
    kind: row.kind,
    actorName: row.display_name,
    revisionNumber: row.number ?? null,
    detail: row.detail,
    at: isoString(row.created_at),
  }));
}
