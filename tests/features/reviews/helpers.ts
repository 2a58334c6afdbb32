import { randomUUID } from "node:crypto";
import { sampleCover } from "@/tests/fixtures/sample-cover";
import type { Role } from "@/db/tables/core";
import { createDesign } from "@/features/designs/mutations";
import type { TransitionActor } from "@/features/reviews/transitions";
import { readChecks } from "@/features/reviews/model/review-checks";
import { rulesNeedingJustification } from "@/features/analysis/rule-groups";
import { getTestDb, deleteWithFrozenGuardOff } from "../../setup/test-db";

// Each review suite makes its own organisation and people (unique slugs and e-mails), so it never
// collides with the e2e seed or other suites sharing the database.
export async function createReviewOrg(label: string) {
  const db = getTestDb();
  const tag = `${label}-${randomUUID().slice(0, 8)}`;
  const org = await db
    .insertInto("organizations")
    .values({ name: `Org ${tag}`, slug: tag })
    .returning("id")
    .executeTakeFirstOrThrow();
  const person = async (who: string, roles: Role[]): Promise<TransitionActor & { email: string }> => {
    const email = `${who}.${tag}@test.example`;
    const u = await db
      .insertInto("users")
      .values({ email, display_name: `${who} ${tag}`, password_hash: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ organization_id: org.id, user_id: u.id, roles }).execute();
    return { userId: u.id, organizationId: org.id, roles, email };
  };
  return {
    organizationId: org.id,
    designer: await person("designer", ["designer"]),
    approver: await person("approver", ["approver"]),
    approver2: await person("approver2", ["approver"]),
    lead: await person("lead", ["designer", "approver"]),
  };
}

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

/** Removes the suite's organisation; approved revisions refuse DELETE, so that trigger is off inside the one transaction. */
export async function dropReviewOrg(organizationId: string) {
  const db = getTestDb();
  const members = await db
    .selectFrom("memberships")
    .select("user_id")
    .where("organization_id", "=", organizationId)
    .execute();
  await deleteWithFrozenGuardOff(async (trx) => {
    await trx.deleteFrom("design_revisions").where("organization_id", "=", organizationId).execute();
    await trx.deleteFrom("organizations").where("id", "=", organizationId).execute();
  });
  if (members.length)
    await db
      .deleteFrom("users")
      .where(
        "id",
        "in",
        members.map((m) => m.user_id),
      )
      .execute();
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
