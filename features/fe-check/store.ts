import "server-only";
import { sql, type Kysely } from "kysely";
import type { Database, Executor } from "@/db/types";
import type { FeCheckStatus } from "@/db/tables/fe-checks";
import { isoOrNull, isoString } from "@/db/dates";
import { sha256OfJson } from "@/features/analysis/content-hash";
import type { FeCheckResult, FeProgress } from "./fe-check-result";

// Rows of fe_checks: one FE cross-check run of a revision's saved document. Reads filter by
// organisation (another organisation's run is not found); the worker's writes do not (it acts
// for the requester). The database refuses changes to finished rows and runs on approved revisions.

/** Without a progress write for this long, a running row's worker is counted as lost. */
export const FE_STALE_AFTER_SECONDS = 5 * 60;

export interface FeCheckDto {
  id: string;
  designId: string;
  revisionNumber: number;
  status: FeCheckStatus;
  stage: string;
  progress: FeProgress;
  /** The run solved the revision's current document (false: an earlier save; run it again). */
  current: boolean;
  result: FeCheckResult | null;
  resultHash: string | null;
  error: string | null;
  cancelRequested: boolean;
  requestedByName: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

const EMPTY_PROGRESS: FeProgress = { model: null, runs: 0, elements: 0, solverSeconds: 0 };

export interface RevisionForFe {
  revisionId: string;
  designId: string;
  number: number;
  status: string;
  document: unknown;
}

/** The revision a run is for (null: not found in this organisation). */
export async function findRevisionForFe(
  db: Executor,
  organizationId: string,
  designId: string,
  number: number,
): Promise<RevisionForFe | null> {
  const row = await db
    .selectFrom("design_revisions as r")
    .innerJoin("designs as d", "d.id", "r.design_id")
    .select(["r.id", "r.design_id", "r.number", "r.status", "r.document"])
    .where("r.organization_id", "=", organizationId)
    .where("r.design_id", "=", designId)
    .where("r.number", "=", number)
    .where("d.archived_at", "is", null)
    .executeTakeFirst();
  return row
    ? {
        revisionId: row.id,
        designId: row.design_id,
        number: row.number,
        status: row.status,
        document: row.document,
      }
    : null;
}

function baseSelect(db: Executor) {
  return db
    .selectFrom("fe_checks as f")
    .innerJoin("design_revisions as r", "r.id", "f.revision_id")
    .leftJoin("users as u", "u.id", "f.requested_by")
    .select([
      "f.id",
      "f.design_id",
      "r.number",
      "r.document",
      "f.document_hash",
      "f.status",
      "f.stage",
      "f.progress",
      "f.result",
      "f.result_hash",
      "f.error",
      "f.cancel_requested",
      "u.display_name",
      "f.created_at",
      "f.updated_at",
      "f.started_at",
      "f.finished_at",
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof baseSelect>["executeTakeFirstOrThrow"]>>;

function toDto(row: Row): FeCheckDto {
  return {
    id: row.id,
    designId: row.design_id,
    revisionNumber: row.number,
    status: row.status,
    stage: row.stage,
    progress: { ...EMPTY_PROGRESS, ...(row.progress as Partial<FeProgress>) },
    current: sha256OfJson(row.document) === row.document_hash,
    result: (row.result as FeCheckResult | null) ?? null,
    resultHash: row.result_hash,
    error: row.error,
    cancelRequested: row.cancel_requested,
    requestedByName: row.display_name,
    createdAt: isoString(row.created_at),
    startedAt: isoOrNull(row.started_at),
    finishedAt: isoOrNull(row.finished_at),
  };
}

/**
 * Marks running or queued rows whose worker went quiet as failed (the queue retries once; this
 * sweeps what is left). Called on reads, so no scheduler is needed.
 */
async function sweepStale(db: Executor, revisionId: string): Promise<void> {
  await db
    .updateTable("fe_checks")
    .set({
      status: "failed",
      error: `The worker running this FE cross-check stopped answering (no progress for ${FE_STALE_AFTER_SECONDS / 60} minutes). Run it again.`,
      finished_at: sql`now()`,
      updated_at: sql`now()`,
    })
    .where("revision_id", "=", revisionId)
    .where("status", "in", ["queued", "running"])
    .where("updated_at", "<", sql<Date>`now() - make_interval(secs => ${FE_STALE_AFTER_SECONDS})`)
    .execute();
}

/** The latest run of a revision (any status), or null. */
export async function latestFeCheck(
  db: Kysely<Database>,
  organizationId: string,
  revisionId: string,
): Promise<FeCheckDto | null> {
  await sweepStale(db, revisionId);
  const row = await baseSelect(db)
    .where("f.organization_id", "=", organizationId)
    .where("f.revision_id", "=", revisionId)
    .orderBy("f.created_at", "desc")
    .orderBy("f.id", "desc")
    .limit(1)
    .executeTakeFirst();
  return row ? toDto(row) : null;
}

export async function findFeCheck(
  db: Executor,
  organizationId: string,
  id: string,
): Promise<FeCheckDto | null> {
  const row = await baseSelect(db)
    .where("f.organization_id", "=", organizationId)
    .where("f.id", "=", id)
    .executeTakeFirst();
  return row ? toDto(row) : null;
}

/**
 * The run an approval of this revision cites: the latest finished one that solved the revision's
 * current document, with its result hash re-verified. Null when there is none.
 */
export async function feCheckForApproval(
  db: Executor,
  organizationId: string,
  revisionId: string,
  document: unknown,
): Promise<{ id: string; resultHash: string } | null> {
  const row = await db
    .selectFrom("fe_checks")
    .select(["id", "result", "result_hash"])
    .where("organization_id", "=", organizationId)
    .where("revision_id", "=", revisionId)
    .where("status", "=", "done")
    .where("document_hash", "=", sha256OfJson(document))
    .orderBy("created_at", "desc")
    .limit(1)
    .executeTakeFirst();
  if (!row || !row.result_hash || sha256OfJson(row.result) !== row.result_hash) return null;
  return { id: row.id, resultHash: row.result_hash };
}

/** What a new run records: the revision, its current document and who asked. */
export interface NewFeCheck {
  organizationId: string;
  designId: string;
  revisionId: string;
  document: unknown;
  requestedBy: string;
}

/** A queued run of the revision's current document; refused by the database on an approved revision. */
export async function createFeCheck(db: Executor, input: NewFeCheck): Promise<string> {
  const row = await db
    .insertInto("fe_checks")
    .values({
      organization_id: input.organizationId,
      design_id: input.designId,
      revision_id: input.revisionId,
      document_hash: sha256OfJson(input.document),
      progress: JSON.stringify(EMPTY_PROGRESS),
      requested_by: input.requestedBy,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** An unfinished run of the revision, if any (one at a time per revision). */
export async function activeFeCheckId(db: Executor, revisionId: string): Promise<string | null> {
  await sweepStale(db, revisionId);
  const row = await db
    .selectFrom("fe_checks")
    .select("id")
    .where("revision_id", "=", revisionId)
    .where("status", "in", ["queued", "running"])
    .executeTakeFirst();
  return row?.id ?? null;
}

/** Takes the row for a worker: queued, or running again after a lost worker (counted in attempts). */
export async function claimFeCheck(db: Kysely<Database>, id: string) {
  return db
    .updateTable("fe_checks as f")
    .from("design_revisions as r")
    .set({
      status: "running",
      stage: "Starting",
      attempts: sql`f.attempts + 1`,
      started_at: sql`coalesce(f.started_at, now())`,
      updated_at: sql`now()`,
    })
    .whereRef("r.id", "=", "f.revision_id")
    .where("f.id", "=", id)
    .where("f.status", "in", ["queued", "running"])
    .where("f.cancel_requested", "=", false)
    .returning(["f.id", "f.organization_id", "f.document_hash", "f.attempts", "r.document"])
    .executeTakeFirst();
}

/** Progress write; returns whether a cancel was requested meanwhile. */
export async function setFeProgress(
  db: Kysely<Database>,
  id: string,
  stage: string,
  progress: FeProgress,
): Promise<{ cancelRequested: boolean }> {
  const row = await db
    .updateTable("fe_checks")
    .set({ stage, progress: JSON.stringify(progress), updated_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "=", "running")
    .returning("cancel_requested")
    .executeTakeFirst();
  return { cancelRequested: row?.cancel_requested ?? true };
}

export async function isFeCancelRequested(db: Kysely<Database>, id: string): Promise<boolean> {
  const row = await db
    .selectFrom("fe_checks")
    .select(["cancel_requested", "status"])
    .where("id", "=", id)
    .executeTakeFirst();
  return !row || row.cancel_requested || (row.status !== "running" && row.status !== "queued");
}

export async function finishFeCheck(db: Kysely<Database>, id: string, result: FeCheckResult): Promise<void> {
  const json = JSON.parse(JSON.stringify(result)) as unknown;
  await db
    .updateTable("fe_checks")
    .set({
      status: "done",
      stage: "Done",
      result: JSON.stringify(json),
      result_hash: sha256OfJson(json),
      finished_at: sql`now()`,
      updated_at: sql`now()`,
    })
    .where("id", "=", id)
    .where("status", "=", "running")
    .execute();
}

export async function endFeCheck(
  db: Kysely<Database>,
  id: string,
  status: "failed" | "cancelled",
  error: string,
): Promise<void> {
  await db
    .updateTable("fe_checks")
    .set({
      status,
      stage: status === "failed" ? "Failed" : "Cancelled",
      error,
      finished_at: sql`now()`,
      updated_at: sql`now()`,
    })
    .where("id", "=", id)
    .where("status", "in", ["queued", "running"])
    .execute();
}

/**
 * Asks a run to stop: a queued run ends at once; a running one is flagged, and its worker kills
 * the solver within a second or two. Returns false when there is nothing unfinished to cancel.
 */
export async function requestFeCancel(
  db: Kysely<Database>,
  organizationId: string,
  id: string,
): Promise<boolean> {
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .selectFrom("fe_checks")
      .select(["status"])
      .where("organization_id", "=", organizationId)
      .where("id", "=", id)
      .forUpdate()
      .executeTakeFirst();
    if (!row || (row.status !== "queued" && row.status !== "running")) return false;
    if (row.status === "queued")
      await trx
        .updateTable("fe_checks")
        .set({
          status: "cancelled",
          stage: "Cancelled",
          cancel_requested: true,
          error: "Cancelled before it started.",
          finished_at: sql`now()`,
          updated_at: sql`now()`,
        })
        .where("id", "=", id)
        .execute();
    else
      await trx
        .updateTable("fe_checks")
        .set({ cancel_requested: true, updated_at: sql`now()` })
        .where("id", "=", id)
        .execute();
    return true;
  });
}

/**
 * The FE cross-check that belongs on a revision's sheets: for an approved revision the run its
 * approval cites (null when it cites none, or when the stored result no longer matches the hash
 * the approval recorded); otherwise the latest finished run of the current document.
 */
export async function feCheckForSheet(
  db: Kysely<Database>,
  organizationId: string,
  revisionId: string,
): Promise<{ dto: FeCheckDto; cited: boolean } | null> {
  const decision = await db
    .selectFrom("revision_decisions as d")
    .innerJoin("design_revisions as r", "r.id", "d.revision_id")
    .select(["d.fe_check_id", "d.fe_result_hash", "r.status"])
    .where("d.revision_id", "=", revisionId)
    .where("d.organization_id", "=", organizationId)
    .where("d.kind", "=", "approved")
    .where("r.status", "=", "approved")
    .orderBy("d.created_at", "desc")
    .limit(1)
    .executeTakeFirst();
  if (decision) {
    if (!decision.fe_check_id) return null;
    const dto = await findFeCheck(db, organizationId, decision.fe_check_id);
    if (!dto || !dto.result || sha256OfJson(dto.result) !== decision.fe_result_hash) return null;
    return { dto, cited: true };
  }
  const row = await baseSelect(db)
    .where("f.organization_id", "=", organizationId)
    .where("f.revision_id", "=", revisionId)
    .where("f.status", "=", "done")
    .orderBy("f.created_at", "desc")
    .limit(1)
    .executeTakeFirst();
  if (!row) return null;
  const dto = toDto(row);
  return dto.current ? { dto, cited: false } : null;
}
