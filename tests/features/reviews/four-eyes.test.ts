import Drawing from "dxf-writer";
import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import { createDesign, saveWorkingRevision } from "@/features/designs/mutations";
import { recordActivity } from "@/features/activity/queries";
import * as editorsMigration from "../../../migrations/2026_12_02_131700_revision_editors";
import { prepareImport } from "@/features/imports/model/prepare-import";
import { getDeskLists, getRevisionReview } from "@/features/reviews/queries";
import {
  approveRevision,
  returnRevision,
  startNewRevision,
  submitRevision,
} from "@/features/reviews/transitions";
import { getOwnerTestDb, getTestDb } from "../../setup/test-db";
import { reviewOrgForSuite, createSampleDesign, justifyAll, revisionRow, approval } from "./helpers";

// Four-eyes independence over a revision's whole life: everyone who created, saved (at any time),
// imported, started or submitted it is recorded in revision_editors in the same transaction, and
// neither the app nor the database lets any of them approve or return it.
const db = getTestDb();
const org = reviewOrgForSuite("four-eyes");

async function editorsOf(revisionId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("revision_editors")
    .select("user_id")
    .where("revision_id", "=", revisionId)
    .execute();
  return rows.map((r) => r.user_id).sort();
}

async function save(designId: string, userId: string) {
  const row = await revisionRow(designId, (await latestNumber(designId)) ?? 1);
  const document = row.document as JointDesign;
  const outcome = await saveWorkingRevision(db, {
    organizationId: org.organizationId,
    userId,
    designId,
    baseVersion: row.version,
    document: { ...document, name: `${document.name} ·` },
  });
  expect(outcome.kind).toBe("saved");
}

async function latestNumber(designId: string) {
  const r = await db
    .selectFrom("design_revisions")
    .select((eb) => eb.fn.max("number").as("n"))
    .where("design_id", "=", designId)
    .executeTakeFirst();
  return r?.n === null || r?.n === undefined ? undefined : Number(r.n);
}

const sorted = (...ids: string[]) => [...new Set(ids)].sort();

