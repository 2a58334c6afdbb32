import { Kysely, PostgresDialect, sql } from "kysely";
import pg from "pg";
import { describe, expect, it } from "vitest";
import type { Database } from "@/db/types";
import { listActivity, recordActivity } from "@/features/activity/queries";
import { saveWorkingRevision } from "@/features/designs/mutations";
import { computeContentHash } from "@/features/analysis/content-hash";
import { readChecks } from "@/features/reviews/model/review-checks";
import { rulesNeedingJustification } from "@/features/analysis/rule-groups";
import { getDeskLists, getRevisionReview, listJustifications } from "@/features/reviews/queries";
import { returnRevisionSchema } from "@/features/reviews/schema";
import {
  addComment,
  approveRevision,
  returnRevision,
  startNewRevision,
  submitRevision,
} from "@/features/reviews/transitions";
import type { JointDesign } from "@/features/analysis/core/design";
import { getOwnerTestDb, getTestDb } from "../../setup/test-db";
import {
  reviewOrgForSuite,
  createReviewOrg,
  dropReviewOrg,
  createSampleDesign,
  justifyAll,
  revisionRow,
  approval,
} from "./helpers";

// The review state machine against the real PostgreSQL: every transition, the refused ones, the
// database's own guards, two approvals racing, and tamper detection.
const db = getTestDb();
const org = reviewOrgForSuite("reviews");

