import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { hashPassword } from "@/server/auth/password";
import { getLucia, SESSION_COOKIE_NAME } from "@/server/auth/lucia";

// Shared fixtures for integration suites: an organisation of our own with one user per named
// role set, and real sessions (created through the app's lucia instance) to put in a Cookie
// header. Everything is uniquely named per call, so suites never collide with each other or
// with the e2e seed; call cleanup() in afterAll.
export const FIXTURE_PASSWORD = "fixture-gasket-2026";

let fixtureHash: Promise<string> | undefined;

export interface FixtureUser {
  userId: string;
  email: string;
  displayName: string;
  roles: Role[];
}

export interface OrganizationFixture<K extends string> {
  organizationId: string;
  organizationName: string;
  slug: string;
  users: Record<K, FixtureUser>;
  /** A fresh session for that user in this organisation, as a Cookie header value. */
  cookieFor(key: K): Promise<string>;
  /** Deletes the organisation and its users (sessions, memberships, invitations cascade). */
  cleanup(): Promise<void>;
}

/**
 * createOrganizationWithMembers(db, { designer: ["designer"], approver: ["approver"], admin: ["admin"] })
 * Every user gets the password FIXTURE_PASSWORD (hashed once per process).
 */
export async function createOrganizationWithMembers<K extends string>(
  db: Kysely<Database>,
  members: Record<K, Role[]>,
  options: { name?: string } = {},
): Promise<OrganizationFixture<K>> {
  const tag = randomUUID().slice(0, 8);
  const organizationName = options.name ?? `Fixture Works ${tag}`;
  const slug = `fixture-${tag}`;
  const org = await db
    .insertInto("organizations")
    .values({ name: organizationName, slug })
    .returning("id")
    .executeTakeFirstOrThrow();
  fixtureHash ??= hashPassword(FIXTURE_PASSWORD);
  const passwordHash = await fixtureHash;
  const users = {} as Record<K, FixtureUser>;
  for (const key of Object.keys(members) as K[]) {
    const email = `${key.toLowerCase().replace(/[^a-z0-9]+/g, "-")}.${tag}@fixture.example`;
    const displayName = `${key} ${tag}`;
    const user = await db
      .insertInto("users")
      .values({ email, display_name: displayName, password_hash: passwordHash })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db
      .insertInto("memberships")
      .values({ organization_id: org.id, user_id: user.id, roles: members[key] })
      .execute();
    users[key] = { userId: user.id, email, displayName, roles: members[key] };
  }
  return {
    organizationId: org.id,
    organizationName,
    slug,
    users,
    cookieFor: (key) => sessionCookieFor(users[key].userId, org.id),
    async cleanup() {
      const ids = Object.values<FixtureUser>(users).map((u) => u.userId);
      if (ids.length) await db.deleteFrom("users").where("id", "in", ids).execute();
      await db.deleteFrom("organizations").where("id", "=", org.id).execute();
    },
  };
}

/** A real session for the user (active in the organisation) as a Cookie header value. */
export async function sessionCookieFor(userId: string, organizationId: string | null): Promise<string> {
  const session = await getLucia().createSession(userId, { active_organization_id: organizationId });
  return `${SESSION_COOKIE_NAME}=${session.id}`;
}

/** A Request to the app as the browser would send it (same Origin unless told otherwise). */
export function appRequest(
  path: string,
  init: {
    method?: string;
    cookie?: string;
    body?: unknown;
    origin?: string | null;
    headers?: Record<string, string>;
  } = {},
): Request {
  const base = process.env.APP_URL ?? "http://127.0.0.1:3100";
  const headers = new Headers(init.headers);
  if (init.cookie) headers.set("cookie", init.cookie);
  const method = init.method ?? "GET";
  if (init.origin !== null && method !== "GET") headers.set("origin", init.origin ?? new URL(base).origin);
  if (init.body !== undefined) headers.set("content-type", "application/json");
  return new Request(new URL(path, base), {
    method,
    headers,
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
}

/** The rectangular cover the API tests create designs from (POST /api/v1/designs `template`). */
export const COVER_TEMPLATE = {
  kind: "rectangular-cover",
  widthMm: 600,
  heightMm: 400,
  cornerRadiusMm: 40,
  boltEdgeDistanceMm: 35,
  boltCount: 16,
  boltSize: "M20",
  coverThicknessMm: 30,
  flangeThicknessMm: 30,
  gasketWidthMm: 20,
} as const;
