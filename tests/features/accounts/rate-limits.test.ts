import { randomUUID } from "node:crypto";
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "@/db/types";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authenticate, WRONG_CREDENTIALS } from "@/features/accounts/credentials";
import { requestPasswordReset, RESET_REQUESTED } from "@/features/accounts/password-reset";
import { clientAddressKey, RATE_LIMITS, tooManyAttemptsMessage } from "@/server/auth/rate-limit";
import {
  createOrganizationWithMembers,
  FIXTURE_PASSWORD,
  type OrganizationFixture,
} from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";

const db = getTestDb();
let org: OrganizationFixture<"locked" | "other" | "resetter" | "parallel">;
/** The unlocked account signs in with its right password from an address of its own. */
const otherSignsIn = () =>
  authenticate(db, {
    email: org.users.other.email,
    password: FIXTURE_PASSWORD,
    addressKey: `rl-${randomUUID()}`,
  });

beforeAll(async () => {
  org = await createOrganizationWithMembers(db, {
    locked: ["designer"],
    other: ["designer"],
    resetter: ["approver"],
    parallel: ["designer"],
  });
});
afterAll(async () => {
  await db.deleteFrom("auth_attempts").where("key", "like", "%fixture%").execute();
  await db.deleteFrom("auth_attempts").where("key", "like", "rl-%").execute();
  await org.cleanup();
});

describe("sign-in rate limits", () => {
  it("per account: after 5 wrong passwords even the right one is refused with the minutes to wait", async () => {
    const email = org.users.locked.email;
    for (let i = 0; i < RATE_LIMITS.signInAccount.max; i += 1) {
      // A different address each time: only the account limit can trip.
      expect(await authenticate(db, { email, password: "wrong", addressKey: `rl-${randomUUID()}` })).toEqual({
        ok: false,
        message: WRONG_CREDENTIALS,
        limited: false,
      });
    }
    const refused = await authenticate(db, {
      email,
      password: FIXTURE_PASSWORD,
      addressKey: `rl-${randomUUID()}`,
    });
    expect(refused).toEqual({
      ok: false,
      message: "Too many attempts. Try again in 15 minutes.",
      limited: true,
    });
    // 14 minutes later the oldest failure is still inside the window: 1 minute to go.
    const later = new Date(Date.now() + 14 * 60_000 + 1000);
    expect(
      await authenticate(db, { email, password: FIXTURE_PASSWORD, addressKey: `rl-${randomUUID()}` }, later),
    ).toMatchObject({ message: "Too many attempts. Try again in 1 minute." });
    // Another account is not affected.
    expect(await otherSignsIn()).toMatchObject({ ok: true });
    // After the window the account may sign in again.
    const after = new Date(Date.now() + 16 * 60_000);
    expect(
      await authenticate(db, { email, password: FIXTURE_PASSWORD, addressKey: `rl-${randomUUID()}` }, after),
    ).toMatchObject({ ok: true });
  });

  it("per address: 30 failures from one address over many accounts lock that address only", async () => {
    const addressKey = `rl-${randomUUID()}`;
    for (let i = 0; i < RATE_LIMITS.signInAddress.max; i += 1) {
      await authenticate(db, {
        email: `ghost-${i}-${randomUUID().slice(0, 6)}@fixture.example`,
        password: "guess",
        addressKey,
      });
    }
    const refused = await authenticate(db, {
      email: org.users.other.email,
      password: FIXTURE_PASSWORD,
      addressKey,
    });
    expect(refused).toMatchObject({
      ok: false,
      limited: true,
      message: expect.stringMatching(/^Too many attempts\. Try again in \d+ minutes?\.$/),
    });
    expect(await otherSignsIn()).toMatchObject({ ok: true });
  });

  it("answers an unknown address exactly like a wrong password", async () => {
    const unknown = await authenticate(db, {
      email: `nobody-${randomUUID()}@fixture.example`,
      password: "x",
      addressKey: `rl-${randomUUID()}`,
    });
    const wrong = await authenticate(db, {
      email: org.users.other.email,
      password: "x",
      addressKey: `rl-${randomUUID()}`,
    });
    expect(unknown).toEqual(wrong);
  });
});

