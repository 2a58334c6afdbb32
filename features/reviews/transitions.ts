import "server-only";
import { sql, type Insertable, type Kysely, type Transaction } from "kysely";
import type { RevisionDecisionsTable } from "@/db/tables/reviews";
import type { Database } from "@/db/types";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { analyzeInWorker } from "@/server/analysis/pool";
import { formatIssue, validateJointDesign } from "@/features/analysis/core/validate";
import { recordActivity, type ActivityInput } from "@/features/activity/queries";
import { feCheckForApproval } from "@/features/fe-check/store";
import type { ActionResult } from "@/features/forms/action-result";
import { computeContentHash, verifySnapshot } from "@/features/analysis/content-hash";
import {
  decideTransition,
  type ReviewActor,
  type ReviewCommand,
  type ReviewStatus,
  type RevisionFacts,
} from "./model/review-states";
import { missingJustifications, readChecks } from "./model/review-checks";
import { ruleOf, rulesNeedingJustification } from "@/features/analysis/rule-groups";
import { listRevisionEditorIds, selectRevisionOfDesign, SNAPSHOT_COLUMNS } from "./queries";
import type { CommentDto } from "./review-dto";
import type {
  AddCommentInput,
  ApproveRevisionInput,
  ReturnRevisionInput,
  StartNewRevisionInput,
  SubmitRevisionInput,
} from "./schema";
import { isoString } from "@/db/dates";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";

// Every review transition runs in ONE transaction that first takes the revision's row lock
// (select … for update). A second approver acting at the same moment waits for the lock, then
// reads the state the first one committed and is refused by the same rules. The database adds its
// own guards (migration 000600: allowed status steps, four-eyes check; 000400: approved is frozen;
// 131700: everyone who created, saved or submitted the revision is recorded in revision_editors by a
// trigger, and a decision by any of them is refused).

export interface TransitionActor extends ReviewActor {
  organizationId: string;
}

export interface TransitionOutcome {
  designId: string;
  designName: string;
  revisionId: string;
  number: number;
  status: ReviewStatus;
  /** The designer side of the revision (for "approved"/"returned" mail): creator and submitter. */
  designerIds: string[];
  actorId: string;
  comment: string;
}

type Refusal = Extract<ActionResult, { ok: false }>;
const refused = (message: string, fieldErrors?: Record<string, string[]>): Refusal => ({
  ok: false,
  message,
  ...(fieldErrors ? { fieldErrors } : {}),
});

/** Locks one revision of a design of the organisation; undefined when it is not theirs or missing. */
export async function lockRevisionForUpdate(
  trx: Transaction<Database>,
  organizationId: string,
  designId: string,
  number: number,
) {
  const row = await selectRevisionOfDesign(trx, organizationId, designId, number)
    .select([
      "r.id",
      "r.design_id",
      "r.number",
      "r.status",
      ...SNAPSHOT_COLUMNS,
      "r.version",
      "r.created_by",
      "r.last_edited_by",
      "r.submitted_by",
      "d.name as design_name",
    ])
    .forUpdate("r")
    .executeTakeFirst();
  if (!row) return undefined;
  const newest = await trx
    .selectFrom("design_revisions")
    .select((eb) => eb.fn.max("number").as("max"))
    .where("design_id", "=", designId)
    .executeTakeFirstOrThrow();
  const facts: RevisionFacts = {
    status: row.status,
    createdBy: row.created_by,
    lastEditedBy: row.last_edited_by,
    submittedBy: row.submitted_by,
    editorIds: await listRevisionEditorIds(trx, row.id),
    isWorking: Number(newest.max) === row.number,
  };
  return { ...row, facts };
}

type LockedRevision = NonNullable<Awaited<ReturnType<typeof lockRevisionForUpdate>>>;

async function withLockedRevision<T>(
  db: Kysely<Database>,
  actor: TransitionActor,
  ref: { designId: string; number: number },
  command: ReviewCommand,
  body: (trx: Transaction<Database>, revision: LockedRevision) => Promise<ActionResult<T>>,
): Promise<ActionResult<T>> {
  return db.transaction().execute(async (trx) => {
    const revision = await lockRevisionForUpdate(trx, actor.organizationId, ref.designId, ref.number);
    if (!revision) return refused("That revision does not exist in this organisation.");
    const verdict = decideTransition(command, actor, revision.facts);
    if (!verdict.allowed) return refused(verdict.reason);
    return body(trx, revision);
  });
}

