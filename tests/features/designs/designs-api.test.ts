import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as analysesPost } from "@/app/api/v1/analyses/route";
import {
  DELETE as designDelete,
  GET as designGet,
  PUT as designPut,
} from "@/app/api/v1/designs/[designId]/route";
import { GET as designsGet, POST as designsPost } from "@/app/api/v1/designs/route";
import { GET as schemaGet } from "@/app/api/v1/schema/design/route";
import {
  COVER_TEMPLATE,
  appRequest,
  createOrganizationWithMembers,
  type OrganizationFixture,
} from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";

// The /api/v1 designs handlers called directly with real session cookies.
const db = getTestDb();
let home: OrganizationFixture<"dana" | "piet" | "arlo">;
let foreign: OrganizationFixture<"other">;
const cookies: Record<string, string> = {};
const params = (designId: string) => ({ params: Promise.resolve({ designId }) });

async function createViaApi(name: string, cookie = cookies.dana): Promise<string> {
  const response = await designsPost(
    appRequest("/api/v1/designs", {
      method: "POST",
      cookie,
      body: { name, equipmentTag: "E-2107", template: COVER_TEMPLATE },
    }),
  );
  expect(response.status).toBe(201);
  return (await response.json()).designId;
}

async function readDesign(id: string, cookie = cookies.dana) {
  const response = await designGet(appRequest(`/api/v1/designs/${id}`, { cookie }), params(id));
  return { status: response.status, body: await response.json() };
}

beforeAll(async () => {
  home = await createOrganizationWithMembers(db, {
    dana: ["designer"],
    piet: ["designer"],
    arlo: ["approver"],
  });
  foreign = await createOrganizationWithMembers(db, { other: ["designer", "admin"] });
  for (const key of ["dana", "piet", "arlo"] as const) cookies[key] = await home.cookieFor(key);
  cookies.other = await foreign.cookieFor("other");
});
afterAll(async () => {
  await db.transaction().execute(async (trx) => {
    await sql`alter table design_revisions disable trigger design_revisions_frozen_when_approved`.execute(
      trx,
    );
    await trx
      .deleteFrom("designs")
      .where("organization_id", "in", [home.organizationId, foreign.organizationId])
      .execute();
    await sql`alter table design_revisions enable trigger design_revisions_frozen_when_approved`.execute(trx);
  });
  await home.cleanup();
  await foreign.cleanup();
});

