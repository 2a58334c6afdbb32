import "server-only";
import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { JointDesign } from "@/features/analysis/core/design";
import { DESIGNS_PAGE_SIZE, type ListDesignsQueryInput } from "./schema";
import type { JointAnalysis, WorkingRevisionStatus } from "./workspace-contract";
import { isoString } from "@/db/dates";

// Reads of the designs feature. Every query filters by organisation: another organisation's id
// is simply not found (null), which pages turn into notFound() and the API into a 404.

export interface DesignListItemDto {
  designId: string;
  name: string;
  equipmentTag: string;
  outlineKind: string;
  ownerId: string;
  ownerName: string;
  revisionNumber: number;
  status: WorkingRevisionStatus;
  updatedAt: string;
  archived: boolean;
}

export interface DesignListPage {
  items: DesignListItemDto[];
  total: number;
  page: number;
  pageCount: number;
  pageSize: number;
}

export interface DesignDetailDto extends DesignListItemDto {
  organizationId: string;
  revisionId: string;
  version: number;
  document: JointDesign;
  result: JointAnalysis | null;
  coreVersion: string | null;
  revisionCount: number;
  everSubmitted: boolean;
  lastEditedByName: string;
  revisionUpdatedAt: string;
}

const STATUS_ORDER = sql<number>`case design_revisions.status when 'draft' then 0 when 'returned' then 1 when 'in_review' then 2 else 3 end`;

/** Designs joined to their working (highest-numbered) revision and owner. */
function workingRevisions(db: Kysely<Database>, organizationId: string) {
  return db
    .selectFrom("designs")
    .innerJoin("design_revisions", "design_revisions.design_id", "designs.id")
    .innerJoin("users as owner", "owner.id", "designs.owner_id")
    .where("designs.organization_id", "=", organizationId)
    .where("design_revisions.organization_id", "=", organizationId)
    .where("design_revisions.number", "=", (eb) =>
      eb
        .selectFrom("design_revisions as later")
        .select((e) => e.fn.max("later.number").as("n"))
        .whereRef("later.design_id", "=", "designs.id"),
    );
}

/** The columns of a register row (and of every read of one design). */
const LIST_COLUMNS = [
  "designs.id",
  "designs.name",
  "designs.equipment_tag",
  "designs.outline_kind",
  "designs.owner_id",
  "designs.updated_at",
  "designs.archived_at",
  "owner.display_name as owner_name",
  "design_revisions.number",
  "design_revisions.status",
] as const;

function escapeLike(text: string): string {
  return text.replace(/[\\%_]/g, (c) => `\\${c}`);
}