function outcomeOf(
  revision: LockedRevision,
  status: ReviewStatus,
  actor: TransitionActor,
  comment = "",
  revisionId = revision.id,
  number = revision.number,
): TransitionOutcome {
  const designerIds = [
    ...new Set(
      [revision.created_by, revision.last_edited_by, revision.submitted_by].filter((x): x is string => !!x),
    ),
  ];
  return {
    designId: revision.design_id,
    designName: revision.design_name,
    revisionId,
    number,
    status,
    designerIds,
    actorId: actor.userId,
    comment,
  };
}

/** Every transition's last step: the design's updated_at, and the entry in its activity log. */
async function touchAndRecord(
  trx: Transaction<Database>,
  actor: TransitionActor,
  revision: LockedRevision,
  kind: ActivityInput["kind"],
  detail: string,
  revisionId = revision.id,
): Promise<void> {
  await trx
    .updateTable("designs")
    .set({ updated_at: sql`now()` })
    .where("id", "=", revision.design_id)
    .execute();
  await recordActivity(trx, {
    organizationId: actor.organizationId,
    designId: revision.design_id,
    revisionId,
    actorId: actor.userId,
    kind,
    detail,
  });
}

/**
 * The approver's decision: its record (comment, the content hash decided on, and what an approval
 * cites), the revision row's status, who and when (version bumped), then touchAndRecord.
 */
async function recordDecision(
  trx: Transaction<Database>,
  actor: TransitionActor,
  revision: LockedRevision,
  status: "approved" | "returned",
  decision: {
    comment: string;
    contentHash: string;
    cites?: Pick<
      Insertable<RevisionDecisionsTable>,
      "acknowledged_unverified" | "fe_check_id" | "fe_result_hash"
    >;
  },
  detail: string,
): Promise<void> {
  await trx
    .insertInto("revision_decisions")
    .values({
      revision_id: revision.id,
      organization_id: actor.organizationId,
      kind: status,
      actor_id: actor.userId,
      comment: decision.comment,
      content_hash: decision.contentHash,
      ...decision.cites,
    })
    .execute();
  await trx
    .updateTable("design_revisions")
    .set({
      status,
      decided_by: actor.userId,
      decided_at: sql`now()`,
      version: sql`version + 1`,
      updated_at: sql`now()`,
    })
    .where("id", "=", revision.id)
    .execute();
  await touchAndRecord(trx, actor, revision, status, detail);
}

/** Draft or Returned → In review: recomputes the result on the server and freezes the snapshot. */
export async function submitRevision(
  db: Kysely<Database>,
  actor: TransitionActor,
  input: SubmitRevisionInput,
): Promise<ActionResult<TransitionOutcome>> {
  return withLockedRevision(db, actor, input, "submit", async (trx, revision) => {
    if (input.baseVersion !== undefined && input.baseVersion !== revision.version) {
      return refused(
        `This revision was saved again since you opened it (version ${revision.version}, you had ${input.baseVersion}). Reload and check the latest version before submitting.`,
      );
    }
    const document = revision.document;
    const issues = validateJointDesign(document);
    if (issues.length > 0)
      return refused(
        `The design has problems to fix before it can be submitted: ${issues.slice(0, 5).map(formatIssue).join("; ")}.`,
      );
    // Computed in the analysis pool (server/analysis/pool.ts) as JSON text, parsed back so the
    // hash covers exactly what jsonb will store and return.
    const result: unknown = JSON.parse(await analyzeInWorker(document));
    const contentHash = computeContentHash({ document, result, coreVersion: CORE_VERSION });
    await trx
      .updateTable("design_revisions")
      .set({
        status: "in_review",
        result: JSON.stringify(result),
        core_version: CORE_VERSION,
        content_hash: contentHash,
        submitted_by: actor.userId,
        submitted_at: sql`now()`,
        decided_by: null,
        decided_at: null,
        version: sql`version + 1`,
        updated_at: sql`now()`,
      })
      .where("id", "=", revision.id)
      .execute();
    await touchAndRecord(
      trx,
      actor,
      revision,
      "submitted",
      revision.status === "returned" ? "resubmitted after changes" : "",
    );
    return { ok: true, data: { ...outcomeOf(revision, "in_review", actor), designerIds: [actor.userId] } };
  });
}