describe("four-eyes independence (real PostgreSQL)", () => {
  it("records the creator in the creating transaction, and every later saver and the submitter", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Recorded");
    const rev = await revisionRow(designId);
    expect(await editorsOf(rev.id)).toEqual([org.designer.userId]);
    await save(designId, org.lead.userId);
    expect(await editorsOf(rev.id)).toEqual(sorted(org.designer.userId, org.lead.userId));
    await save(designId, org.designer.userId);
    expect(await editorsOf(rev.id)).toEqual(sorted(org.designer.userId, org.lead.userId));
    expect(await submitRevision(db, org.designer, { designId, number: 1 })).toMatchObject({ ok: true });
    expect(await editorsOf(rev.id)).toEqual(sorted(org.designer.userId, org.lead.userId));
  });

  it("refuses the bypass: creator saves, approver-designer saves, creator saves and submits, approver-designer decides", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Bypass");
    await save(designId, org.designer.userId);
    await save(designId, org.lead.userId);
    await save(designId, org.designer.userId);
    expect(await submitRevision(db, org.designer, { designId, number: 1 })).toMatchObject({ ok: true });
    const row = await revisionRow(designId);
    // The lead is neither creator, last editor nor submitter: only the editors table knows.
    expect([row.created_by, row.last_edited_by, row.submitted_by]).not.toContain(org.lead.userId);

    // The app: no buttons, refused commands, not on the lead's desk list.
    const review = await getRevisionReview(db, org.lead, designId, 1);
    expect(review?.permissions).toMatchObject({ canApprove: false, canReturn: false });
    const approved = await approveRevision(db, org.lead, approval(designId, justifyAll(row.result)));
    expect(approved).toMatchObject({ ok: false, message: expect.stringContaining("four-eyes") });
    const returned = await returnRevision(db, org.lead, {
      designId,
      number: 1,
      comment: "Not mine to judge",
    });
    expect(returned).toMatchObject({ ok: false, message: expect.stringContaining("four-eyes") });
    const desk = await getDeskLists(db, org.lead);
    expect(desk.waitingForMyReview.map((w) => w.designId)).not.toContain(designId);

    // The database, with the app's checks skipped and SQL sent directly.
    for (const status of ["approved", "returned"]) {
      await expect(
        sql`update design_revisions set status = ${status}, decided_by = ${org.lead.userId}, decided_at = now()
            where id = ${row.id}`.execute(db),
      ).rejects.toThrow(/four-eyes/);
    }
    await expect(
      sql`insert into revision_decisions (revision_id, organization_id, kind, actor_id, comment, content_hash)
          values (${row.id}, ${org.organizationId}, 'returned', ${org.lead.userId}, 'sent by hand', ${row.content_hash})`.execute(
        db,
      ),
    ).rejects.toThrow(/four-eyes/);
    await expect(
      sql`update design_revisions set status = 'approved', decided_by = null where id = ${row.id}`.execute(
        db,
      ),
    ).rejects.toThrow(/decided_by/);
    // The record cannot be rewritten to make the lead look independent: the app's role lacks the
    // privilege, and even the owner meets the append-only trigger.
    for (const [who, refusal] of [
      [db, /permission denied/],
      [getOwnerTestDb(), /append-only/],
    ] as const) {
      await expect(
        sql`delete from revision_editors where revision_id = ${row.id} and user_id = ${org.lead.userId}`.execute(
          who,
        ),
      ).rejects.toThrow(refusal);
      await expect(
        sql`update revision_editors set user_id = ${org.designer.userId} where revision_id = ${row.id}`.execute(
          who,
        ),
      ).rejects.toThrow(refusal);
    }
    expect((await revisionRow(designId)).status).toBe("in_review");

    // An independent approver still can.
    const ok = await approveRevision(db, org.approver, approval(designId, justifyAll(row.result)));
    expect(ok).toMatchObject({ ok: true, data: { status: "approved" } });
  });

  it("records the person who starts revision N, and refuses their decision on it", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Revision two");
    await submitRevision(db, org.designer, { designId, number: 1 });
    const first = await revisionRow(designId);
    await approveRevision(db, org.approver, approval(designId, justifyAll(first.result)));
    expect(await startNewRevision(db, org.lead, { designId, number: 1 })).toMatchObject({ ok: true });
    const second = await revisionRow(designId, 2);
    expect(await editorsOf(second.id)).toEqual([org.lead.userId]);
    await save(designId, org.designer.userId);
    expect(await submitRevision(db, org.designer, { designId, number: 2 })).toMatchObject({ ok: true });
    expect(await editorsOf(second.id)).toEqual(sorted(org.designer.userId, org.lead.userId));
    expect(
      await returnRevision(db, org.lead, { designId, number: 2, comment: "I started it myself" }),
    ).toMatchObject({ ok: false });
    await expect(
      sql`update design_revisions set status = 'returned', decided_by = ${org.lead.userId} where id = ${second.id}`.execute(
        db,
      ),
    ).rejects.toThrow(/four-eyes/);
    // The approver who decided revision 1 is not an editor of revision 2 and may decide it.
    expect(
      await returnRevision(db, org.approver, { designId, number: 2, comment: "Check the gasket width" }),
    ).toMatchObject({ ok: true });
  });

  it("records the submitter when someone other than the last editor submits", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Submitter");
    const rev = await revisionRow(designId);
    expect(await submitRevision(db, org.lead, { designId, number: 1 })).toMatchObject({ ok: true });
    expect(await editorsOf(rev.id)).toEqual(sorted(org.designer.userId, org.lead.userId));
    await expect(
      sql`update design_revisions set status = 'approved', decided_by = ${org.lead.userId} where id = ${rev.id}`.execute(
        db,
      ),
    ).rejects.toThrow(/four-eyes/);
  });

  it("records the importer of a Drawing intake design", async () => {
    const d = new Drawing();
    d.setUnits("Millimeters");
    d.drawCircle(0, 0, 170);
    d.drawCircle(0, 0, 85);
    for (let i = 0; i < 12; i++) {
      const a = ((i + 0.5) * 2 * Math.PI) / 12;
      d.drawCircle(145 * Math.sin(a), 145 * Math.cos(a), 11);
    }
    const prepared = prepareImport({
      dxfText: d.toDxfString(),
      csv: null,
      csvUnit: "mm",
      name: "Imported cover",
      units: "SI",
      equipmentTag: "E-2108",
    });
    expect(prepared.ok).toBe(true);
    if (!prepared.ok) return;
    // The same call the Drawing intake's server action makes.
    const { designId } = await createDesign(db, {
      organizationId: org.organizationId,
      ownerId: org.lead.userId,
      name: "Imported cover",
      equipmentTag: "E-2108",
      document: prepared.built.design,
    });
    const rev = await revisionRow(designId);
    expect(await editorsOf(rev.id)).toEqual([org.lead.userId]);
    await submitRevision(db, org.designer, { designId, number: 1 });
    expect(await approveRevision(db, org.lead, approval(designId, justifyAll(rev.result)))).toMatchObject({
      ok: false,
      message: expect.stringContaining("four-eyes"),
    });
  });

  it("records editors written by hand too (the trigger, not the app, writes the list)", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "By hand");
    const rev = await revisionRow(designId);
    await sql`update design_revisions set last_edited_by = ${org.lead.userId}, version = version + 1 where id = ${rev.id}`.execute(
      db,
    );
    await sql`update design_revisions set last_edited_by = ${org.designer.userId}, version = version + 1 where id = ${rev.id}`.execute(
      db,
    );
    expect(await editorsOf(rev.id)).toEqual(sorted(org.designer.userId, org.lead.userId));
  });

  it("backfills existing revisions from creator, last editor, submitter and the activity log", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Backfilled");
    const rev = await revisionRow(designId);
    // An older save by the lead that only the activity log remembers.
    await recordActivity(db, {
      organizationId: org.organizationId,
      designId,
      revisionId: rev.id,
      actorId: org.lead.userId,
      kind: "saved",
    });
    await recordActivity(db, {
      organizationId: org.organizationId,
      designId,
      revisionId: rev.id,
      actorId: org.approver2.userId,
      kind: "commented",
    });
    const rolledBack = new Error("rolled back on purpose");
    await expect(
      // DDL: only the owner role may run a migration.
      getOwnerTestDb()
        .transaction()
        .execute(async (trx) => {
          await editorsMigration.down(trx);
          await editorsMigration.up(trx);
          const rows = await trx
            .selectFrom("revision_editors")
            .select("user_id")
            .where("revision_id", "=", rev.id)
            .execute();
          expect(rows.map((r) => r.user_id).sort()).toEqual(sorted(org.designer.userId, org.lead.userId));
          throw rolledBack;
        }),
    ).rejects.toBe(rolledBack);
    expect(await editorsOf(rev.id)).toEqual([org.designer.userId]);
  });
});
