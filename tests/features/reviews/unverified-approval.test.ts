import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { POST as approveRoute } from "@/app/api/v1/designs/[designId]/revisions/[number]/approval/route";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";
import type { JointDesign } from "@/features/analysis/core/design";
import { getRevisionReview } from "@/features/reviews/queries";
import { approveRevisionSchema } from "@/features/reviews/schema";
import { approveRevision, returnRevision, submitRevision } from "@/features/reviews/transitions";
import { appRequest, sessionCookieFor } from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";
import { reviewOrgForSuite, createSampleDesign, justifyAll, revisionRow } from "./helpers";

// Approving a result that uses table values taken from memory, through the real command and the
// real PostgreSQL: refused without the acknowledgement (nothing written), accepted with it, and the
// acknowledged list stored with the decision; the API route takes the same acknowledgement.
const db = getTestDb();
const org = reviewOrgForSuite("unverified");

async function submittedSample(name: string) {
  const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, name);
  expect(await submitRevision(db, org.designer, { designId, number: 1 })).toMatchObject({ ok: true });
  const row = await revisionRow(designId);
  return { designId, row, unverified: listUnverifiedValues(row.document as JointDesign, row.result) };
}

const decisionsOf = (revisionId: string) =>
  db.selectFrom("revision_decisions").selectAll().where("revision_id", "=", revisionId).execute();

describe("approving a result with unverified table values (real PostgreSQL)", () => {
  it("refuses an approval without the acknowledgement, naming the values, and writes nothing", async () => {
    const { designId, row, unverified } = await submittedSample("E-2107 cover, unacknowledged");
    // The sample's M20 nut comes from the ISO 4032 row, which the catalogue tags "from memory; verify".
    expect(unverified.map((v) => v.key)).toContain("catalogue:nuts:iso-4032-M20");
    const refused = await approveRevision(db, org.approver, {
      designId,
      number: 1,
      comment: "",
      justifications: justifyAll(row.result),
      acknowledgeUnverifiedValues: false,
    });
    expect(refused).toMatchObject({
      ok: false,
      message: expect.stringContaining(`${unverified.length} unverified table values`),
      fieldErrors: { acknowledgeUnverifiedValues: [expect.stringContaining("acknowledge")] },
    });
    expect(!refused.ok && refused.message).toContain("Nut across flats (M20)");
    expect((await revisionRow(designId)).status).toBe("in_review");
    expect(await decisionsOf(row.id)).toHaveLength(0);
    expect(
      await db.selectFrom("revision_justifications").select("id").where("revision_id", "=", row.id).execute(),
    ).toHaveLength(0);
    // The form's unticked checkbox sends nothing: the schema reads that as "not acknowledged".
    expect(approveRevisionSchema.parse({ designId, number: 1 }).acknowledgeUnverifiedValues).toBe(false);
    expect(
      approveRevisionSchema.parse({ designId, number: 1, acknowledgeUnverifiedValues: "on" })
        .acknowledgeUnverifiedValues,
    ).toBe(true);
    expect(
      approveRevisionSchema.safeParse({ designId, number: 1, acknowledgeUnverifiedValues: "maybe" }).success,
    ).toBe(false);
  });

  it("accepts it with the acknowledgement and stores the acknowledged list with the decision", async () => {
    const { designId, row, unverified } = await submittedSample("E-2107 cover, acknowledged");
    const approved = await approveRevision(db, org.approver, {
      designId,
      number: 1,
      comment: "Nut sizes checked against the shop's ISO 4032 table.",
      justifications: justifyAll(row.result),
      acknowledgeUnverifiedValues: true,
    });
    expect(approved).toMatchObject({ ok: true, data: { status: "approved" } });
    const [decision] = await decisionsOf(row.id);
    expect(decision!.kind).toBe("approved");
    expect(decision!.acknowledged_unverified).toEqual(unverified);
    const review = await getRevisionReview(db, org.approver, designId, 1);
    expect(review?.decisions[0]?.acknowledgedUnverified).toEqual(unverified);
    expect(review?.unverifiedValues).toEqual(unverified);
    // Part of the frozen record: the decision row refuses a change.
    await expect(
      sql`update revision_decisions set acknowledged_unverified = '[]'::jsonb where id = ${decision!.id}`.execute(
        db,
      ),
    ).rejects.toThrow();
  });

  it("a return acknowledges nothing: the database refuses a return carrying a list", async () => {
    const { designId, row } = await submittedSample("E-2107 cover, returned");
    expect(
      await returnRevision(db, org.approver, { designId, number: 1, comment: "Check the nuts." }),
    ).toMatchObject({
      ok: true,
    });
    const [decision] = await decisionsOf(row.id);
    expect(decision!.acknowledged_unverified).toEqual([]);
    await expect(
      db
        .insertInto("revision_decisions")
        .values({
          revision_id: row.id,
          organization_id: org.organizationId,
          kind: "returned",
          actor_id: org.approver2.userId,
          comment: "again",
          content_hash: row.content_hash ?? "",
          acknowledged_unverified: JSON.stringify([{ key: "x", what: "x", value: "1", source: "x" }]),
        })
        .execute(),
    ).rejects.toThrow(/revision_decisions_return_acknowledges_nothing/);
  });

  it("POST …/approval: 422 without the acknowledgement, 200 with it", async () => {
    const { designId, row, unverified } = await submittedSample("E-2107 cover, by the API");
    const cookie = await sessionCookieFor(org.approver.userId, org.organizationId);
    const post = (body: unknown) =>
      approveRoute(
        appRequest(`/api/v1/designs/${designId}/revisions/1/approval`, { method: "POST", cookie, body }),
        {
          params: Promise.resolve({ designId, number: "1" }),
        },
      );
    const justifications = justifyAll(row.result);
    const refused = await post({ justifications });
    expect(refused.status).toBe(422);
    const refusal = (await refused.json()) as {
      error: { message: string; fieldErrors: Record<string, string[]> };
    };
    expect(refusal.error.message).toContain("unverified table value");
    expect(refusal.error.fieldErrors.acknowledgeUnverifiedValues).toBeDefined();
    expect((await revisionRow(designId)).status).toBe("in_review");
    const ok = await post({ justifications, acknowledgeUnverifiedValues: true, comment: "by script" });
    expect(ok.status).toBe(200);
    expect(await ok.json()).toMatchObject({ status: "approved", number: 1 });
    const [decision] = await decisionsOf(row.id);
    expect(decision!.acknowledged_unverified).toEqual(unverified);
  });
});
