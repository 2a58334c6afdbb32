import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { authenticate } from "@/features/accounts/credentials";
import {
  acceptInvitation,
  createInvitation,
  INVITATION_MESSAGES,
  renewInvitation,
  revokeInvitation,
  viewInvitation,
} from "@/features/accounts/invitations";
import {
  getResetTokenState,
  requestPasswordReset,
  RESET_REQUESTED,
  RESET_TOKEN_MESSAGES,
  resetPassword,
} from "@/features/accounts/password-reset";
import { getLucia } from "@/server/auth/lucia";
import { hashToken } from "@/server/auth/tokens";
import {
  createOrganizationWithMembers,
  FIXTURE_PASSWORD,
  type OrganizationFixture,
} from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";
import { linkIn, messagesTo } from "./outbox";

const db = getTestDb();
let org: OrganizationFixture<"admin" | "dana">;
const createdEmails: string[] = [];
const address = () => `addr-${randomUUID()}`;

beforeAll(async () => {
  org = await createOrganizationWithMembers(db, { admin: ["admin"], dana: ["designer"] });
});
afterAll(async () => {
  if (createdEmails.length) await db.deleteFrom("users").where("email", "in", createdEmails).execute();
  await org.cleanup();
});

function inviteeEmail(): string {
  const email = `invitee-${randomUUID().slice(0, 8)}@fixture.example`;
  createdEmails.push(email);
  return email;
}

describe("invitations", () => {
  it("stores only the sha-256 of the token, and accepting creates the user and the membership once", async () => {
    const email = inviteeEmail();
    const issued = await createInvitation(db, {
      organizationId: org.organizationId,
      invitedBy: org.users.admin.userId,
      email,
      roles: ["approver", "designer"],
    });
    expect(issued.ok).toBe(true);
    if (!issued.ok) return;
    const row = await db
      .selectFrom("invitations")
      .selectAll()
      .where("id", "=", issued.invitation.invitationId)
      .executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashToken(issued.invitation.token));
    expect(JSON.stringify(row)).not.toContain(issued.invitation.token);
    expect(await viewInvitation(db, issued.invitation.token)).toMatchObject({
      state: "open",
      email,
      roles: ["designer", "approver"],
      hasAccount: false,
    });

    const accepted = await acceptInvitation(db, {
      token: issued.invitation.token,
      displayName: "Noor Haddad",
      password: "a-fresh-password",
    });
    expect(accepted).toMatchObject({ ok: true, organizationId: org.organizationId });
    const membership = await db
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .select(["memberships.roles", "users.display_name"])
      .where("users.email", "=", email)
      .executeTakeFirstOrThrow();
    expect(membership).toEqual({ roles: ["designer", "approver"], display_name: "Noor Haddad" });
    expect(
      await authenticate(db, { email, password: "a-fresh-password", addressKey: address() }),
    ).toMatchObject({ ok: true, organizationId: org.organizationId });

    // Reused token: refused, changes nothing.
    const again = await acceptInvitation(db, {
      token: issued.invitation.token,
      displayName: "Someone Else",
      password: "another-password",
    });
    expect(again).toEqual({ ok: false, message: INVITATION_MESSAGES.used });
    expect(
      (
        await db
          .selectFrom("users")
          .select("display_name")
          .where("email", "=", email)
          .executeTakeFirstOrThrow()
      ).display_name,
    ).toBe("Noor Haddad");
  });

  it("refuses an expired invitation and creates no user", async () => {
    const email = inviteeEmail();
    const past = new Date(Date.now() - 8 * 86_400_000);
    const issued = await createInvitation(
      db,
      { organizationId: org.organizationId, invitedBy: org.users.admin.userId, email, roles: ["designer"] },
      past,
    );
    if (!issued.ok) throw new Error("invite failed");
    expect(await viewInvitation(db, issued.invitation.token)).toEqual({ state: "expired" });
    expect(
      await acceptInvitation(db, {
        token: issued.invitation.token,
        displayName: "Late",
        password: "late-password-1",
      }),
    ).toEqual({ ok: false, message: INVITATION_MESSAGES.expired });
    expect(
      await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirst(),
    ).toBeUndefined();
  });

  it("refuses unknown, revoked and superseded links; resend replaces the link", async () => {
    expect(
      await acceptInvitation(db, { token: "x".repeat(43), displayName: "X", password: "whatever-long" }),
    ).toEqual({ ok: false, message: INVITATION_MESSAGES.unknown });
    const email = inviteeEmail();
    const first = await createInvitation(db, {
      organizationId: org.organizationId,
      invitedBy: org.users.admin.userId,
      email,
      roles: ["designer"],
    });
    if (!first.ok) throw new Error("invite failed");
    const renewed = await renewInvitation(db, org.organizationId, first.invitation.invitationId);
    expect(renewed?.invitationId).toBe(first.invitation.invitationId);
    expect(await viewInvitation(db, first.invitation.token)).toEqual({ state: "unknown" });
    expect(await revokeInvitation(db, org.organizationId, renewed!.invitationId)).toBe(true);
    expect(
      await acceptInvitation(db, { token: renewed!.token, displayName: "R", password: "revoked-password" }),
    ).toEqual({ ok: false, message: INVITATION_MESSAGES.used });
    // Another organisation cannot touch it.
    expect(await renewInvitation(db, randomUUID(), first.invitation.invitationId)).toBeNull();
  });

  it("an existing account confirms its own password and gains the membership", async () => {
    const other = await createOrganizationWithMembers(db, { outsider: ["designer"] });
    try {
      const email = other.users.outsider.email;
      const issued = await createInvitation(db, {
        organizationId: org.organizationId,
        invitedBy: org.users.admin.userId,
        email,
        roles: ["approver"],
      });
      if (!issued.ok) throw new Error("invite failed");
      expect(await viewInvitation(db, issued.invitation.token)).toMatchObject({ hasAccount: true });
      const wrong = await acceptInvitation(db, {
        token: issued.invitation.token,
        password: "not-the-password",
      });
      expect(wrong.ok).toBe(false);
      expect(
        await acceptInvitation(db, { token: issued.invitation.token, password: FIXTURE_PASSWORD }),
      ).toMatchObject({ ok: true });
      const count = await db
        .selectFrom("memberships")
        .select("organization_id")
        .where("user_id", "=", other.users.outsider.userId)
        .execute();
      expect(count).toHaveLength(2);
    } finally {
      await other.cleanup();
    }
  });

  it("refuses to invite someone who is already a member", async () => {
    const outcome = await createInvitation(db, {
      organizationId: org.organizationId,
      invitedBy: org.users.admin.userId,
      email: org.users.dana.email,
      roles: ["approver"],
    });
    expect(outcome).toMatchObject({ ok: false, message: "This person is already a member." });
  });
});