/** In review → Approved. Needs independence, an intact snapshot and a justification per warn/fail. */
export async function approveRevision(
  db: Kysely<Database>,
  actor: TransitionActor,
  input: ApproveRevisionInput,
): Promise<ActionResult<TransitionOutcome>> {
  return withLockedRevision(db, actor, input, "approve", async (trx, revision) => {
    const integrity = verifySnapshot({
      document: revision.document,
      result: revision.result,
      coreVersion: revision.core_version,
      contentHash: revision.content_hash,
    });
    if (integrity.state !== "intact") {
      return refused(
        "The stored snapshot does not match its content hash, so it cannot be approved. Return it so the designer resubmits.",
      );
    }
    const checks = readChecks(revision.result);
    const missing = missingJustifications(checks, input.justifications);
    if (missing.length > 0) {
      const fieldErrors = Object.fromEntries(
        missing.map((r) => [
          `justifications.${r.rule}`,
          ["Write why this warning or failure is acceptable."],
        ]),
      );
      return refused(
        `Every rule that warns or fails needs a written justification before approval (${missing.map((r) => r.title).join("; ")}).`,
        fieldErrors,
      );
    }
    // Table values taken from memory: the approver must have seen the list and said so. The list is
    // recomputed here from the frozen snapshot (the one the hash above vouches for), never taken
    // from the form, and stored with the decision.
    const unverified = listUnverifiedValues(revision.document, revision.result);
    if (unverified.length > 0 && !input.acknowledgeUnverifiedValues) {
      return refused(
        `This result uses ${unverified.length} unverified table value${unverified.length === 1 ? "" : "s"} (taken from memory, not checked against their tables): ${unverified
          .slice(0, 4)
          .map((v) => v.what)
          .join(
            "; ",
          )}${unverified.length > 4 ? "; …" : ""}. Read the list and tick the acknowledgement before approving.`,
        { acknowledgeUnverifiedValues: ["Tick this to acknowledge the unverified values listed."] },
      );
    }
    // One justification per rule, stored under the rule id (older approvals stored one per check).
    const needing = rulesNeedingJustification(checks);
    if (needing.length > 0) {
      await trx
        .insertInto("revision_justifications")
        .values(
          needing.map((r) => ({
            revision_id: revision.id,
            organization_id: actor.organizationId,
            check_id: r.rule,
            check_status: r.status as "warn" | "fail",
            text: input.justifications[r.rule]!.trim(),
            author_id: actor.userId,
          })),
        )
        .execute();
    }
    // The FE cross-check the approver saw (the latest finished run of this very document, its
    // result hash re-verified) is cited by the decision, which freezes it with the approval.
    const fe = await feCheckForApproval(trx, actor.organizationId, revision.id, revision.document);
    await recordDecision(
      trx,
      actor,
      revision,
      "approved",
      {
        comment: input.comment,
        contentHash: integrity.storedHash,
        cites: {
          acknowledged_unverified: JSON.stringify(unverified),
          fe_check_id: fe?.id ?? null,
          fe_result_hash: fe?.resultHash ?? null,
        },
      },
      [
        needing.length > 0 ? `with ${needing.length} justified rule${needing.length === 1 ? "" : "s"}` : "",
        unverified.length > 0
          ? `${unverified.length} unverified table value${unverified.length === 1 ? "" : "s"} acknowledged`
          : "",
      ]
        .filter(Boolean)
        .join("; "),
    );
    return { ok: true, data: outcomeOf(revision, "approved", actor, input.comment) };
  });
}

