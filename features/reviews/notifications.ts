import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import {
  sendRevisionApprovedMail,
  sendRevisionReturnedMail,
  sendRevisionSubmittedMail,
} from "@/server/mail/review-messages";
import { listApproverContacts, listUserContacts } from "./queries";
import type { TransitionOutcome } from "./transitions";
import { errorText, getLogger } from "@/server/log/logger";

// Mail after a committed transition. A mail failure never undoes the transition: it is logged
// and the desk lists (which read the database) still show the revision to the right people.
export async function notifyReviewOutcome(
  db: Kysely<Database>,
  organizationId: string,
  outcome: TransitionOutcome,
): Promise<void> {
  try {
    const [actor] = await listUserContacts(db, [outcome.actorId]);
    const info = {
      designId: outcome.designId,
      designName: outcome.designName,
      number: outcome.number,
      actorName: actor?.displayName ?? "Someone",
      comment: outcome.comment,
    };
    if (outcome.status === "in_review") {
      const approvers = await listApproverContacts(db, organizationId, outcome.actorId);
      await sendRevisionSubmittedMail(
        approvers.map((a) => a.email),
        info,
      );
    } else if (outcome.status === "approved" || outcome.status === "returned") {
      const designers = (
        await listUserContacts(
          db,
          outcome.designerIds.filter((id) => id !== outcome.actorId),
        )
      ).map((d) => d.email);
      if (outcome.status === "approved") await sendRevisionApprovedMail(designers, info);
      else await sendRevisionReturnedMail(designers, info);
    }
  } catch (error) {
    getLogger().error(
      { event: "mail", designId: outcome.designId, revision: outcome.number, err: errorText(error) },
      "review mail not sent",
    );
  }
}
