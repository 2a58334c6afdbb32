import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createKyselyAdapter } from "@/server/auth/adapter";
import { authorizeApi } from "@/server/auth/guard";
import { createLucia, getLucia, SESSION_COOKIE_NAME } from "@/server/auth/lucia";
import { PASSWORD_HASH_OPTIONS, hashPassword, verifyPassword } from "@/server/auth/password";
import { hashSessionId } from "@/server/auth/session-id";
import { resolveViewerContext } from "@/server/auth/viewer";
import { getEnv, parseEnv } from "@/server/env";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "../../setup/fixtures";
import { getOwnerTestDb, getTestDb } from "../../setup/test-db";
import * as hashSessionsMigration from "../../../migrations/2026_12_02_134100_hash_session_ids";

const db = getTestDb();
let org: OrganizationFixture<"dana" | "arlo">;
/** The stored row of a session (its id is kept hashed), or undefined once it is gone. */
const storedSessionRow = (sessionId: string) =>
  db.selectFrom("sessions").select("id").where("id", "=", hashSessionId(sessionId)).executeTakeFirst();

beforeAll(async () => {
  org = await createOrganizationWithMembers(db, { dana: ["designer"], arlo: ["approver", "admin"] });
});
afterAll(() => org.cleanup());

describe("password hashing", () => {
  it("stores argon2id with m=19456 KiB, t=2, p=1 in the PHC string", async () => {
    const stored = await hashPassword("a long enough secret");
    const match = /^\$(argon2(?:id|i|d))\$v=(\d+)\$m=(\d+),t=(\d+),p=(\d+)\$/.exec(stored);
    expect(match).not.toBeNull();
    const [, variant, version, m, t, p] = match!;
    expect({ variant, version, m: Number(m), t: Number(t), p: Number(p) }).toEqual({
      variant: "argon2id",
      version: "19",
      m: 19456,
      t: 2,
      p: 1,
    });
    expect(PASSWORD_HASH_OPTIONS.memoryCost).toBeGreaterThanOrEqual(19456);
    expect(await verifyPassword(stored, "a long enough secret")).toBe(true);
    expect(await verifyPassword(stored, "a long enough secreT")).toBe(false);
    expect(await verifyPassword("not a hash", "x")).toBe(false);
  });
});

describe("the Kysely adapter over sessions/users", () => {
  const adapter = createKyselyAdapter(db);

  it("round-trips a session and never carries the password hash", async () => {
    const expiresAt = new Date(Date.now() + 3_600_000);
    const id = `adapter-${Date.now()}`;
    await adapter.setSession({
      id,
      userId: org.users.dana.userId,
      expiresAt,
      attributes: { active_organization_id: org.organizationId },
    });
    const [session, user] = await adapter.getSessionAndUser(id);
    expect(session).toEqual({
      id,
      userId: org.users.dana.userId,
      expiresAt,
      attributes: { active_organization_id: org.organizationId },
    });
    expect(user).toEqual({
      id: org.users.dana.userId,
      attributes: {
        email: org.users.dana.email,
        display_name: org.users.dana.displayName,
        unit_system: "SI",
        // The memberships come in the same query (one session lookup per request).
        memberships: [
          { id: org.organizationId, name: expect.any(String), slug: expect.any(String), roles: ["designer"] },
        ],
      },
    });
    expect(JSON.stringify([session, user])).not.toContain("$argon2");

    const later = new Date(expiresAt.getTime() + 86_400_000);
    await adapter.updateSessionExpiration(id, later);
    expect(
      (await adapter.getUserSessions(org.users.dana.userId)).find((s) => s.id === hashSessionId(id))
        ?.expiresAt,
    ).toEqual(later);
    await adapter.deleteSession(id);
    expect(await adapter.getSessionAndUser(id)).toEqual([null, null]);
  });

  it("drops sessions of a disabled account", async () => {
    const session = await getLucia().createSession(org.users.arlo.userId, {
      active_organization_id: org.organizationId,
    });
    await db
      .updateTable("users")
      .set({ disabled_at: new Date() })
      .where("id", "=", org.users.arlo.userId)
      .execute();
    try {
      expect((await getLucia().validateSession(session.id)).session).toBeNull();
      expect(await storedSessionRow(session.id)).toBeUndefined();
    } finally {
      await db
        .updateTable("users")
        .set({ disabled_at: null })
        .where("id", "=", org.users.arlo.userId)
        .execute();
    }
  });

  it("deletes only expired sessions", async () => {
    const oldId = `old-${Date.now()}`;
    await adapter.setSession({
      id: oldId,
      userId: org.users.dana.userId,
      expiresAt: new Date(Date.now() - 1000),
      attributes: { active_organization_id: null },
    });
    const live = await getLucia().createSession(org.users.dana.userId, { active_organization_id: null });
    await adapter.deleteExpiredSessions();
    const ids = (await adapter.getUserSessions(org.users.dana.userId)).map((s) => s.id);
    expect(ids).toContain(hashSessionId(live.id));
    expect(ids).not.toContain(hashSessionId(oldId));
  });
});

