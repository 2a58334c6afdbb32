import "server-only";
import type { Adapter, DatabaseSession, DatabaseUser } from "lucia";
import type { Kysely } from "kysely";
import { jsonArrayFrom } from "kysely/helpers/postgres";
import type { Database } from "@/db/types";
import type { Role, UnitSystem } from "@/db/tables/core";
import { hashSessionId } from "./session-id";

// Lucia's storage contract over our own `sessions` and `users` tables (migration 000200).
// `sessions.id` holds SHA-256 of the session id (session-id.ts): every method hashes the id lucia
// passes in, and getSessionAndUser answers with the id it was asked for. getUserSessions can only
// return the stored hashes as ids; they are not cookies and are used for listing only.
// Only the columns below ever leave the database here: password_hash is never selected, so it
// cannot end up in a session, a viewer or anything serialised to the browser.
export interface SessionRowAttributes {
  active_organization_id: string | null;
}

export interface UserRowAttributes {
  email: string;
  display_name: string;
  unit_system: UnitSystem;
  /** The user's organisations, oldest membership first: read in the session's own query. */
  memberships: SessionMembership[];
}

export interface SessionMembership {
  id: string;
  name: string;
  slug: string;
  roles: Role[];
}

const sessionColumns = [
  "sessions.id",
  "sessions.user_id",
  "sessions.expires_at",
  "sessions.active_organization_id",
] as const;

function toDatabaseSession(
  row: {
    id: string;
    user_id: string;
    expires_at: Date;
    active_organization_id: string | null;
  },
  id: string = row.id,
): DatabaseSession {
  return {
    id,
    userId: row.user_id,
    expiresAt: new Date(row.expires_at),
    attributes: { active_organization_id: row.active_organization_id },
  };
}

export function createKyselyAdapter(db: Kysely<Database>): Adapter {
  return {
    // One round trip per request: the session, its user and the user's memberships (which
    // resolveViewerContext needs for the active organisation) in a single statement.
    async getSessionAndUser(sessionId) {
      const row = await db
        .selectFrom("sessions")
        .innerJoin("users", "users.id", "sessions.user_id")
        .select((eb) => [
          ...sessionColumns,
          "users.email",
          "users.display_name",
          "users.unit_system",
          "users.disabled_at",
          jsonArrayFrom(
            eb
              .selectFrom("memberships")
              .innerJoin("organizations", "organizations.id", "memberships.organization_id")
              .select(["organizations.id", "organizations.name", "organizations.slug", "memberships.roles"])
              .whereRef("memberships.user_id", "=", "users.id")
              .orderBy("memberships.created_at")
              .orderBy("organizations.name"),
          ).as("memberships"),
        ])
        .where("sessions.id", "=", hashSessionId(sessionId))
        .executeTakeFirst();
      if (!row) return [null, null];
      const session = toDatabaseSession(row, sessionId);
      // A disabled account has no user: lucia then deletes the session.
      if (row.disabled_at) return [session, null];
      const user: DatabaseUser = {
        id: row.user_id,
        attributes: {
          email: row.email,
          display_name: row.display_name,
          unit_system: row.unit_system,
          memberships: row.memberships,
        },
      };
      return [session, user];
    },

    async getUserSessions(userId) {
      const rows = await db
        .selectFrom("sessions")
        .select(sessionColumns)
        .where("sessions.user_id", "=", userId)
        .execute();
      return rows.map((row) => toDatabaseSession(row));
    },

    async setSession(session) {
      await db
        .insertInto("sessions")
        .values({
          id: hashSessionId(session.id),
          user_id: session.userId,
          expires_at: session.expiresAt,
          active_organization_id: session.attributes.active_organization_id ?? null,
        })
        .execute();
    },

    async updateSessionExpiration(sessionId, expiresAt) {
      await db
        .updateTable("sessions")
        .set({ expires_at: expiresAt })
        .where("id", "=", hashSessionId(sessionId))
        .execute();
    },

    async deleteSession(sessionId) {
      await db.deleteFrom("sessions").where("id", "=", hashSessionId(sessionId)).execute();
    },

    async deleteUserSessions(userId) {
      await db.deleteFrom("sessions").where("user_id", "=", userId).execute();
    },

    async deleteExpiredSessions() {
      await db.deleteFrom("sessions").where("expires_at", "<=", new Date()).execute();
    },
  };
}
