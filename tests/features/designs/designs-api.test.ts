import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as analysesPost } from "@/app/api/v1/analyses/route";
import {
  DELETE as designDelete,
  GET as designGet,
  PUT as designPut,
} from "@/app/api/v1/designs/[designId]/route";
import { GET as designResultGet } from "@/app/api/v1/designs/[designId]/result/route";
import { GET as designsGet, POST as designsPost } from "@/app/api/v1/designs/route";
import { findDesign } from "@/features/designs/queries";
import { GET as schemaGet } from "@/app/api/v1/schema/design/route";
import {
  COVER_TEMPLATE,
  appRequest,
  createOrganizationWithMembers,
  type OrganizationFixture,
} from "../../setup/fixtures";
import { getTestDb, deleteWithFrozenGuardOff } from "../../setup/test-db";

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

async function readResult(id: string, cookie = cookies.dana, headers: Record<string, string> = {}) {
  const response = await designResultGet(
    appRequest(`/api/v1/designs/${id}/result`, { cookie, headers }),
    params(id),
  );
  return { status: response.status, etag: response.headers.get("etag"), text: await response.text() };
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
  await deleteWithFrozenGuardOff(async (trx) => {
    await trx
      .deleteFrom("designs")
      .where("organization_id", "in", [home.organizationId, foreign.organizationId])
      .execute();
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

  it("the design read leaves the profiles out, and GET …/result answers the whole stored result the design read used to carry", async () => {
    const id = await createViaApi("API result split");
    // What GET /api/v1/designs/[id] answered before the split: the stored column through JSON.
    const stored = JSON.stringify((await findDesign(db, home.organizationId, id))!.result);
    const whole = await readResult(id, cookies.arlo);
    expect(whole.status).toBe(200);
    const body = JSON.parse(whole.text);
    expect(body).toMatchObject({ designId: id, revisionNumber: 1, version: 1 });
    // Bit for bit: the same numbers and keys in the same order as the stored result.
    expect(JSON.stringify(body.result)).toBe(stored);
    expect(body.result.gasketStress.profile.stressMpa.length).toBeGreaterThan(100);

    const read = await readDesign(id);
    const { profile, ...gasketStress } = JSON.parse(stored).gasketStress;
    expect(profile).toBeDefined();
    expect(read.body.workingRevision.result).toEqual({ ...JSON.parse(stored), gasketStress });
    expect(read.body.workingRevision.result.gasketStress).not.toHaveProperty("profile");
    expect(read.body.workingRevision.resultUrl).toBe(`/api/v1/designs/${id}/result`);
    expect((await readResult(id, cookies.other)).status).toBe(404);
    expect((await readResult("not-a-uuid")).status).toBe(404);
  });

  it("answers 304 without a body when If-None-Match names the current ETag, and 200 once the design changed", async () => {
    const id = await createViaApi("API etag");
    const get = (headers: Record<string, string> = {}) =>
      designGet(appRequest(`/api/v1/designs/${id}`, { cookie: cookies.dana, headers }), params(id));
    const first = await get();
    const etag = first.headers.get("etag")!;
    expect(etag).toMatch(/^W\/"[A-Za-z0-9_-]{43}"$/);
    expect(first.headers.get("cache-control")).toBe("private, no-cache");
    const body = await first.json();

    const again = await get({ "if-none-match": etag });
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
    expect(again.headers.get("etag")).toBe(etag);
    // A list of tags, the strong form of the same tag, and "*" match; another tag does not.
    expect((await get({ "if-none-match": `W/"other", ${etag.slice(2)}` })).status).toBe(304);
    expect((await get({ "if-none-match": "*" })).status).toBe(304);
    expect((await get({ "if-none-match": 'W/"other"' })).status).toBe(200);
    // The same tag signed out is still a 401: the tag never stands in for the session.
    const signedOut = await designGet(
      appRequest(`/api/v1/designs/${id}`, { headers: { "if-none-match": etag } }),
      params(id),
    );
    expect(signedOut.status).toBe(401);

    const document = { ...body.workingRevision.document, name: "API etag, renamed" };
    const saved = await designPut(
      appRequest(`/api/v1/designs/${id}`, {
        method: "PUT",
        cookie: cookies.dana,
        body: { baseVersion: body.workingRevision.version, document },
      }),
      params(id),
    );
    expect(saved.status).toBe(200);
    const changed = await get({ "if-none-match": etag });
    expect(changed.status).toBe(200);
    expect(changed.headers.get("etag")).not.toBe(etag);

    const result = await readResult(id);
    expect(result.etag).toMatch(/^W\//);
    expect((await readResult(id, cookies.dana, { "if-none-match": result.etag! })).status).toBe(304);
  });

  it("POST /api/v1/analyses returns the core's result for a document and 422 with field paths for a bad one", async () => {
    const id = await createViaApi("API analysis source");
    const document = (await readDesign(id)).body.workingRevision.document;
    const ok = await analysesPost(
      appRequest("/api/v1/analyses", { method: "POST", cookie: cookies.arlo, body: document }),
    );
    expect(ok.status).toBe(200);
    const result = await ok.json();
    expect(result).toEqual(JSON.parse((await readResult(id)).text).result);
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
