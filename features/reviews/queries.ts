import "server-only";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { verifySnapshot, type SnapshotIntegrity } from "@/features/analysis/content-hash";
import { isFrozenStatus, type ReviewActor, type RevisionFacts } from "./model/review-states";
import { readChecks } from "./model/review-checks";
import { diffDocuments, listBoltMoves, listCheckChanges, readKeyResults } from "./model/compare-revisions";
import {
  canApproveRevision,
  canCommentOnRevision,
  canEditRevision,
  canReturnRevision,
  canStartNewRevision,
  canSubmitRevision,
} from "./policies";
import { revisionPath } from "./cache-keys";
import type {
  CommentDto,
  DecisionDto,
  DeskItemDto,
  DeskListsDto,
  JustificationDto,
  RevisionComparisonDto,
  RevisionReviewDto,
  RevisionSummaryDto,
} from "./review-dto";
import { isoString, isoOrNull } from "@/db/dates";

// Reads of the review feature. Every query filters by the viewer's organisation: another
// organisation's revision is simply not found. Frozen snapshots are re-hashed on every read.
/** Everyone who created, saved or submitted a revision (revision_editors); read inside the caller's transaction. */
export async function listRevisionEditorIds(db: Kysely<Database>, revisionId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("revision_editors")
    .select("user_id")
    .where("revision_id", "=", revisionId)
    .execute();
  return rows.map((r) => r.user_id);
}

/** The integrity of a stored revision: recomputed for In review / Approved, "not-frozen" otherwise. */
export function integrityOf(row: {
  status: RevisionFacts["status"];
  document: unknown;
  result: unknown;
  core_version: string | null;
  content_hash: string | null;
}): SnapshotIntegrity {
  if (!isFrozenStatus(row.status)) return { state: "not-frozen" };
  return verifySnapshot({
    document: row.document,
    result: row.result,
    coreVersion: row.core_version,
    contentHash: row.content_hash,
  });
}

export async function listComments(
  db: Kysely<Database>,
  organizationId: string,
  revisionId: string,
): Promise<CommentDto[]> {
  const rows = await db
    .selectFrom("revision_comments as c")
    .innerJoin("users as u", "u.id", "c.author_id")
    .select(["c.id", "c.body", "c.target_kind", "c.target_id", "c.created_at", "u.display_name"])
    .where("c.organization_id", "=", organizationId)
    .where("c.revision_id", "=", revisionId)
    .orderBy("c.created_at")
    .orderBy("c.id")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    authorName: r.display_name,
    body: r.body,
    targetKind: r.target_kind,
    targetId: r.target_id,
    at: isoString(r.created_at),
  }));
}

/** The written justifications of warn/fail checks recorded with an approval (the PDF prints these). */
export async function listJustifications(
  db: Kysely<Database>,
  organizationId: string,
  revisionId: string,
): Promise<JustificationDto[]> {
  const rows = await db
    .selectFrom("revision_justifications as j")
    .innerJoin("users as u", "u.id", "j.author_id")
    .select(["j.check_id", "j.check_status", "j.text", "j.created_at", "u.display_name"])
    .where("j.organization_id", "=", organizationId)
    .where("j.revision_id", "=", revisionId)
    .orderBy("j.check_id")
    .execute();
  return rows.map((r) => ({
    checkId: r.check_id,
    checkStatus: r.check_status,
    text: r.text,
    authorName: r.display_name,
    at: isoString(r.created_at),
  }));
}

export async function listDecisions(
  db: Kysely<Database>,
  organizationId: string,
  revisionId: string,
): Promise<DecisionDto[]> {
  const rows = await db
    .selectFrom("revision_decisions as d")
    .innerJoin("users as u", "u.id", "d.actor_id")
    .select(["d.kind", "d.comment", "d.acknowledged_unverified", "d.created_at", "u.display_name"])
    .where("d.organization_id", "=", organizationId)
    .where("d.revision_id", "=", revisionId)
    .orderBy("d.created_at")
    .execute();
  return rows.map((r) => ({
    kind: r.kind,
    actorName: r.display_name,
    comment: r.comment,
    acknowledgedUnverified: r.acknowledged_unverified,
    at: isoString(r.created_at),
  }));
}

export async function listRevisionSummaries(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
): Promise<RevisionSummaryDto[]> {
  const rows = await db
    .selectFrom("design_revisions")
    .select(["number", "status", "content_hash", "submitted_at", "decided_at", "updated_at"])
    .where("organization_id", "=", organizationId)
    .where("design_id", "=", designId)
    .orderBy("number")
    .execute();
  return rows.map((r) => ({
    number: r.number,
    status: r.status,
    contentHash: r.content_hash,
    submittedAt: isoOrNull(r.submitted_at),
    decidedAt: isoOrNull(r.decided_at),
    updatedAt: isoString(r.updated_at),
  }));
}

