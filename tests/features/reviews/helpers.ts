import { sampleCover } from "@/tests/fixtures/sample-cover";
import type { Role } from "@/db/tables/core";
import { createDesign } from "@/features/designs/mutations";
import type { TransitionActor } from "@/features/reviews/transitions";
import type { ApproveRevisionInput } from "@/features/reviews/schema";
import { readChecks } from "@/features/reviews/model/review-checks";
import { rulesNeedingJustification } from "@/features/analysis/rule-groups";
import { getTestDb } from "../../setup/test-db";
import { createTaggedOrg, dropTaggedOrg, orgForSuite } from "../../setup/suite-org";

/** A review suite's organisation: a designer, two approvers and a lead who is both. */
export async function createReviewOrg(label: string) {
  const { organizationId, person } = await createTaggedOrg(label);
  const actor = async (who: string, roles: Role[]): Promise<TransitionActor & { email: string }> => ({
    ...(await person(who, roles)),
    organizationId,
    roles,
  });
  return {
    organizationId,
    designer: await actor("designer", ["designer"]),
    approver: await actor("approver", ["approver"]),
    approver2: await actor("approver2", ["approver"]),
    lead: await actor("lead", ["designer", "approver"]),
  };
}

/** createReviewOrg for the whole file: made before its tests, dropped after them. */
export const reviewOrgForSuite = (label: string) => orgForSuite(() => createReviewOrg(label));

/** Removes a suite's organisation (tests/setup/suite-org.ts). */
export const dropReviewOrg = dropTaggedOrg;

export function sampleDocument(name = "E-2107 channel cover") {
  return sampleCover(name, "E-2107");
}

export async function createSampleDesign(
  organizationId: string,
  ownerId: string,
  name = "E-2107 channel cover",
) {
  return createDesign(getTestDb(), {
    organizationId,
    ownerId,
    name,
    equipmentTag: "E-2107",
    document: sampleDocument(name),
  });
}

/** The stored row of revision `number` of a design. */
export async function revisionRow(designId: string, number = 1) {
  return getTestDb()
    .selectFrom("design_revisions")
    .selectAll()
    .where("design_id", "=", designId)
    .where("number", "=", number)
    .executeTakeFirstOrThrow();
}

/** One written justification for every rule of a stored result that warns or fails. */
export function justifyAll(result: unknown): Record<string, string> {
  return Object.fromEntries(
    rulesNeedingJustification(readChecks(result)).map((r) => [r.rule, `Accepted for ${r.title}: hydrotest`]),
  );
}

/** What an approver sends for revision 1 (unless `number` says otherwise), unverified values acknowledged. */
export function approval(
  designId: string,
  justifications: Record<string, string>,
  options: { comment?: string; number?: number } = {},
): ApproveRevisionInput {
  return {
    acknowledgeUnverifiedValues: true,
    designId,
    number: options.number ?? 1,
    comment: options.comment ?? "",
    justifications,
  };
}