describe("password reset tokens", () => {
  it("e-mails a single-use link for a known address, answers the same for an unknown one", async () => {
    const unknown = await requestPasswordReset(db, {
      email: `nobody-${randomUUID()}@fixture.example`,
      addressKey: address(),
    });
    expect(unknown).toEqual({ ok: true, message: RESET_REQUESTED });

    const known = await requestPasswordReset(db, { email: org.users.dana.email, addressKey: address() });
    expect(known).toEqual({ ok: true, message: RESET_REQUESTED });
    const mail = (await messagesTo(org.users.dana.email)).at(-1)!;
    expect(mail.subject).toBe("Reset your Sealpitch password");
    const token = linkIn(mail, "/reset-password").split("/").at(-1)!;
    expect(await getResetTokenState(db, token)).toBe("valid");
    const stored = await db
      .selectFrom("password_reset_tokens")
      .select("token_hash")
      .where("user_id", "=", org.users.dana.userId)
      .execute();
    expect(stored.map((r) => r.token_hash)).toContain(hashToken(token));
    expect(JSON.stringify(stored)).not.toContain(token);

    const session = await getLucia().createSession(org.users.dana.userId, {
      active_organization_id: org.organizationId,
    });
    expect(await resetPassword(db, { token, password: "brand-new-password" })).toMatchObject({ ok: true });
    expect(
      await authenticate(db, {
        email: org.users.dana.email,
        password: "brand-new-password",
        addressKey: address(),
      }),
    ).toMatchObject({ ok: true });
    // Reset ends every session of the account.
    expect((await getLucia().validateSession(session.id)).session).toBeNull();
    // Single use.
    expect(await resetPassword(db, { token, password: "a-third-password" })).toEqual({
      ok: false,
      message: RESET_TOKEN_MESSAGES.used,
    });
    expect(
      await authenticate(db, {
        email: org.users.dana.email,
        password: "a-third-password",
        addressKey: address(),
      }),
    ).toMatchObject({ ok: false });
  });

  it("refuses an expired link and leaves the password as it was", async () => {
    const past = new Date(Date.now() - 2 * 3_600_000);
    await requestPasswordReset(db, { email: org.users.admin.email, addressKey: address() }, past);
    const token = linkIn((await messagesTo(org.users.admin.email)).at(-1)!, "/reset-password")
      .split("/")
      .at(-1)!;
    expect(await getResetTokenState(db, token)).toBe("expired");
    expect(await resetPassword(db, { token, password: "too-late-password" })).toEqual({
      ok: false,
      message: RESET_TOKEN_MESSAGES.expired,
    });
    expect(
      await authenticate(db, {
        email: org.users.admin.email,
        password: FIXTURE_PASSWORD,
        addressKey: address(),
      }),
    ).toMatchObject({ ok: true });
  });
});
