import { describe, expect, it } from "vitest";
import { notifyReviewOutcome } from "@/features/reviews/notifications";
import { approveRevision, returnRevision, submitRevision } from "@/features/reviews/transitions";
import { readChecks } from "@/features/reviews/model/review-checks";
import { rulesNeedingJustification } from "@/features/analysis/rule-groups";
import { getTestDb } from "../../setup/test-db";
import { messagesTo } from "../accounts/outbox";
import { reviewOrgForSuite, createSampleDesign, approval } from "./helpers";

// Review mail through the real fake SMTP server: who gets which message, with the review link.
const db = getTestDb();
const org = reviewOrgForSuite("review-mail");

async function waitFor(address: string, subjectPart: string) {
  for (let i = 0; i < 50; i++) {
    const found = (await messagesTo(address)).filter((m) => m.subject.includes(subjectPart));
    if (found.length > 0) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}

describe("review notifications (fake SMTP)", () => {
  it("mails every approver but the submitter on submit, and the designer on return and approval", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.lead.userId, "Mail cover");
    const submitted = await submitRevision(db, org.lead, { designId, number: 1 });
    if (!submitted.ok) throw new Error(submitted.message);
    await notifyReviewOutcome(db, org.organizationId, submitted.data);
    const link = `${process.env.APP_URL}/designs/${designId}/revisions/1`;
    for (const approver of [org.approver, org.approver2]) {
      const [message] = await waitFor(approver.email, "Review requested: Mail cover revision 1");
      expect(message?.text).toContain(link);
    }
    // The lead is an approver too, but submitted it: no request to review their own work.
    expect(
      (await messagesTo(org.lead.email)).filter((m) => m.subject.startsWith("Review requested")),
    ).toHaveLength(0);
    expect(
      (await messagesTo(org.designer.email)).filter((m) => m.subject.startsWith("Review requested")),
    ).toHaveLength(0);

    const returned = await returnRevision(db, org.approver, {
      designId,
      number: 1,
      comment: "Seating stress at b7 is marginal.",
    });
    if (!returned.ok) throw new Error(returned.message);
    await notifyReviewOutcome(db, org.organizationId, returned.data);
    const [back] = await waitFor(org.lead.email, "Returned: Mail cover revision 1");
    expect(back?.text).toContain("Seating stress at b7 is marginal.");
    expect(back?.text).toContain(link);

    const again = await submitRevision(db, org.lead, { designId, number: 1 });
    if (!again.ok) throw new Error(again.message);
    const row = await db
      .selectFrom("design_revisions")
      .select("result")
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    const justifications = Object.fromEntries(
      rulesNeedingJustification(readChecks(row.result)).map((r) => [r.rule, "accepted"]),
    );
    const approved = await approveRevision(db, org.approver2, approval(designId, justifications));
    if (!approved.ok) throw new Error(approved.message);
    await notifyReviewOutcome(db, org.organizationId, approved.data);
    const [done] = await waitFor(org.lead.email, "Approved: Mail cover revision 1");
    expect(done?.text).toContain(link);
    expect(
      (await messagesTo(org.approver2.email)).filter((m) => m.subject.startsWith("Approved")),
    ).toHaveLength(0);
  });
});