describe("sign-in limit under parallel requests", () => {
  it("25 parallel wrong passwords for one account get at most 5 real password checks", async () => {
    // Its own pool, wide enough that all 25 really run at once against PostgreSQL.
    const wide = new Kysely<Database>({
      dialect: new PostgresDialect({
        pool: new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 25 }),
      }),
    });
    try {
      const email = org.users.parallel.email;
      const outcomes = await Promise.all(
        Array.from({ length: 25 }, () =>
          authenticate(wide, { email, password: "wrong-guess", addressKey: `rl-${randomUUID()}` }),
        ),
      );
      // A limited answer returns before the password is verified; every other answer verified it.
      const checked = outcomes.filter((o) => !o.ok && !o.limited).length;
      expect(checked).toBe(RATE_LIMITS.signInAccount.max);
      expect(outcomes.filter((o) => !o.ok && o.limited)).toHaveLength(25 - RATE_LIMITS.signInAccount.max);
      const rows = await db
        .selectFrom("auth_attempts")
        .select("id")
        .where("kind", "=", RATE_LIMITS.signInAccount.kind)
        .where("key", "=", email)
        .execute();
      expect(rows).toHaveLength(RATE_LIMITS.signInAccount.max);
    } finally {
      await wide.destroy();
    }
  });

  it("a successful sign-in takes back its own attempt, not the earlier failures", async () => {
    const email = org.users.other.email;
    const count = async () =>
      (
        await db
          .selectFrom("auth_attempts")
          .select("id")
          .where("kind", "=", RATE_LIMITS.signInAccount.kind)
          .where("key", "=", email)
          .execute()
      ).length;
    const before = await count();
    await authenticate(db, { email, password: "wrong", addressKey: `rl-${randomUUID()}` });
    expect(await count()).toBe(before + 1);
    expect(
      await authenticate(db, { email, password: FIXTURE_PASSWORD, addressKey: `rl-${randomUUID()}` }),
    ).toMatchObject({ ok: true });
    expect(await count()).toBe(before + 1);
  });
});

describe("reset request rate limits", () => {
  it("per account: the 4th request in 15 minutes is refused and sends nothing", async () => {
    for (let i = 0; i < RATE_LIMITS.resetAccount.max; i += 1) {
      expect(
        await requestPasswordReset(db, { email: org.users.resetter.email, addressKey: `rl-${randomUUID()}` }),
      ).toEqual({ ok: true, message: RESET_REQUESTED });
    }
    const before = await db
      .selectFrom("password_reset_tokens")
      .select("id")
      .where("user_id", "=", org.users.resetter.userId)
      .execute();
    expect(
      await requestPasswordReset(db, { email: org.users.resetter.email, addressKey: `rl-${randomUUID()}` }),
    ).toEqual({ ok: false, message: tooManyAttemptsMessage(15) });
    const after = await db
      .selectFrom("password_reset_tokens")
      .select("id")
      .where("user_id", "=", org.users.resetter.userId)
      .execute();
    expect(after).toHaveLength(before.length);
  });

  it("per address: 20 requests from one address lock it, for unknown addresses too", async () => {
    const addressKey = `rl-${randomUUID()}`;
    for (let i = 0; i < RATE_LIMITS.resetAddress.max; i += 1) {
      await requestPasswordReset(db, {
        email: `ghost-${i}-${randomUUID().slice(0, 6)}@fixture.example`,
        addressKey,
      });
    }
    expect(await requestPasswordReset(db, { email: org.users.other.email, addressKey })).toMatchObject({
      ok: false,
      message: expect.stringMatching(/^Too many attempts/),
    });
  });
});

describe("client address key", () => {
  it("without a trusted proxy takes the address Next's server wrote (the TCP peer), never an inner hop", () => {
    expect(clientAddressKey(new Headers({ "x-forwarded-for": "127.0.0.1" }), 0)).toBe("127.0.0.1");
    expect(clientAddressKey(new Headers(), 0)).toBe("unknown");
  });

  it("behind n trusted proxies takes the n-th entry from the right, so a forged left part is ignored", () => {
    const forged = new Headers({ "x-forwarded-for": "198.51.100.9, 203.0.113.7, 10.0.0.2" });
    expect(clientAddressKey(forged, 1)).toBe("10.0.0.2");
    expect(clientAddressKey(forged, 2)).toBe("203.0.113.7");
    expect(clientAddressKey(new Headers({ "x-forwarded-for": "203.0.113.7" }), 3)).toBe("203.0.113.7");
  });
});
