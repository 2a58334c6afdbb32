import { afterAll, beforeAll } from "vitest";
import { POST as analysesPost } from "@/app/api/v1/analyses/route";
import {
  DELETE as designDelete,
  GET as designGet,
  PUT as designPut,
} from "@/app/api/v1/designs/[designId]/route";
import { GET as designResultGet } from "@/app/api/v1/designs/[designId]/result/route";
import { GET as designsGet, POST as designsPost } from "@/app/api/v1/designs/route";
import { GET as schemaGet } from "@/app/api/v1/schema/design/route";
import { POST as suggestionsPost } from "@/app/api/v1/suggestions/route";
import { buildRectangularCover } from "@/features/designs/model/templates";
import { createDesign } from "@/features/designs/mutations";
import { COVER_TEMPLATE, appRequest } from "../../setup/fixtures";
import { runAuthorizationMatrix, type MatrixContext, type MatrixRow } from "../../setup/authorization-matrix";
import { getTestDb } from "../../setup/test-db";

// The designs routes × every kind of viewer. Designs are owned by a spare user outside the
// fixtures, and no row succeeds in writing as a fixture user, so the fixtures' cleanup (which
// deletes their users, then the organisations and with them these designs) stays possible.
const db = getTestDb();
const params = (designId: string) => ({ params: Promise.resolve({ designId }) });
let spareUserId: string;

beforeAll(async () => {
  const spare = await db
    .insertInto("users")
    .values({
      email: `matrix-owner-${crypto.randomUUID().slice(0, 8)}@fixture.example`,
      display_name: "Matrix owner",
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  spareUserId = spare.id;
});
afterAll(async () => {
  await db.deleteFrom("designs").where("owner_id", "=", spareUserId).execute();
  await db.deleteFrom("users").where("id", "=", spareUserId).execute();
});

const document = buildRectangularCover(
  { name: "Matrix cover", equipmentTag: "E-2107", units: "SI" },
  COVER_TEMPLATE,
);

async function designIn(ctx: MatrixContext, org: "home" | "foreign", submitted = false): Promise<string> {
  const organizationId = org === "home" ? ctx.home.organizationId : ctx.foreign.organizationId;
  const { designId } = await createDesign(db, {
    organizationId,
    ownerId: spareUserId,
    name: "Matrix cover",
    equipmentTag: "E-2107",
    document,
  });
  if (submitted)
    await db
      .updateTable("design_revisions")
      .set({ status: "in_review", submitted_by: spareUserId, submitted_at: new Date() })
      .where("design_id", "=", designId)
      .execute();
  return designId;
}

const DESIGNERS = { designer: 0, designerApprover: 0, adminDesigner: 0 };
const forDesigners = (status: number) => Object.fromEntries(Object.keys(DESIGNERS).map((k) => [k, status]));

const DESIGN_ROWS: MatrixRow[] = [
  {
    name: "GET /api/v1/designs",
    call: (_ctx, cookie) => designsGet(appRequest("/api/v1/designs", { cookie })),
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "POST /api/v1/designs (invalid body)",
    call: (_ctx, cookie) =>
      designsPost(appRequest("/api/v1/designs", { method: "POST", cookie, body: { name: "" } })),
    expect: { signedOut: 401, member: 403, ...forDesigners(422) },
  },
  {
    name: "GET /api/v1/designs/[home design]",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "home");
      return designGet(appRequest(`/api/v1/designs/${id}`, { cookie }), params(id));
    },
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "GET /api/v1/designs/[foreign design]",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "foreign");
      return designGet(appRequest(`/api/v1/designs/${id}`, { cookie }), params(id));
    },
    expect: { signedOut: 401, member: 404 },
  },
  {
    name: "GET /api/v1/designs/[home design]/result",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "home");
      return designResultGet(appRequest(`/api/v1/designs/${id}/result`, { cookie }), params(id));
    },
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "GET /api/v1/designs/[foreign design]/result",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "foreign");
      return designResultGet(appRequest(`/api/v1/designs/${id}/result`, { cookie }), params(id));
    },
    expect: { signedOut: 401, member: 404 },
  },
  {
    name: "PUT /api/v1/designs/[home design] (stale baseVersion)",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "home");
      return designPut(
        appRequest(`/api/v1/designs/${id}`, { method: "PUT", cookie, body: { baseVersion: 99, document } }),
        params(id),
      );
    },
    expect: { signedOut: 401, member: 403, ...forDesigners(409) },
  },
  {
    name: "PUT /api/v1/designs/[foreign design]",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "foreign");
      return designPut(
        appRequest(`/api/v1/designs/${id}`, { method: "PUT", cookie, body: { baseVersion: 1, document } }),
        params(id),
      );
    },
    expect: { signedOut: 401, member: 403, ...forDesigners(404) },
  },
  {
    name: "DELETE /api/v1/designs/[home design in review]",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "home", true);
      return designDelete(appRequest(`/api/v1/designs/${id}`, { method: "DELETE", cookie }), params(id));
    },
    expect: { signedOut: 401, member: 403, admin: 409, adminDesigner: 409 },
  },
  {
    name: "DELETE /api/v1/designs/[foreign design]",
    call: async (ctx, cookie) => {
      const id = await designIn(ctx, "foreign");
      return designDelete(appRequest(`/api/v1/designs/${id}`, { method: "DELETE", cookie }), params(id));
    },
    expect: { signedOut: 401, member: 404 },
  },
  {
    name: "POST /api/v1/analyses (invalid document)",
    call: (_ctx, cookie) =>
      analysesPost(appRequest("/api/v1/analyses", { method: "POST", cookie, body: { schemaVersion: 1 } })),
    expect: { signedOut: 401, member: 422 },
  },
  {
    // Stateless: the design travels in the body (no design id to look up), so every signed-in
    // role may search; one size and a small work cap keep the real search short.
    name: "POST /api/v1/suggestions",
    call: (_ctx, cookie) =>
      suggestionsPost(
        appRequest("/api/v1/suggestions", {
          method: "POST",
          cookie,
          body: {
            design: document,
            sizes: [
              { designation: document.fastener.designation, threadSeries: document.fastener.threadSeries },
            ],
            maxAnalyses: 20,
          },
        }),
      ),
    expect: { signedOut: 401, member: 200 },
  },
  {
    name: "POST /api/v1/suggestions (invalid request)",
    call: (_ctx, cookie) =>
      suggestionsPost(
        appRequest("/api/v1/suggestions", { method: "POST", cookie, body: { design: { schemaVersion: 1 } } }),
      ),
    expect: { signedOut: 401, member: 422 },
  },
  {
    name: "GET /api/v1/schema/design",
    call: (_ctx, cookie) => schemaGet(appRequest("/api/v1/schema/design", { cookie })),
    expect: { signedOut: 401, member: 200 },
  },
];

runAuthorizationMatrix("authorisation matrix: designs routes", DESIGN_ROWS);
