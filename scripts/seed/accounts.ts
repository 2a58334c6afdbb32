import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { hashPassword } from "@/server/auth/password";

// The demo scenario is our own invention: Kestrel Ridge Process Works, a small engineering
// contractor, working on the Halden Creek plant. None of these people or tags are real.
export const DEMO_ORGANIZATION = { name: "Kestrel Ridge Process Works", slug: "kestrel-ridge" };
export const DEMO_PASSWORD = "halden-creek-2026";

export const DEMO_USERS: { email: string; displayName: string; roles: Role[] }[] = [
  { email: "dana.designer@kestrel-ridge.example", displayName: "Dana Okafor", roles: ["designer"] },
  { email: "arlo.approver@kestrel-ridge.example", displayName: "Arlo Lindqvist", roles: ["approver"] },
  { email: "ines.admin@kestrel-ridge.example", displayName: "Ines Marchetti", roles: ["admin", "designer"] },
  { email: "piet.lead@kestrel-ridge.example", displayName: "Piet van Aken", roles: ["designer", "approver"] },
];

/** Creates the demo organisation and its members when missing; never changes existing rows. */
export async function seedAccounts(db: Kysely<Database>): Promise<{ organizationId: string }> {
  const existing = await db
    .selectFrom("organizations")
    .select("id")
    .where("slug", "=", DEMO_ORGANIZATION.slug)
    .executeTakeFirst();
  const organizationId =
    existing?.id ??
    (await db.insertInto("organizations").values(DEMO_ORGANIZATION).returning("id").executeTakeFirstOrThrow())
      .id;

  const passwordHash = await hashPassword(DEMO_PASSWORD);
  for (const user of DEMO_USERS) {
    const row = await db
      .insertInto("users")
      .values({ email: user.email, display_name: user.displayName, password_hash: passwordHash })
      .onConflict((oc) => oc.column("email").doNothing())
      .returning("id")
      .executeTakeFirst();
    const userId =
      row?.id ??
      (await db.selectFrom("users").select("id").where("email", "=", user.email).executeTakeFirstOrThrow())
        .id;
    await db
      .insertInto("memberships")
      .values({ organization_id: organizationId, user_id: userId, roles: user.roles })
      .onConflict((oc) => oc.columns(["organization_id", "user_id"]).doNothing())
      .execute();
  }
  return { organizationId };
}