describe("stored session ids", () => {
  it("keeps SHA-256 of each id, never an issued id, and still finds the session by its cookie", async () => {
    const lucia = getLucia();
    const issued = await Promise.all(
      [0, 1, 2].map(() => lucia.createSession(org.users.dana.userId, { active_organization_id: null })),
    );
    const stored = (await db.selectFrom("sessions").select("id").execute()).map((r) => r.id);
    for (const session of issued) {
      expect(stored).not.toContain(session.id);
      expect(stored).toContain(hashSessionId(session.id));
      expect((await lucia.validateSession(session.id)).session?.id).toBe(session.id);
      // Holding the stored value is not holding the session.
      expect((await lucia.validateSession(hashSessionId(session.id))).session).toBeNull();
    }
    expect(stored.every((id) => /^[0-9a-f]{64}$/.test(id))).toBe(true);
    // The database refuses a row that is not such a hash, whoever writes it.
    await expect(
      db
        .insertInto("sessions")
        .values({ id: issued[0]!.id + "x", user_id: org.users.dana.userId, expires_at: new Date() })
        .execute(),
    ).rejects.toThrow(/sessions_id_is_sha256/);
    for (const session of issued) await lucia.invalidateSession(session.id);
    expect(
      await db
        .selectFrom("sessions")
        .select("id")
        .where(
          "id",
          "in",
          issued.map((s) => hashSessionId(s.id)),
        )
        .execute(),
    ).toEqual([]);
  });
});

describe("the migration to hashed ids", () => {
  it("rehashes the ids stored before it, so existing cookies keep working", async () => {
    const rolledBack = new Error("rolled back on purpose");
    const raw = "legacyissuedsessionid234567abcdefghijklm";
    await expect(
      getOwnerTestDb()
        .transaction()
        .execute(async (trx) => {
          await hashSessionsMigration.down(trx);
          await trx
            .insertInto("sessions")
            .values({ id: raw, user_id: org.users.dana.userId, expires_at: new Date(Date.now() + 3_600_000) })
            .execute();
          await hashSessionsMigration.up(trx);
          const rows = await trx.selectFrom("sessions").select("id").execute();
          expect(rows.map((r) => r.id)).toEqual([hashSessionId(raw)]);
          throw rolledBack;
        }),
    ).rejects.toBe(rolledBack);
  });
});

