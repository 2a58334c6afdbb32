import "server-only";
import { randomBytes } from "node:crypto";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { hashPassword } from "@/server/auth/password";
import type { SignUpInput } from "./schema";

// Sign-up: a new person starts a new organisation and is its first administrator (and a
// designer, so they can start work before inviting anyone).
export const FOUNDER_ROLES: Role[] = ["designer", "admin"];

export type SignUpOutcome =
  { ok: true; userId: string; organizationId: string } | { ok: false; field: "email"; message: string };

export function slugify(name: string): string {
  const base = name
    .toLowerCase()
    .normalize("NFKD")
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 40);
  return `${base || "org"}-${randomBytes(3).toString("hex")}`;
}

export async function createOrganizationWithFounder(
  db: Kysely<Database>,
  input: SignUpInput,
): Promise<SignUpOutcome> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    const user = await trx
      .insertInto("users")
      .values({ email: input.email, display_name: input.displayName, password_hash: passwordHash })
      .onConflict((oc) => oc.column("email").doNothing())
      .returning("id")
      .executeTakeFirst();
    if (!user) {
      // Sign-up cannot help revealing that an address has an account; it says no more than that.
      return {
        ok: false,
        field: "email",
        message: "This address already has an account. Sign in, or reset the password.",
      };
    }
    const org = await trx
      .insertInto("organizations")
      .values({ name: input.organizationName, slug: slugify(input.organizationName) })
      .returning("id")
      .executeTakeFirstOrThrow();
    await trx
      .insertInto("memberships")
      .values({ organization_id: org.id, user_id: user.id, roles: FOUNDER_ROLES })
      .execute();
    return { ok: true, userId: user.id, organizationId: org.id };
  });
}