/** In review → Returned, with a required comment (also posted to the revision's thread). */
export async function returnRevision(
  db: Kysely<Database>,
  actor: TransitionActor,
  input: ReturnRevisionInput,
): Promise<ActionResult<TransitionOutcome>> {
  const comment = input.comment.trim();
  if (!comment)
    return refused("Say what needs to change: a returned revision needs a comment.", {
      comment: ["A returned revision needs a comment."],
    });
  return withLockedRevision(db, actor, input, "return", async (trx, revision) => {
    await trx
      .insertInto("revision_comments")
      .values({
        revision_id: revision.id,
        organization_id: actor.organizationId,
        author_id: actor.userId,
        body: `Returned: ${comment}`,
      })
      .execute();
    await recordDecision(
      trx,
      actor,
      revision,
      "returned",
      { comment, contentHash: revision.content_hash ?? "" },
      comment.slice(0, 200),
    );
    return { ok: true, data: outcomeOf(revision, "returned", actor, comment) };
  });
}

/** From the Approved working revision: revision number + 1 as a Draft copy of its document. */
export async function startNewRevision(
  db: Kysely<Database>,
  actor: TransitionActor,
  input: StartNewRevisionInput,
): Promise<ActionResult<TransitionOutcome>> {
  return withLockedRevision(db, actor, input, "start-new-revision", async (trx, revision) => {
    const number = revision.number + 1;
    const created = await trx
      .insertInto("design_revisions")
      .values({
        design_id: revision.design_id,
        organization_id: actor.organizationId,
        number,
        status: "draft",
        document: JSON.stringify(revision.document),
        result: revision.result === null ? null : JSON.stringify(revision.result),
        core_version: revision.core_version,
        content_hash: null,
        created_by: actor.userId,
        last_edited_by: actor.userId,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    await touchAndRecord(
      trx,
      actor,
      revision,
      "new-revision",
      `from approved revision ${revision.number}`,
      created.id,
    );
    return { ok: true, data: outcomeOf(revision, "draft", actor, "", created.id, number) };
  });
}

/** Adds a comment to a revision's thread; a target must exist in that revision (bolt id, rule id or check id). */
export async function addComment(
  db: Kysely<Database>,
  actor: TransitionActor,
  input: AddCommentInput,
): Promise<ActionResult<CommentDto>> {
  return db.transaction().execute(async (trx) => {
    const revision = await trx
      .selectFrom("design_revisions")
      .select(["id", "design_id", "document", "result"])
      .where("organization_id", "=", actor.organizationId)
      .where("design_id", "=", input.designId)
      .where("number", "=", input.number)
      .executeTakeFirst();
    if (!revision) return refused("That revision does not exist in this organisation.");
    const targetId = input.targetKind ? (input.targetId ?? "").trim() : null;
    if (input.targetKind === "bolt" && !revision.document.bolts.some((b) => b.id === targetId)) {
      return refused("That bolt is not in this revision.", { targetId: ["Choose a bolt of this revision."] });
    }
    const checks = readChecks(revision.result);
    // A comment points at a rule (what the sign-off sheet offers) or, as older comments did, one check.
    const target =
      input.targetKind === "check"
        ? (checks.find((c) => c.id === targetId)?.title ??
          checks.find((c) => ruleOf(c.id) === targetId)?.title)
        : targetId;
    if (input.targetKind === "check" && target === undefined) {
      return refused("That check is not in this revision's result.", {
        targetId: ["Choose a check of this revision."],
      });
    }
    const row = await trx
      .insertInto("revision_comments")
      .values({
        revision_id: revision.id,
        organization_id: actor.organizationId,
        author_id: actor.userId,
        body: input.body.trim(),
        target_kind: input.targetKind,
        target_id: targetId,
      })
      .returning(["id", "created_at"])
      .executeTakeFirstOrThrow();
    const author = await trx
      .selectFrom("users")
      .select("display_name")
      .where("id", "=", actor.userId)
      .executeTakeFirstOrThrow();
    await recordActivity(trx, {
      organizationId: actor.organizationId,
      designId: revision.design_id,
      revisionId: revision.id,
      actorId: actor.userId,
      kind: "commented",
      detail: targetId ? `on ${input.targetKind} ${target}` : "",
    });
    return {
      ok: true,
      data: {
        id: row.id,
        authorName: author.display_name,
        body: input.body.trim(),
        targetKind: input.targetKind,
        targetId,
        at: isoString(row.created_at),
      },
    };
  });
}