describe("sliding expiry", () => {
  it("pushes expires_at forward once less than half of SESSION_IDLE_DAYS is left, and refuses an expired one", async () => {
    const lucia = getLucia();
    const idleMs = getEnv().SESSION_IDLE_DAYS * 86_400_000;
    const session = await lucia.createSession(org.users.dana.userId, {
      active_organization_id: org.organizationId,
    });
    // Still more than half left: unchanged.
    const fresh = await lucia.validateSession(session.id);
    expect(fresh.session?.fresh).toBe(false);

    const nearlyIdle = new Date(Date.now() + idleMs / 2 - 60_000);
    await db
      .updateTable("sessions")
      .set({ expires_at: nearlyIdle })
      .where("id", "=", hashSessionId(session.id))
      .execute();
    const slid = await lucia.validateSession(session.id);
    expect(slid.session?.fresh).toBe(true);
    const stored = await db
      .selectFrom("sessions")
      .select("expires_at")
      .where("id", "=", hashSessionId(session.id))
      .executeTakeFirstOrThrow();
    expect(new Date(stored.expires_at).getTime()).toBeGreaterThan(Date.now() + idleMs - 60_000);

    await db
      .updateTable("sessions")
      .set({ expires_at: new Date(Date.now() - 1000) })
      .where("id", "=", hashSessionId(session.id))
      .execute();
    expect((await lucia.validateSession(session.id)).session).toBeNull();
    expect(await storedSessionRow(session.id)).toBeUndefined();
  });
});

describe("sign-out everywhere", () => {
  it("ends every session of the user and none of anybody else's", async () => {
    const lucia = getLucia();
    const a = await lucia.createSession(org.users.dana.userId, {
      active_organization_id: org.organizationId,
    });
    const b = await lucia.createSession(org.users.dana.userId, {
      active_organization_id: org.organizationId,
    });
    const other = await lucia.createSession(org.users.arlo.userId, {
      active_organization_id: org.organizationId,
    });
    await lucia.invalidateSession(a.id);
    expect((await lucia.validateSession(a.id)).session).toBeNull();
    expect((await lucia.validateSession(b.id)).session).not.toBeNull();
    await lucia.invalidateUserSessions(org.users.dana.userId);
    expect((await lucia.validateSession(b.id)).session).toBeNull();
    expect((await lucia.validateSession(other.id)).session).not.toBeNull();
    const response = await authorizeApi(
      appRequest("/api/v1/me", { cookie: `${SESSION_COOKIE_NAME}=${b.id}` }),
    );
    expect(response.ok).toBe(false);
    if (!response.ok) expect(response.response.status).toBe(401);
  });
});

describe("session cookie attributes (decision: Secure except plain http on loopback)", () => {
  const base = { DATABASE_URL: "postgres://x@127.0.0.1/x", SMTP_HOST: "127.0.0.1", SMTP_PORT: "25" };

  it("is HttpOnly, SameSite=Lax, Path=/ and not Secure on http://127.0.0.1", () => {
    const lucia = createLucia(db, parseEnv({ ...base, APP_URL: "http://127.0.0.1:3000" }));
    const header = lucia.createSessionCookie("abc").serialize();
    expect(header).toMatch(/^sealpitch_session=abc; /);
    expect(header).toContain("HttpOnly");
    expect(header).toContain("SameSite=Lax");
    expect(header).toContain("Path=/");
    expect(header).not.toContain("Secure");
  });

  it("is Secure on https and on a non-loopback http host", () => {
    for (const url of ["https://sealpitch.example", "http://10.0.0.5:3000"]) {
      const header = createLucia(db, parseEnv({ ...base, APP_URL: url }))
        .createSessionCookie("abc")
        .serialize();
      expect(header, url).toContain("Secure");
      expect(header, url).toContain("HttpOnly");
    }
  });
});

describe("active organisation", () => {
  it("falls back to a membership when the session points at an organisation the user left", async () => {
    const second = await createOrganizationWithMembers(db, { other: ["admin"] });
    try {
      const session = await getLucia().createSession(org.users.dana.userId, {
        active_organization_id: second.organizationId,
      });
      const context = await resolveViewerContext(session.id);
      expect(context?.viewer.organizationId).toBe(org.organizationId);
      expect(context?.viewer.roles).toEqual(["designer"]);
    } finally {
      await second.cleanup();
    }
  });
});