/** A revision's frozen snapshot, the columns `verifySnapshot` checks (select them beside `r`). */
export const SNAPSHOT_COLUMNS = ["r.document", "r.result", "r.core_version", "r.content_hash"] as const;

/**
 * Revision `number` of a design of the organisation, as `r` joined to its design `d` (both scoped
 * to the organisation); the caller adds its joins and columns.
 */
export function selectRevisionOfDesign(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  number: number,
) {
  return db
    .selectFrom("design_revisions as r")
    .innerJoin("designs as d", "d.id", "r.design_id")
    .where("r.organization_id", "=", organizationId)
    .where("d.organization_id", "=", organizationId)
    .where("r.design_id", "=", designId)
    .where("r.number", "=", number);
}

async function findRevisionRow(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  number: number,
) {
  return selectRevisionOfDesign(db, organizationId, designId, number)
    .innerJoin("users as creator", "creator.id", "r.created_by")
    .innerJoin("users as editor", "editor.id", "r.last_edited_by")
    .leftJoin("users as submitter", "submitter.id", "r.submitted_by")
    .leftJoin("users as decider", "decider.id", "r.decided_by")
    .select([
      "r.id",
      "r.design_id",
      "r.number",
      "r.status",
      "r.version",
      ...SNAPSHOT_COLUMNS,
      "r.created_by",
      "r.last_edited_by",
      "r.submitted_by",
      "r.submitted_at",
      "r.decided_at",
      "d.name as design_name",
      "d.equipment_tag",
      "creator.display_name as creator_name",
      "editor.display_name as editor_name",
      "submitter.display_name as submitter_name",
      "decider.display_name as decider_name",
    ])
    .executeTakeFirst();
}

/** Everything the review screen shows; undefined when the revision is not in this organisation. */
export async function getRevisionReview(
  db: Kysely<Database>,
  viewer: ReviewActor & { organizationId: string },
  designId: string,
  number: number,
): Promise<RevisionReviewDto | undefined> {
  const row = await findRevisionRow(db, viewer.organizationId, designId, number);
  if (!row) return undefined;
  const numbers = (await listRevisionSummaries(db, viewer.organizationId, designId)).map((r) => r.number);
  const facts: RevisionFacts = {
    status: row.status,
    createdBy: row.created_by,
    lastEditedBy: row.last_edited_by,
    submittedBy: row.submitted_by,
    editorIds: await listRevisionEditorIds(db, row.id),
    isWorking: numbers.at(-1) === row.number,
  };
  const [comments, justifications, decisions] = await Promise.all([
    listComments(db, viewer.organizationId, row.id),
    listJustifications(db, viewer.organizationId, row.id),
    listDecisions(db, viewer.organizationId, row.id),
  ]);
  return {
    designId: row.design_id,
    designName: row.design_name,
    equipmentTag: row.equipment_tag,
    revisionId: row.id,
    number: row.number,
    status: row.status,
    version: row.version,
    document: row.document,
    result: row.result,
    coreVersion: row.core_version,
    integrity: integrityOf(row),
    checks: readChecks(row.result),
    unverifiedValues: listUnverifiedValues(row.document, row.result),
    createdByName: row.creator_name,
    lastEditedByName: row.editor_name,
    submittedByName: row.submitter_name ?? null,
    submittedAt: isoOrNull(row.submitted_at),
    decidedByName: row.decider_name ?? null,
    decidedAt: isoOrNull(row.decided_at),
    isWorking: facts.isWorking,
    revisionNumbers: numbers,
    comments,
    justifications,
    decisions,
    permissions: {
      canSubmit: canSubmitRevision(viewer, facts),
      canApprove: canApproveRevision(viewer, facts),
      canReturn: canReturnRevision(viewer, facts),
      canStartNew: canStartNewRevision(viewer, facts),
      canComment: canCommentOnRevision(viewer),
      canEdit: canEditRevision(viewer, facts),
    },
  };
}

/** Side-by-side comparison of two revisions of one design; undefined when either is missing. */
export async function compareRevisions(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  from: number,
  to: number,
): Promise<RevisionComparisonDto | undefined> {
  const [a, b] = await Promise.all([
    findRevisionRow(db, organizationId, designId, from),
    findRevisionRow(db, organizationId, designId, to),
  ]);
  if (!a || !b) return undefined;
  const numbers = (await listRevisionSummaries(db, organizationId, designId)).map((r) => r.number);
  return {
    designId,
    designName: b.design_name,
    from: {
      number: a.number,
      status: a.status,
      document: a.document,
      keyResults: readKeyResults(a.result),
    },
    to: {
      number: b.number,
      status: b.status,
      document: b.document,
      keyResults: readKeyResults(b.result),
    },
    fieldChanges: diffDocuments(a.document, b.document),
    boltMoves: listBoltMoves(a.document, b.document),
    checkChanges: listCheckChanges(a.result, b.result),
    revisionNumbers: numbers,
  };
}