export async function listDesigns(
  db: Kysely<Database>,
  organizationId: string,
  query: ListDesignsQueryInput,
): Promise<DesignListPage> {
  let base = workingRevisions(db, organizationId);
  base =
    query.archived === "only"
      ? base.where("designs.archived_at", "is not", null)
      : base.where("designs.archived_at", "is", null);
  if (query.q) {
    const pattern = `%${escapeLike(query.q)}%`;
    base = base.where((eb) =>
      eb.or([eb("designs.name", "ilike", pattern), eb("designs.equipment_tag", "ilike", pattern)]),
    );
  }
  if (query.status) base = base.where("design_revisions.status", "=", query.status);
  if (query.owner) base = base.where("designs.owner_id", "=", query.owner);
  if (query.outline) base = base.where("designs.outline_kind", "=", query.outline);
  if (query.updatedWithinDays) {
    base = base.where(
      "designs.updated_at",
      ">=",
      sql<never>`now() - make_interval(days => ${Number(query.updatedWithinDays)})`,
    );
  }

  const dir = query.dir ?? (query.sort === "updated" ? "desc" : "asc");
  // One statement for the page and the total (a window count over the filtered rows); only a page
  // past the end asks for the count alone and reads the last page instead.
  const pageRows = (page: number) => {
    let ordered = base.select((eb) => [...LIST_COLUMNS, eb.fn.countAll<number>().over().as("total")]);
    if (query.sort === "name") ordered = ordered.orderBy(sql`lower(designs.name)`, dir);
    else if (query.sort === "status")
      ordered = ordered.orderBy(STATUS_ORDER, dir).orderBy("designs.updated_at", "desc");
    else ordered = ordered.orderBy("designs.updated_at", dir);
    return ordered
      .orderBy("designs.id")
      .limit(DESIGNS_PAGE_SIZE)
      .offset((page - 1) * DESIGNS_PAGE_SIZE)
      .execute();
  };
  let page = query.page;
  let rows = await pageRows(page);
  let totalCount = rows.length > 0 ? Number(rows[0].total) : 0;
  if (rows.length === 0 && page > 1) {
    const { total } = await base
      .select((eb) => eb.fn.countAll<number>().as("total"))
      .executeTakeFirstOrThrow();
    totalCount = Number(total);
    page = Math.max(1, Math.ceil(totalCount / DESIGNS_PAGE_SIZE));
    if (totalCount > 0) rows = await pageRows(page);
  }
  const pageCount = Math.max(1, Math.ceil(totalCount / DESIGNS_PAGE_SIZE));

  return {
    items: rows.map(listItemOf),
    total: totalCount,
    page,
    pageCount,
    pageSize: DESIGNS_PAGE_SIZE,
  };
}

/** The stored result without its sampled profiles (`gasketStress.profile`), as the design read sends it. */
export type StoredResultSummary = Omit<JointAnalysis, "gasketStress"> & {
  gasketStress: Omit<JointAnalysis["gasketStress"], "profile">;
};

/** What GET /api/v1/designs/[id] reads: no revision counts, the result without its profiles. */
export interface DesignReadDto extends DesignListItemDto {
  version: number;
  document: JointDesign;
  result: StoredResultSummary | null;
  coreVersion: string | null;
  lastEditedByName: string;
  revisionUpdatedAt: string;
}

/** What the policies of a command need: the design's state, never its document or result. */
export type DesignStateDto = DesignListItemDto & { revisionCount: number; everSubmitted: boolean };

const isDesignId = (designId: string) => /^[0-9a-f-]{36}$/i.test(designId);

/** One design's working revision, its owner and last editor, with the columns every read needs. */
function oneDesign(db: Kysely<Database>, organizationId: string, designId: string) {
  return workingRevisions(db, organizationId)
    .innerJoin("users as editor", "editor.id", "design_revisions.last_edited_by")
    .where("designs.id", "=", designId)
    .select([
      ...LIST_COLUMNS,
      "editor.display_name as editor_name",
      "design_revisions.version",
      "design_revisions.core_version",
      "design_revisions.updated_at as revision_updated_at",
    ]);
}

interface ListItemRow {
  id: string;
  name: string;
  equipment_tag: string;
  outline_kind: string;
  owner_id: string;
  owner_name: string;
  number: number;
  status: WorkingRevisionStatus;
  updated_at: Date;
  archived_at: Date | null;
}

function listItemOf(row: ListItemRow): DesignListItemDto {
  return {
    designId: row.id,
    name: row.name,
    equipmentTag: row.equipment_tag,
    outlineKind: row.outline_kind,
    ownerId: row.owner_id,
    ownerName: row.owner_name,
    revisionNumber: row.number,
    status: row.status,
    updatedAt: isoString(row.updated_at),
    archived: row.archived_at !== null,
  };
}

/** The revision count and whether any revision was ever submitted (the delete policy). */
function withRevisionHistory(query: ReturnType<typeof oneDesign>) {
  return query.select((eb) => [
    eb
      .selectFrom("design_revisions as all_revs")
      .select((e) => e.fn.countAll<number>().as("c"))
      .whereRef("all_revs.design_id", "=", "designs.id")
      .as("revision_count"),
    eb
      .exists(
        eb
          .selectFrom("design_revisions as sub")
          .select("sub.id")
          .whereRef("sub.design_id", "=", "designs.id")
          .where("sub.submitted_at", "is not", null),
      )
      .as("ever_submitted"),
  ]);
}