describe("review transitions (real PostgreSQL)", () => {
  it("walks submit → return → fix → resubmit → approve → new revision, freezing a verifiable snapshot", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId);

    const submitted = await submitRevision(db, org.designer, { designId, number: 1 });
    expect(submitted).toMatchObject({ ok: true, data: { status: "in_review", number: 1 } });
    let row = await revisionRow(designId);
    expect(row.status).toBe("in_review");
    expect(row.submitted_by).toBe(org.designer.userId);
    expect(row.core_version).toMatch(/^\d+\.\d+\.\d+$/);
    expect(readChecks(row.result).length).toBeGreaterThan(0);
    expect(row.content_hash).toBe(
      computeContentHash({ document: row.document, result: row.result, coreVersion: row.core_version! }),
    );
    const review = await getRevisionReview(db, org.approver, designId, 1);
    expect(review?.integrity).toEqual({ state: "intact", storedHash: row.content_hash });
    expect(review?.permissions).toMatchObject({ canApprove: true, canReturn: true, canSubmit: false });

    // Return without a comment: refused by the schema and by the transition itself.
    expect(returnRevisionSchema.safeParse({ designId, number: 1, comment: "   " }).success).toBe(false);
    expect(await returnRevision(db, org.approver, { designId, number: 1, comment: "  " })).toMatchObject({
      ok: false,
    });
    expect((await revisionRow(designId)).status).toBe("in_review");

    const returned = await returnRevision(db, org.approver, {
      designId,
      number: 1,
      comment: "Bolt b4 sits too close to the pass partition.",
    });
    expect(returned).toMatchObject({ ok: true, data: { status: "returned" } });
    expect((await getDeskLists(db, org.designer)).returnedToMe.map((i) => i.designId)).toContain(designId);

    // Returned is editable like a draft, through the designs save path.
    row = await revisionRow(designId);
    const fixed: JointDesign = {
      ...(row.document as JointDesign),
      bolts: (row.document as JointDesign).bolts.map((b) => (b.id === "b4" ? { ...b, sMm: b.sMm + 2 } : b)),
    };
    const saved = await saveWorkingRevision(db, {
      organizationId: org.organizationId,
      userId: org.designer.userId,
      designId,
      baseVersion: row.version,
      document: fixed,
    });
    expect(saved.kind).toBe("saved");
    expect(await submitRevision(db, org.designer, { designId, number: 1 })).toMatchObject({
      ok: true,
      data: { status: "in_review" },
    });
    expect((await getDeskLists(db, org.approver)).waitingForMyReview.map((i) => i.designId)).toContain(
      designId,
    );
    expect((await getDeskLists(db, org.designer)).returnedToMe.map((i) => i.designId)).not.toContain(
      designId,
    );

    row = await revisionRow(designId);
    const needing = rulesNeedingJustification(readChecks(row.result));
    expect(needing.length).toBeGreaterThan(0); // the sample has warnings (max pitch), so justifications are exercised
    // One rule with many warning pairs needs one justification, not one per pair.
    expect(needing.some((r) => r.open.length > 1)).toBe(true);
    const bare = await approveRevision(db, org.approver, approval(designId, {}));
    expect(bare).toMatchObject({ ok: false, message: expect.stringContaining("justification") });
    const partial = await approveRevision(db, org.approver, {
      acknowledgeUnverifiedValues: true,
      designId,
      number: 1,
      comment: "",
      // A justification keyed by one pair's check id (as older approvals did) does not cover the rule.
      justifications: { [needing[0]!.open[0]!.id]: "fine" },
    });
    expect(partial).toMatchObject({ ok: false });
    expect((await revisionRow(designId)).status).toBe("in_review");
    const approved = await approveRevision(
      db,
      org.approver,
      approval(designId, justifyAll(row.result), { comment: "Seating margin fine." }),
    );
    expect(approved).toMatchObject({ ok: true, data: { status: "approved" } });
    expect((await listJustifications(db, org.organizationId, row.id)).map((j) => j.checkId).sort()).toEqual(
      needing.map((r) => r.rule).sort(),
    );
    expect((await getDeskLists(db, org.approver)).waitingForMyReview.map((i) => i.designId)).not.toContain(
      designId,
    );

    // A new revision: number 2, a draft copy of the approved document; only once.
    const next = await startNewRevision(db, org.designer, { designId, number: 1 });
    expect(next).toMatchObject({ ok: true, data: { status: "draft", number: 2 } });
    const two = await revisionRow(designId, 2);
    expect(two.status).toBe("draft");
    expect(two.document).toEqual((await revisionRow(designId)).document);
    expect(await startNewRevision(db, org.designer, { designId, number: 1 })).toMatchObject({
      ok: false,
      message: expect.stringContaining("newer revision"),
    });

    const kinds = (await listActivity(db, org.organizationId, designId)).map((a) => a.kind).reverse();
    expect(kinds).toEqual([
      "created",
      "submitted",
      "returned",
      "saved",
      "submitted",
      "approved",
      "new-revision",
    ]);
  });

  it("refuses approving a draft, approving your own, the wrong role, and returning without being independent", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.lead.userId, "Own work");
    expect(await approveRevision(db, org.approver, approval(designId, {}))).toMatchObject({
      ok: false,
      message: expect.stringContaining("Draft"),
    });
    expect(await submitRevision(db, org.approver, { designId, number: 1 })).toMatchObject({
      ok: false,
      message: expect.stringContaining("designer"),
    });
    expect(await submitRevision(db, org.lead, { designId, number: 1 })).toMatchObject({ ok: true });
    const row = await revisionRow(designId);
    const own = await approveRevision(db, org.lead, approval(designId, justifyAll(row.result)));
    expect(own).toMatchObject({ ok: false, message: expect.stringContaining("four-eyes") });
    expect(await returnRevision(db, org.lead, { designId, number: 1, comment: "withdrawn" })).toMatchObject({
      ok: false,
    });
    expect(await approveRevision(db, org.designer, approval(designId, justifyAll(row.result)))).toMatchObject(
      { ok: false, message: expect.stringContaining("approver") },
    );
    expect((await revisionRow(designId)).status).toBe("in_review");
    // The lead does not see their own submission as waiting for review; another approver does.
    expect((await getDeskLists(db, org.lead)).waitingForMyReview.map((i) => i.designId)).not.toContain(
      designId,
    );
    expect((await getDeskLists(db, org.approver2)).waitingForMyReview.map((i) => i.designId)).toContain(
      designId,
    );
    // Another organisation's member cannot even find it.
    const other = await createReviewOrg("reviews-other");
    try {
      expect(
        await approveRevision(db, other.approver, approval(designId, justifyAll(row.result))),
      ).toMatchObject({ ok: false, message: expect.stringContaining("does not exist") });
      expect(await getRevisionReview(db, other.approver, designId, 1)).toBeUndefined();
    } finally {
      await dropReviewOrg(other.organizationId);
    }
  });

  it("lets exactly one of two concurrent approvals win (separate connections, row lock)", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Race");
    await submitRevision(db, org.designer, { designId, number: 1 });
    const row = await revisionRow(designId);
    const url = process.env.DATABASE_URL!;
    const a = new Kysely<Database>({
      dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 1 }) }),
    });
    const b = new Kysely<Database>({
      dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 1 }) }),
    });
    try {
      const justifications = justifyAll(row.result);
      const outcomes = await Promise.all([
        approveRevision(a, org.approver, approval(designId, justifications, { comment: "first" })),
        approveRevision(b, org.approver2, approval(designId, justifications, { comment: "second" })),
      ]);
      expect(outcomes.filter((o) => o.ok)).toHaveLength(1);
      expect(outcomes.filter((o) => !o.ok)).toHaveLength(1);
      const loser = outcomes.find((o) => !o.ok);
      expect(loser).toMatchObject({ message: expect.stringContaining("Approved") });
      const decisions = await db
        .selectFrom("revision_decisions")
        .select("kind")
        .where("revision_id", "=", row.id)
        .execute();
      expect(decisions).toEqual([{ kind: "approved" }]);
    } finally {
      await a.destroy();
      await b.destroy();
    }
  });

  it("keeps an approved revision frozen: the designs save path and direct SQL are both refused", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Frozen");
    await submitRevision(db, org.designer, { designId, number: 1 });
    const before = await revisionRow(designId);
    expect(
      await approveRevision(db, org.approver, approval(designId, justifyAll(before.result))),
    ).toMatchObject({ ok: true });
    const row = await revisionRow(designId);

    const save = await saveWorkingRevision(db, {
      organizationId: org.organizationId,
      userId: org.designer.userId,
      designId,
      baseVersion: row.version,
      document: row.document as JointDesign,
    });
    expect(save).toEqual({ kind: "frozen", status: "approved" });
    await expect(
      sql`update design_revisions set result = '{}'::jsonb where id = ${row.id}`.execute(db),
    ).rejects.toThrow(/approved and cannot change/);
    await expect(sql`delete from design_revisions where id = ${row.id}`.execute(db)).rejects.toThrow(
      /approved and cannot change/,
    );
    const after = await revisionRow(designId);
    expect(after.content_hash).toBe(row.content_hash);
    expect(after.result).toEqual(row.result);
  });

  it("refuses skipping review steps and a self-approval written straight into the database", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Shortcut");
    await expect(
      sql`update design_revisions set status = 'approved', decided_by = ${org.approver.userId} where design_id = ${designId}`.execute(
        db,
      ),
    ).rejects.toThrow(/cannot go from draft to approved/);
    await submitRevision(db, org.designer, { designId, number: 1 });
    await expect(
      sql`update design_revisions set status = 'approved', decided_by = ${org.designer.userId} where design_id = ${designId}`.execute(
        db,
      ),
    ).rejects.toThrow(/four.eyes/);
    expect((await revisionRow(designId)).status).toBe("in_review");
  });

  it("reports a tampered snapshot as a hash mismatch on read and refuses to approve it", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Tampered");
    await submitRevision(db, org.designer, { designId, number: 1 });
    const row = await revisionRow(designId);
    await sql`update design_revisions set result = jsonb_set(result, '{tampered}', 'true'::jsonb) where id = ${row.id}`.execute(
      db,
    );
    const review = await getRevisionReview(db, org.approver, designId, 1);
    expect(review?.integrity).toMatchObject({ state: "mismatch", storedHash: row.content_hash });
    expect(review?.integrity.state === "mismatch" && review.integrity.recomputedHash).not.toBe(
      row.content_hash,
    );
    const refused = await approveRevision(db, org.approver, approval(designId, justifyAll(row.result)));
    expect(refused).toMatchObject({ ok: false, message: expect.stringContaining("content hash") });
  });

  it("threads comments that point at a bolt or a check, and refuses targets that are not in the revision", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Comments");
    await submitRevision(db, org.designer, { designId, number: 1 });
    const row = await revisionRow(designId);
    const checkId = readChecks(row.result)[0]!.id;
    expect(
      await addComment(db, org.approver, {
        designId,
        number: 1,
        body: "Check the pitch here",
        targetKind: "bolt",
        targetId: "b3",
      }),
    ).toMatchObject({ ok: true, data: { targetKind: "bolt", targetId: "b3" } });
    expect(
      await addComment(db, org.approver, {
        designId,
        number: 1,
        body: "Why is this fine?",
        targetKind: "check",
        targetId: checkId,
      }),
    ).toMatchObject({ ok: true });
    expect(
      await addComment(db, org.approver, {
        designId,
        number: 1,
        body: "Ghost",
        targetKind: "bolt",
        targetId: "b999",
      }),
    ).toMatchObject({ ok: false, fieldErrors: { targetId: expect.any(Array) } });
    const review = await getRevisionReview(db, org.designer, designId, 1);
    expect(review?.comments.map((c) => [c.targetKind, c.targetId, c.body])).toEqual([
      ["bolt", "b3", "Check the pitch here"],
      ["check", checkId, "Why is this fine?"],
    ]);
  });

  it("keeps the activity log append-only", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Log");
    await recordActivity(db, {
      organizationId: org.organizationId,
      designId,
      actorId: org.designer.userId,
      kind: "exported",
      detail: "sheet.pdf",
    });
    const [entry] = await listActivity(db, org.organizationId, designId);
    expect(entry).toMatchObject({ kind: "exported", detail: "sheet.pdf" });
    // Refused twice over: the app's role lacks the privilege, and even the owner meets the trigger.
    for (const [who, refusal] of [
      [db, /permission denied/],
      [getOwnerTestDb(), /append-only/],
    ] as const) {
      await expect(
        sql`update design_activity set detail = 'nothing happened' where id = ${entry!.id}`.execute(who),
      ).rejects.toThrow(refusal);
      await expect(sql`delete from design_activity where id = ${entry!.id}`.execute(who)).rejects.toThrow(
        refusal,
      );
    }
    expect((await listActivity(db, org.organizationId, designId)).map((e) => e.kind)).toEqual([
      "exported",
      "created",
    ]);
    expect(await listActivity(db, "00000000-0000-4000-8000-000000000000", designId)).toEqual([]);
  });
});
