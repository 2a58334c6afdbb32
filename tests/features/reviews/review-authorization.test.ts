import { randomUUID } from "node:crypto";
import { afterAll } from "vitest";
import { GET as getDesk } from "@/app/api/v1/desk/route";
import { GET as getRevisions } from "@/app/api/v1/designs/[designId]/revisions/route";
import { GET as getRevision } from "@/app/api/v1/designs/[designId]/revisions/[number]/route";
import { appRequest } from "../../setup/fixtures";
import { runAuthorizationMatrix, type MatrixContext, type MatrixRow } from "../../setup/authorization-matrix";
import { getTestDb } from "../../setup/test-db";
import { createSampleDesign } from "./helpers";

// The review routes in the shared authorisation matrix: every viewer kind, signed out → 401,
// any member of the organisation → 200, another organisation's design or a bad id → 404.
const db = getTestDb();
const params = <T>(value: T) => ({ params: Promise.resolve(value) });
const owners: string[] = [];
const designs = new Map<string, Promise<string>>();

/** One design per organisation, owned by a user of this suite (so the fixture's cleanup can drop its users). */
function designOf(ctx: MatrixContext, org: "home" | "foreign"): Promise<string> {
  const organizationId = (org === "home" ? ctx.home : ctx.foreign).organizationId;
  let id = designs.get(organizationId);
  if (!id) {
    id = (async () => {
      const user = await db
        .insertInto("users")
        .values({
          email: `rv-owner-${randomUUID().slice(0, 8)}@fixture.example`,
          display_name: "Review owner",
          password_hash: null,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      owners.push(user.id);
      await db
        .insertInto("memberships")
        .values({ organization_id: organizationId, user_id: user.id, roles: ["designer"] })
        .execute();
      return (await createSampleDesign(organizationId, user.id, "Matrix cover")).designId;
    })();
    designs.set(organizationId, id);
  }
  return id;
}

afterAll(async () => {
  // The fixture cleanup has dropped the organisations (and with them the designs) by now.
  if (owners.length) await db.deleteFrom("users").where("id", "in", owners).execute();
});

const REVIEW_ROWS: MatrixRow[] = [
  {
    name: "GET /api/v1/desk",
    call: (_ctx, cookie) => getDesk(appRequest("/api/v1/desk", { cookie })),
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "GET /api/v1/designs/[home design]/revisions",
    call: async (ctx, cookie) =>
      getRevisions(appRequest("/x", { cookie }), params({ designId: await designOf(ctx, "home") })),
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "GET /api/v1/designs/[foreign design]/revisions",
    call: async (ctx, cookie) =>
      getRevisions(appRequest("/x", { cookie }), params({ designId: await designOf(ctx, "foreign") })),
    expect: { signedOut: 401, member: 404 },
  },
  {
    name: "GET /api/v1/designs/[home design]/revisions/1",
    call: async (ctx, cookie) =>
      getRevision(
        appRequest("/x", { cookie }),
        params({ designId: await designOf(ctx, "home"), number: "1" }),
      ),
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "GET /api/v1/designs/[foreign design]/revisions/1",
    call: async (ctx, cookie) =>
      getRevision(
        appRequest("/x", { cookie }),
        params({ designId: await designOf(ctx, "foreign"), number: "1" }),
      ),
    expect: { signedOut: 401, member: 404 },
  },
  {
    name: "GET /api/v1/designs/[not a uuid]/revisions/abc",
    call: async (_ctx, cookie) =>
      getRevision(appRequest("/x", { cookie }), params({ designId: "not-a-uuid", number: "abc" })),
    expect: { signedOut: 401, member: 404 },
  },
];

runAuthorizationMatrix("authorisation matrix: review routes", REVIEW_ROWS);
