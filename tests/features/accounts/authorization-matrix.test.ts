import { describe, expect, it } from "vitest";
import { GET as getMe } from "@/app/api/v1/me/route";
import {
  DELETE as revokeInvitationRoute,
  POST as resendInvitationRoute,
} from "@/app/api/v1/team/invitations/[invitationId]/route";
import {
  DELETE as removeMemberRoute,
  PATCH as patchMemberRoute,
} from "@/app/api/v1/team/members/[userId]/route";
import { GET as getTeamRoute, POST as inviteRoute } from "@/app/api/v1/team/route";
import { createInvitation } from "@/features/accounts/invitations";
import { appRequest, createOrganizationWithMembers } from "../../setup/fixtures";
import { runAuthorizationMatrix, type MatrixContext, type MatrixRow } from "../../setup/authorization-matrix";
import { getTestDb } from "../../setup/test-db";

// Every data route × every kind of viewer: allowed, 401, 403, 404. Other areas add their rows
// here (or run runAuthorizationMatrix in their own suite).
const db = getTestDb();
const params = <T>(value: T) => ({ params: Promise.resolve(value) });

async function throwawayMember(ctx: MatrixContext, org: "home" | "foreign"): Promise<string> {
  const fixture = org === "home" ? ctx.home : ctx.foreign;
  const extra = await createOrganizationWithMembers(db, { spare: ["designer"] });
  // Move the spare user into the target organisation, then drop its own.
  await db
    .insertInto("memberships")
    .values({
      organization_id: fixture.organizationId,
      user_id: extra.users.spare.userId,
      roles: ["designer"],
    })
    .execute();
  await db.deleteFrom("organizations").where("id", "=", extra.organizationId).execute();
  return extra.users.spare.userId;
}

async function openInvitation(ctx: MatrixContext, org: "home" | "foreign"): Promise<string> {
  const fixture = org === "home" ? ctx.home : ctx.foreign;
  const outcome = await createInvitation(db, {
    organizationId: fixture.organizationId,
    invitedBy: null as unknown as string,
    email: `matrix-${crypto.randomUUID().slice(0, 8)}@fixture.example`,
    roles: ["designer"],
  });
  if (!outcome.ok) throw new Error(outcome.message);
  return outcome.invitation.invitationId;
}

export const ACCOUNT_ROWS: MatrixRow[] = [
  {
    name: "GET /api/v1/me",
    call: (_ctx, cookie) => getMe(appRequest("/api/v1/me", { cookie })),
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "GET /api/v1/team",
    call: (_ctx, cookie) => getTeamRoute(appRequest("/api/v1/team", { cookie })),
    expect: { signedOut: 401, member: 403, admin: 200, adminDesigner: 200 },
  },
  {
    name: "POST /api/v1/team (invite)",
    call: (_ctx, cookie) =>
      inviteRoute(
        appRequest("/api/v1/team", {
          method: "POST",
          cookie,
          body: { email: `inv-${crypto.randomUUID().slice(0, 8)}@fixture.example`, roles: ["designer"] },
        }),
      ),
    expect: { signedOut: 401, member: 403, admin: 201, adminDesigner: 201 },
  },
  {
    name: "POST /api/v1/team from another Origin",
    call: (_ctx, cookie) =>
      inviteRoute(
        appRequest("/api/v1/team", {
          method: "POST",
          cookie,
          origin: "https://evil.example",
          body: { email: "x@fixture.example", roles: ["designer"] },
        }),
      ),
    expect: { signedOut: 403, member: 403 },
  },
  {
    name: "PATCH /api/v1/team/members/[home member]",
    call: async (ctx, cookie) =>
      patchMemberRoute(
        appRequest("/x", { method: "PATCH", cookie, body: { roles: ["designer"] } }),
        params({ userId: ctx.home.users.designer.userId }),
      ),
    expect: { signedOut: 401, member: 403, admin: 204, adminDesigner: 204 },
  },
  {
    name: "PATCH /api/v1/team/members/[foreign member]",
    call: async (ctx, cookie) =>
      patchMemberRoute(
        appRequest("/x", { method: "PATCH", cookie, body: { roles: ["approver"] } }),
        params({ userId: ctx.foreign.users.foreignDesigner.userId }),
      ),
    expect: { signedOut: 401, member: 403, admin: 404, adminDesigner: 404 },
  },
  {
    name: "PATCH /api/v1/team/members/[not a uuid]",
    call: async (_ctx, cookie) =>
      patchMemberRoute(
        appRequest("/x", { method: "PATCH", cookie, body: { roles: ["designer"] } }),
        params({ userId: "not-a-uuid" }),
      ),
    expect: { signedOut: 401, member: 403, admin: 404, adminDesigner: 404 },
  },
  {
    name: "DELETE /api/v1/team/members/[home member]",
    call: async (ctx, cookie) =>
      removeMemberRoute(
        appRequest("/x", { method: "DELETE", cookie }),
        params({ userId: await throwawayMember(ctx, "home") }),
      ),
    expect: { signedOut: 401, member: 403, admin: 204, adminDesigner: 204 },
  },
  {
    name: "DELETE /api/v1/team/members/[foreign member]",
    call: async (ctx, cookie) =>
      removeMemberRoute(
        appRequest("/x", { method: "DELETE", cookie }),
        params({ userId: await throwawayMember(ctx, "foreign") }),
      ),
    expect: { signedOut: 401, member: 403, admin: 404, adminDesigner: 404 },
  },
  {
    name: "POST /api/v1/team/invitations/[home invitation] (resend)",
    call: async (ctx, cookie) =>
      resendInvitationRoute(
        appRequest("/x", { method: "POST", cookie }),
        params({ invitationId: await openInvitation(ctx, "home") }),
      ),
    expect: { signedOut: 401, member: 403, admin: 204, adminDesigner: 204 },
  },
  {
    name: "DELETE /api/v1/team/invitations/[home invitation] (revoke)",
    call: async (ctx, cookie) =>
      revokeInvitationRoute(
        appRequest("/x", { method: "DELETE", cookie }),
        params({ invitationId: await openInvitation(ctx, "home") }),
      ),
    expect: { signedOut: 401, member: 403, admin: 204, adminDesigner: 204 },
  },
  {
    name: "DELETE /api/v1/team/invitations/[foreign invitation]",
    call: async (ctx, cookie) =>
      revokeInvitationRoute(
        appRequest("/x", { method: "DELETE", cookie }),
        params({ invitationId: await openInvitation(ctx, "foreign") }),
      ),
    expect: { signedOut: 401, member: 403, admin: 404, adminDesigner: 404 },
  },
];