/** One design of the organisation with its working revision, or null (unknown or foreign id). */
export async function findDesign(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
): Promise<DesignDetailDto | null> {
  if (!isDesignId(designId)) return null;
  const row = await withRevisionHistory(oneDesign(db, organizationId, designId))
    .select([
      "designs.organization_id",
      "design_revisions.id as revision_id",
      "design_revisions.document",
      "design_revisions.result",
    ])
    .executeTakeFirst();
  if (!row) return null;
  return {
    ...listItemOf(row),
    organizationId: row.organization_id,
    revisionId: row.revision_id,
    version: row.version,
    document: row.document,
    result: row.result,
    coreVersion: row.core_version,
    revisionCount: Number(row.revision_count ?? 0),
    everSubmitted: Boolean(row.ever_submitted),
    lastEditedByName: row.editor_name,
    revisionUpdatedAt: isoString(row.revision_updated_at),
  };
}

/** The design's state for a command's policies (status, owner, history), or null. */
export async function findDesignState(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
): Promise<DesignStateDto | null> {
  if (!isDesignId(designId)) return null;
  const row = await withRevisionHistory(oneDesign(db, organizationId, designId)).executeTakeFirst();
  if (!row) return null;
  return {
    ...listItemOf(row),
    revisionCount: Number(row.revision_count ?? 0),
    everSubmitted: Boolean(row.ever_submitted),
  };
}

/**
 * The design read of the API: the working revision's document and its stored result without the
 * sampled profiles, which the database drops (`#-`) so they never cross the wire to this process.
 * The whole result is GET /api/v1/designs/[id]/result (findWorkingResultJson).
 */
export async function findDesignRead(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
): Promise<DesignReadDto | null> {
  if (!isDesignId(designId)) return null;
  const row = await oneDesign(db, organizationId, designId)
    .select([
      "design_revisions.document",
      sql<StoredResultSummary | null>`design_revisions.result #- '{gasketStress,profile}'`.as("result"),
    ])
    .executeTakeFirst();
  if (!row) return null;
  return {
    ...listItemOf(row),
    version: row.version,
    document: row.document,
    result: row.result,
    coreVersion: row.core_version,
    lastEditedByName: row.editor_name,
    revisionUpdatedAt: isoString(row.revision_updated_at),
  };
}

/**
 * The working revision's whole stored result as the database's JSON text (profiles included),
 * passed on without parsing; `resultJson` is null when the revision has no result.
 */
export async function findWorkingResultJson(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
): Promise<{ revisionNumber: number; version: number; resultJson: string | null } | null> {
  if (!isDesignId(designId)) return null;
  const row = await workingRevisions(db, organizationId)
    .where("designs.id", "=", designId)
    .select([
      "design_revisions.number",
      "design_revisions.version",
      sql<string | null>`design_revisions.result::text`.as("result_json"),
    ])
    .executeTakeFirst();
  if (!row) return null;
  return { revisionNumber: row.number, version: row.version, resultJson: row.result_json };
}

export interface OwnerOption {
  userId: string;
  displayName: string;
}

/** Members who own at least one design of the organisation (the register's owner filter). */
export async function listDesignOwners(db: Kysely<Database>, organizationId: string): Promise<OwnerOption[]> {
  const rows = await db
    .selectFrom("designs")
    .innerJoin("users", "users.id", "designs.owner_id")
    .where("designs.organization_id", "=", organizationId)
    .select(["users.id", "users.display_name"])
    .distinct()
    .orderBy("users.display_name")
    .execute();
  return rows.map((r) => ({ userId: r.id, displayName: r.display_name }));
}
