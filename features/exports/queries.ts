import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import type { RevisionStatus } from "@/db/tables/designs";
import { isoOrNull } from "@/db/dates";
import { selectRevisionOfDesign, SNAPSHOT_COLUMNS } from "@/features/reviews/queries";

// Reads for the export routes and the background sheet job. Every read filters by the viewer's
// organisation: another organisation's design is simply not found (the route answers 404).
export interface ExportRevisionDto {
  designId: string;
  revisionId: string;
  designName: string;
  equipmentTag: string;
  number: number;
  status: RevisionStatus;
  document: JointDesign;
  /** The stored JointAnalysis (null if none was stored). */
  result: JointAnalysis | null;
  coreVersion: string | null;
  contentHash: string | null;
  designerName: string;
  approverName: string | null;
  approvedAt: string | null;
  boltCount: number;
}

/** One stored revision of a design of this organisation, or undefined. */
export async function findExportRevision(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  number: number,
): Promise<ExportRevisionDto | undefined> {
  const row = await selectRevisionOfDesign(db, organizationId, designId, number)
    .innerJoin("users as c", "c.id", "r.created_by")
    .leftJoin("users as s", "s.id", "r.submitted_by")
    .leftJoin("users as a", "a.id", "r.decided_by")
    .select([
      "d.id as design_id",
      "d.name",
      "d.equipment_tag",
      "r.id as revision_id",
      "r.number",
      "r.status",
      ...SNAPSHOT_COLUMNS,
      "r.decided_at",
      "c.display_name as creator_name",
      "s.display_name as submitter_name",
      "a.display_name as decider_name",
    ])
    .executeTakeFirst();
  if (!row) return undefined;
  const document = row.document;
  const approved = row.status === "approved";
  return {
    designId: row.design_id,
    revisionId: row.revision_id,
    designName: row.name,
    equipmentTag: row.equipment_tag,
    number: row.number,
    status: row.status,
    document,
    result: row.result ?? null,
    coreVersion: row.core_version,
    contentHash: row.content_hash,
    designerName: row.submitter_name ?? row.creator_name,
    approverName: approved ? row.decider_name : null,
    approvedAt: approved ? isoOrNull(row.decided_at) : null,
    boltCount: Array.isArray(document?.bolts) ? document.bolts.length : 0,
  };
}