runAuthorizationMatrix("authorisation matrix: accounts routes", ACCOUNT_ROWS);

describe("nobody reads another organisation's rows", () => {
  it("the team list of one organisation names only its own members and invitations", async () => {
    const a = await createOrganizationWithMembers(db, { boss: ["admin"], worker: ["designer"] });
    const b = await createOrganizationWithMembers(db, { boss: ["admin"], worker: ["designer"] });
    try {
      await createInvitation(db, {
        organizationId: b.organizationId,
        invitedBy: b.users.boss.userId,
        email: `b-only-${b.slug}@fixture.example`,
        roles: ["designer"],
      });
      const response = await getTeamRoute(appRequest("/api/v1/team", { cookie: await a.cookieFor("boss") }));
      const body = (await response.json()) as {
        members: { email: string }[];
        invitations: { email: string }[];
      };
      expect(body.members.map((m) => m.email).sort()).toEqual(
        [a.users.boss.email, a.users.worker.email].sort(),
      );
      expect(JSON.stringify(body)).not.toContain(b.slug);
      const me = (await (
        await getMe(appRequest("/api/v1/me", { cookie: await a.cookieFor("worker") }))
      ).json()) as { organizationId: string };
      expect(me.organizationId).toBe(a.organizationId);
    } finally {
      await a.cleanup();
      await b.cleanup();
    }
  });

  it("the last administrator can neither be demoted nor removed (409), and nothing changes", async () => {
    const a = await createOrganizationWithMembers(db, { boss: ["admin"], worker: ["designer"] });
    try {
      const cookie = await a.cookieFor("boss");
      const demote = await patchMemberRoute(
        appRequest("/x", { method: "PATCH", cookie, body: { roles: ["designer"] } }),
        params({ userId: a.users.boss.userId }),
      );
      expect(demote.status).toBe(409);
      const remove = await removeMemberRoute(
        appRequest("/x", { method: "DELETE", cookie }),
        params({ userId: a.users.boss.userId }),
      );
      expect(remove.status).toBe(409);
      expect(((await remove.json()) as { error: { message: string } }).error.message).toMatch(
        /at least one administrator/,
      );
      const row = await db
        .selectFrom("memberships")
        .select("roles")
        .where("user_id", "=", a.users.boss.userId)
        .executeTakeFirstOrThrow();
      expect(row.roles).toEqual(["admin"]);
    } finally {
      await a.cleanup();
    }
  });
});