/**
 * The desk's two lists. "Waiting for my review": In review revisions of the organisation that the
 * viewer (an approver) did not create, save or submit. "Returned to me": Returned revisions the
 * viewer created, saved or submitted.
 */
export async function getDeskLists(
  db: Kysely<Database>,
  viewer: ReviewActor & { organizationId: string },
): Promise<DeskListsDto> {
  const isApprover = viewer.roles.includes("approver");
  const me = viewer.userId;
  const base = db
    .selectFrom("design_revisions as r")
    .innerJoin("designs as d", "d.id", "r.design_id")
    .where("r.organization_id", "=", viewer.organizationId)
    .where("d.organization_id", "=", viewer.organizationId)
    .where("d.archived_at", "is", null);

  const waiting = isApprover
    ? await base
        .leftJoin("users as s", "s.id", "r.submitted_by")
        .select([
          "r.design_id",
          "r.number",
          "r.submitted_at as at",
          "d.name",
          "d.equipment_tag",
          "s.display_name as person",
        ])
        .where("r.status", "=", "in_review")
        .where("r.created_by", "<>", me)
        .where("r.last_edited_by", "<>", me)
        .where((eb) => eb.or([eb("r.submitted_by", "is", null), eb("r.submitted_by", "<>", me)]))
        .where(({ not, exists, selectFrom }) =>
          not(
            exists(
              selectFrom("revision_editors as e")
                .select("e.user_id")
                .whereRef("e.revision_id", "=", "r.id")
                .where("e.user_id", "=", me),
            ),
          ),
        )
        .orderBy("r.submitted_at")
        .limit(50)
        .execute()
    : [];

  const returned = await base
    .leftJoin("users as x", "x.id", "r.decided_by")
    .select((eb) => [
      "r.design_id",
      "r.number",
      "r.decided_at as at",
      "d.name",
      "d.equipment_tag",
      "x.display_name as person",
      eb
        .selectFrom("revision_decisions as rd")
        .select("rd.comment")
        .whereRef("rd.revision_id", "=", "r.id")
        .where("rd.kind", "=", "returned")
        .orderBy("rd.created_at", "desc")
        .limit(1)
        .as("comment"),
    ])
    .where("r.status", "=", "returned")
    .where((eb) =>
      eb.or([
        eb("r.created_by", "=", me),
        eb("r.last_edited_by", "=", me),
        eb("r.submitted_by", "=", me),
        eb.exists(
          eb
            .selectFrom("revision_editors as e")
            .select("e.user_id")
            .whereRef("e.revision_id", "=", "r.id")
            .where("e.user_id", "=", me),
        ),
      ]),
    )
    .orderBy("r.decided_at", "desc")
    .limit(50)
    .execute();

  const item = (r: {
    design_id: string;
    number: number;
    at: Date | string | null;
    name: string;
    equipment_tag: string;
    person: string | null;
    comment?: string | null;
  }): DeskItemDto => ({
    designId: r.design_id,
    designName: r.name,
    equipmentTag: r.equipment_tag,
    number: r.number,
    personName: r.person ?? "",
    at: isoOrNull(r.at) ?? "",
    href: revisionPath(r.design_id, r.number),
    comment: r.comment ?? "",
  });
  return { isApprover, waitingForMyReview: waiting.map(item), returnedToMe: returned.map(item) };
}

/** Contacts for review mail: active approvers of the organisation, minus `exceptUserId`. */
export async function listApproverContacts(
  db: Kysely<Database>,
  organizationId: string,
  exceptUserId: string,
): Promise<{ email: string; displayName: string }[]> {
  return db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.email", "u.display_name as displayName"])
    .where("m.organization_id", "=", organizationId)
    .where("u.disabled_at", "is", null)
    .where("u.id", "<>", exceptUserId)
    .where((eb) => eb(eb.val("approver"), "=", eb.fn.any("m.roles")))
    .orderBy("u.email")
    .execute();
}

export async function listUserContacts(
  db: Kysely<Database>,
  userIds: string[],
): Promise<{ id: string; email: string; displayName: string }[]> {
  if (userIds.length === 0) return [];
  return db
    .selectFrom("users")
    .select(["id", "email", "display_name as displayName"])
    .where("id", "in", userIds)
    .where("disabled_at", "is", null)
    .execute();
}