describe("designs API", () => {
  it("signed out is 401 everywhere; an approver may read but not create", async () => {
    expect((await designsGet(appRequest("/api/v1/designs"))).status).toBe(401);
    expect((await schemaGet(appRequest("/api/v1/schema/design"))).status).toBe(401);
    expect((await analysesPost(appRequest("/api/v1/analyses", { method: "POST", body: {} }))).status).toBe(
      401,
    );
    expect((await designsGet(appRequest("/api/v1/designs", { cookie: cookies.arlo }))).status).toBe(200);
    const denied = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: cookies.arlo,
        body: { name: "x", template: COVER_TEMPLATE },
      }),
    );
    expect(denied.status).toBe(403);
    expect(await denied.json()).toEqual({ error: { message: expect.any(String) } });
  });

  it("create, list with query parameters, read, and a foreign organisation gets 404", async () => {
    const id = await createViaApi("API hatch alpha");
    const list = await designsGet(
      appRequest("/api/v1/designs?q=api%20hatch&sort=name", { cookie: cookies.dana }),
    );
    const body = await list.json();
    expect(body.items.map((d: { designId: string }) => d.designId)).toContain(id);
    const read = await readDesign(id);
    expect(read.status).toBe(200);
    expect(read.body).toMatchObject({
      name: "API hatch alpha",
      equipmentTag: "E-2107",
      workingRevision: { number: 1, status: "draft", version: 1 },
    });
    expect(read.body.workingRevision.result.summary.minGasketStressMpa).toBeGreaterThan(0);
    expect((await readDesign(id, cookies.other)).status).toBe(404);
    expect((await readDesign("not-a-uuid")).status).toBe(404);
    const foreignList = await (
      await designsGet(appRequest("/api/v1/designs", { cookie: cookies.other }))
    ).json();
    expect(foreignList.items.map((d: { designId: string }) => d.designId)).not.toContain(id);
  });

  it("bad input in each template field is a 422 naming the field path, and nothing is created", async () => {
    const before = (await (await designsGet(appRequest("/api/v1/designs", { cookie: cookies.dana }))).json())
      .total;
    const cases: [string, unknown][] = [
      ["widthMm", ""],
      ["heightMm", -4],
      ["boltEdgeDistanceMm", 1e12],
      ["boltCount", "sixteen"],
      ["gasketWidthMm", null],
      ["boltEdgeDistanceMm", 5],
    ];
    for (const [field, value] of cases) {
      const response = await designsPost(
        appRequest("/api/v1/designs", {
          method: "POST",
          cookie: cookies.dana,
          body: { name: "Bad", template: { ...COVER_TEMPLATE, [field]: value } },
        }),
      );
      expect(response.status, `${field}=${String(value)}`).toBe(422);
      const { error } = await response.json();
      expect(Object.keys(error.fieldErrors)).toEqual([`template.${field}`]);
    }
    const noName = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: cookies.dana,
        body: { name: "", template: COVER_TEMPLATE },
      }),
    );
    expect((await noName.json()).error.fieldErrors).toHaveProperty("name");
    const notJson = await designsPost(
      new Request(new URL("/api/v1/designs", process.env.APP_URL ?? "http://127.0.0.1:3100"), {
        method: "POST",
        headers: {
          cookie: cookies.dana,
          origin: new URL(process.env.APP_URL ?? "http://127.0.0.1:3100").origin,
        },
        body: "{",
      }),
    );
    expect(notJson.status).toBe(400);
    expect(
      (await (await designsGet(appRequest("/api/v1/designs", { cookie: cookies.dana }))).json()).total,
    ).toBe(before);
  });

  it("a request from a foreign origin is refused", async () => {
    const response = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: cookies.dana,
        origin: "http://evil.example",
        body: { name: "x", template: COVER_TEMPLATE },
      }),
    );
    expect(response.status).toBe(403);
  });

  it("PUT saves with baseVersion; a bolt outside the flange is a 422 at its path and nothing changes", async () => {
    const id = await createViaApi("API put cover");
    const { body } = await readDesign(id);
    const document = body.workingRevision.document;
    const outside = {
      ...document,
      bolts: document.bolts.map((b: { sMm: number }, i: number) => (i === 4 ? { ...b, offPathMm: 300 } : b)),
    };
    const bad = await designPut(
      appRequest(`/api/v1/designs/${id}`, {
        method: "PUT",
        cookie: cookies.dana,
        body: { baseVersion: 1, document: outside },
      }),
      params(id),
    );
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.fieldErrors).toHaveProperty(["document.bolts[4].position"]);
    const good = await designPut(
      appRequest(`/api/v1/designs/${id}`, {
        method: "PUT",
        cookie: cookies.dana,
        body: { baseVersion: 1, document, name: "API put cover, saved" },
      }),
      params(id),
    );
    expect(good.status).toBe(200);
    expect(await good.json()).toMatchObject({ version: 2, savedAt: expect.any(String) });
    expect((await readDesign(id)).body).toMatchObject({
      name: "API put cover, saved",
      workingRevision: { version: 2 },
    });
    const noVersion = await designPut(
      appRequest(`/api/v1/designs/${id}`, { method: "PUT", cookie: cookies.dana, body: { document } }),
      params(id),
    );
    expect((await noVersion.json()).error.fieldErrors).toHaveProperty("baseVersion");
  });

  it("two sessions load the same design and both save: the second is refused with 409 and the first's save is intact", async () => {
    const id = await createViaApi("API concurrent cover");
    const [asDana, asPiet] = await Promise.all([readDesign(id, cookies.dana), readDesign(id, cookies.piet)]);
    expect(asDana.body.workingRevision.version).toBe(asPiet.body.workingRevision.version);
    const danaDoc = {
      ...asDana.body.workingRevision.document,
      loads: { ...asDana.body.workingRevision.document.loads, designPressureMpa: 1.6 },
    };
    const pietDoc = {
      ...asPiet.body.workingRevision.document,
      loads: { ...asPiet.body.workingRevision.document.loads, designPressureMpa: 0.4 },
    };
    const first = await designPut(
      appRequest(`/api/v1/designs/${id}`, {
        method: "PUT",
        cookie: cookies.dana,
        body: { baseVersion: 1, document: danaDoc },
      }),
      params(id),
    );
    expect(first.status).toBe(200);
    const second = await designPut(
      appRequest(`/api/v1/designs/${id}`, {
        method: "PUT",
        cookie: cookies.piet,
        body: { baseVersion: 1, document: pietDoc },
      }),
      params(id),
    );
    expect(second.status).toBe(409);
    const { error } = await second.json();
    expect(error.conflict).toBe(true);
    expect(error.message).toContain(`This design was changed by ${home.users.dana.displayName} at `);
    expect(error.message).toContain(
      "(version 2). Your edits are kept here; reload to see theirs, or copy your changes.",
    );
    const stored = (await readDesign(id, cookies.piet)).body.workingRevision;
    expect(stored.version).toBe(2);
    expect(stored.document.loads.designPressureMpa).toBe(1.6);
  });

  it("simultaneous saves on the same base version: exactly one wins", async () => {
    const id = await createViaApi("API race cover");
    const { body } = await readDesign(id);
    const doc = body.workingRevision.document;
    const responses = await Promise.all(
      ["dana", "piet"].map((who, i) =>
        designPut(
          appRequest(`/api/v1/designs/${id}`, {
            method: "PUT",
            cookie: cookies[who],
            body: { baseVersion: 1, document: { ...doc, loads: { ...doc.loads, designPressureMpa: 1 + i } } },
          }),
          params(id),
        ),
      ),
    );
    expect(responses.map((r) => r.status).sort()).toEqual([200, 409]);
    expect((await readDesign(id)).body.workingRevision.version).toBe(2);
  });

  it("DELETE removes a never-submitted draft (204) and refuses a submitted one (409)", async () => {
    const draft = await createViaApi("API delete draft");
    expect(
      (
        await designDelete(
          appRequest(`/api/v1/designs/${draft}`, { method: "DELETE", cookie: cookies.piet }),
          params(draft),
        )
      ).status,
    ).toBe(403);
    expect(
      (
        await designDelete(
          appRequest(`/api/v1/designs/${draft}`, { method: "DELETE", cookie: cookies.dana }),
          params(draft),
        )
      ).status,
    ).toBe(204);
    expect((await readDesign(draft)).status).toBe(404);
    const submitted = await createViaApi("API delete submitted");
    await db
      .updateTable("design_revisions")
      .set({ status: "in_review", submitted_by: home.users.dana.userId, submitted_at: new Date() })
      .where("design_id", "=", submitted)
      .execute();
    const refused = await designDelete(
      appRequest(`/api/v1/designs/${submitted}`, { method: "DELETE", cookie: cookies.dana }),
      params(submitted),
    );
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.message).toMatch(/never submitted/);
    const frozenPut = await designPut(
      appRequest(`/api/v1/designs/${submitted}`, {
        method: "PUT",
        cookie: cookies.dana,
        body: { baseVersion: 1, document: (await readDesign(submitted)).body.workingRevision.document },
      }),
      params(submitted),
    );
    expect(frozenPut.status).toBe(409);
    expect((await frozenPut.json()).error.message).toBe("This revision is in review and cannot be edited.");
  });

  it("POST /api/v1/analyses returns the core's result for a document and 422 with field paths for a bad one", async () => {
    const id = await createViaApi("API analysis source");
    const document = (await readDesign(id)).body.workingRevision.document;
    const ok = await analysesPost(
      appRequest("/api/v1/analyses", { method: "POST", cookie: cookies.arlo, body: document }),
    );
    expect(ok.status).toBe(200);
    const result = await ok.json();
    expect(result).toEqual((await readDesign(id)).body.workingRevision.result);
    const wrapped = await analysesPost(
      appRequest("/api/v1/analyses", { method: "POST", cookie: cookies.arlo, body: { document } }),
    );
    expect(wrapped.status).toBe(200);
    const bad = await analysesPost(
      appRequest("/api/v1/analyses", {
        method: "POST",
        cookie: cookies.arlo,
        body: { ...document, fastener: { ...document.fastener, holeDiameterMm: "wide" } },
      }),
    );
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.fieldErrors).toHaveProperty(["document.fastener.holeDiameterMm"]);
  });

  it("GET /api/v1/schema/design is the JSON Schema of the document", async () => {
    const response = await schemaGet(appRequest("/api/v1/schema/design", { cookie: cookies.arlo }));
    expect(response.status).toBe(200);
    const schema = await response.json();
    expect(schema.type).toBe("object");
    expect(schema.required).toEqual(expect.arrayContaining(["outline", "bolts", "fastener"]));
  });
});
