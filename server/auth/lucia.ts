import "server-only";
import { Lucia, TimeSpan } from "lucia";
import type { Kysely } from "kysely";
import { getDb } from "@/db/index";
import type { Database } from "@/db/types";
import { getEnv, isLoopbackHttp, type ServerEnv } from "@/server/env";
import { createKyselyAdapter, type SessionRowAttributes, type UserRowAttributes } from "./adapter";

// The only module that imports lucia's runtime (adapter.ts imports its types). Lucia v3 is
// deprecated upstream; keeping it behind server/auth/ lets us swap in a self-owned session module
// without touching features.
export const SESSION_COOKIE_NAME = "sealpitch_session";

export function createLucia(db: Kysely<Database>, env: ServerEnv) {
  return new Lucia(createKyselyAdapter(db), {
    // Sliding expiry: lucia pushes expires_at forward once less than half of this span is left,
    // so a session dies after between SESSION_IDLE_DAYS/2 and SESSION_IDLE_DAYS idle days.
    sessionExpiresIn: new TimeSpan(env.SESSION_IDLE_DAYS, "d"),
    sessionCookie: {
      name: SESSION_COOKIE_NAME,
      // Server components cannot rewrite cookies, so the cookie outlives the session and the
      // database row (which does slide) decides; a stale cookie simply finds no session.
      expires: false,
      attributes: {
        sameSite: "lax",
        // Decision (pinned in tests/features/accounts/sessions.test.ts): Secure everywhere
        // except plain http on a loopback address. Chromium accepts Secure cookies on
        // http://127.0.0.1, but other clients (curl, fetch in scripts, Playwright's request
        // context) do not, and local http is never reachable from another machine.
        secure: !isLoopbackHttp(env),
      },
    },
    getSessionAttributes: (attributes) => ({ activeOrganizationId: attributes.active_organization_id }),
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      displayName: attributes.display_name,
      unitSystem: attributes.unit_system,
      memberships: attributes.memberships,
    }),
  });
}

export type SealpitchLucia = ReturnType<typeof createLucia>;

declare module "lucia" {
  interface Register {
    Lucia: SealpitchLucia;
    DatabaseSessionAttributes: SessionRowAttributes;
    DatabaseUserAttributes: UserRowAttributes;
  }
}

let instance: { lucia: SealpitchLucia; db: Kysely<Database> } | undefined;

/**
 * The process-wide lucia instance (created on first use so `next build` needs no settings), over
 * the process's one database instance: should that instance be replaced (a test standing in an
 * unreachable database), lucia follows it, since the session lookup is every API request's query.
 */
export function getLucia(): SealpitchLucia {
  const db = getDb();
  if (instance?.db !== db) instance = { lucia: createLucia(db, getEnv()), db };
  return instance.lucia;
}
