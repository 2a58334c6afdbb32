import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PUT as designPut } from "@/app/api/v1/designs/[designId]/route";
import { POST as designsPost } from "@/app/api/v1/designs/route";
import { POST as suggestionsPost } from "@/app/api/v1/suggestions/route";
import { listActivity } from "@/features/activity/queries";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { PatternCandidate, SuggestionResult } from "@/features/analysis/core/suggest/search";
import { judge, ruleOf } from "@/features/analysis/core/suggest/verdict";
import {
  COVER_TEMPLATE,
  appRequest,
  createOrganizationWithMembers,
  type OrganizationFixture,
} from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";
import { circularFlange, rectangularCover } from "../analysis/core/fixtures";

// POST /api/v1/suggestions called with a real session (real PostgreSQL) and the real analysis
// pool: a valid request gets ranked candidates, each of which passes every check when the core
// analyses it again here; an impossible one gets the sentence naming the rule that blocks it.
const db = getTestDb();
let org: OrganizationFixture<"dana" | "piet">;
let dana: string;
const M = (...names: string[]) =>
  names.map((designation) => ({ designation, threadSeries: "metric-coarse" as const }));
const post = (body: unknown, cookie: string = dana) =>
  suggestionsPost(appRequest("/api/v1/suggestions", { method: "POST", cookie, body }));

beforeAll(async () => {
  org = await createOrganizationWithMembers(db, { dana: ["designer"], piet: ["approver"] });
  dana = await org.cookieFor("dana");
});
afterAll(async () => {
  await db.deleteFrom("designs").where("organization_id", "=", org.organizationId).execute();
  await org.cleanup();
});

describe("POST /api/v1/suggestions", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });

  it("answers a valid request with ranked candidates that each pass every check", async () => {
    const response = await post({ design, sizes: M("M12", "M16", "M24") });
    expect(response.status).toBe(200);
    expect(response.headers.get("cache-control")).toBe("private, no-store");
    const result = (await response.json()) as SuggestionResult;
    expect(result.message).toBeNull();
    expect(result.candidates.length).toBeGreaterThan(0);
    expect(result.candidates.map((c) => c.rank)).toEqual(result.candidates.map((_, i) => i + 1));
    const counts = result.candidates.map((c) => c.boltCount);
    expect([...counts].sort((a, b) => a - b)).toEqual(counts);
    for (const c of result.candidates as PatternCandidate[]) {
      const a = analyzeJoint(c.design);
      expect(a.checks.filter((x) => x.status === "fail").map((x) => x.id)).toEqual([]);
      expect(judge(a.checks, { pipePattern: false }).blocking.map((x) => x.id)).toEqual([]);
      for (const x of a.checks)
        if (x.status === "warn" || x.status === "accepted-by-rating")
          expect(c.carried).toContain(ruleOf(x.id));
      expect(a.bolts.length).toBe(c.boltCount);
      expect(c.governing).not.toBeNull();
    }
  });

  it("any member may ask (an approver too); signed out is a 401", async () => {
    const response = await post({ design, sizes: M("M16") }, await org.cookieFor("piet"));
    expect(response.status).toBe(200);
    expect((await post({ design }, "")).status).toBe(401);
  });

  it("an impossible request names the rule that blocks it", async () => {
    const soft = structuredClone(design);
    soft.gasket.material = { ...soft.gasket.material, qMinMpa: 150 };
    const response = await post({ design: soft, sizes: M("M20", "M24", "M30", "M36") });
    expect(response.status).toBe(200);
    const result = (await response.json()) as SuggestionResult;
    expect(result.candidates).toEqual([]);
    expect(result.message).toMatch(/^No size up to M36 seats the gasket at \d+(\.\d)? mm pitch/);
    expect(result.blocked.every((b) => b.rule === "gasket.seating")).toBe(true);
  });

  it("bad input is a 422 naming each field, from the schema or from the search's own checks", async () => {
    const typo = await post({ design, sizez: M("M16") });
    expect(typo.status).toBe(422);
    expect(JSON.stringify(await typo.json())).toMatch(/sizez/);

    const response = await post({
      design,
      sizes: M("M17"),
      fixedBoltIds: ["b99"],
      keepOuts: [{ kind: "parameter", from: 0.1, to: 0.2, label: "nozzle\u0000N1" }],
    });
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(Object.keys(body.error.fieldErrors)).toEqual(["keepOuts[0].label"]);

    const unknown = await post({ design, sizes: M("M17"), fixedBoltIds: ["b99"] });
    expect(unknown.status).toBe(422);
    const fields = (await unknown.json()).error.fieldErrors;
    expect(fields["sizes[0]"][0]).toMatch(/no metric-coarse thread "M17"/);
    expect(fields["fixedBoltIds[0]"][0]).toMatch(/no bolt "b99"/);

    const capped = await post({ design, maxAnalyses: 5000 });
    expect(capped.status).toBe(422);
    expect((await capped.json()).error.fieldErrors.maxAnalyses[0]).toMatch(/at most 2000/);
  });
});

describe("POST /api/v1/suggestions with stocked bolting", () => {
  const design = rectangularCover({ widthMm: 500, heightMm: 340, boltCount: 16, coverThicknessMm: 40 });
  // Invented Stockroom rows (our own demo data): a low-yield stud stock of this organisation and
  // a row of another organisation, which this caller may not use.
  const yard = {
    name: "Halden Creek yard stud stock",
    modulus_mpa: 200_000,
    ranges: JSON.stringify([
      { maxDiameterMm: 48, proofMpa: null, yieldMpa: 250, tensileMpa: 420, allowableMpa: null },
    ]),
    source: "Kestrel Ridge stores test certificate KR-0042 (demo data)",
  };
  let own: string;
  let foreign: string;
  let other: OrganizationFixture<"olga">;
  beforeAll(async () => {
    other = await createOrganizationWithMembers(db, { olga: ["designer"] });
    own = (
      await db
        .insertInto("library_bolting")
        .values({ organization_id: org.organizationId, ...yard })
        .returning("id")
        .executeTakeFirstOrThrow()
    ).id;
    foreign = (
      await db
        .insertInto("library_bolting")
        .values({ organization_id: other.organizationId, ...yard, name: "Elsewhere studs" })
        .returning("id")
        .executeTakeFirstOrThrow()
    ).id;
  });
  afterAll(async () => {
    await db.deleteFrom("library_bolting").where("id", "in", [own, foreign]).execute();
    await other.cleanup();
  });

  it("a stocked row's values decide: the size that qualifies with B7 fails the bolt stress check with the weaker stock", async () => {
    // 50 ksi on the root area with the torque scatter: below B7's yield, above the stock's 250 MPa.
    const flange = circularFlange({ boltCount: 8, flangeThicknessMm: 40 });
    const sizes = [{ designation: "3/4", threadSeries: "unc" as const }];
    const ask = (materialIds: string[]) =>
      post({ design: flange, sizes, materialIds, allowLayoutWarnings: true }).then(async (r) => {
        expect(r.status).toBe(200);
        return (await r.json()) as SuggestionResult;
      });
    const b7 = await ask(["builtin:astm-a193-b7"]);
    expect(b7.candidates.length).toBeGreaterThan(0);
    const stocked = await ask([`org:${own}`]);
    expect(stocked.candidates).toEqual([]);
    expect(stocked.blocked.map((b) => b.rule)).toEqual(["bolt.assembly-stress-max"]);
  });

  it("candidates of a stocked row carry its values, pass every check and keep them when saved", async () => {
    const response = await post({ design, sizes: M("M16", "M20"), materialIds: [`org:${own}`] });
    expect(response.status).toBe(200);
    const result = (await response.json()) as SuggestionResult;
    expect(result.candidates.length).toBeGreaterThan(0);
    for (const c of result.candidates) {
      expect(c.materialId).toBe(`org:${own}`);
      expect(c.materialName).toBe(yard.name);
      expect(c.design.fastener.stockedMaterial).toMatchObject({ name: yard.name, modulusMpa: 200_000 });
      const a = analyzeJoint(c.design);
      expect(a.fastener.yieldMpa).toBe(250);
      expect(a.checks.filter((x) => x.status === "fail").map((x) => x.id)).toEqual([]);
      expect(judge(a.checks, { pipePattern: false }).blocking.map((x) => x.id)).toEqual([]);
    }
    const created = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: dana,
        body: { name: "Stocked cover", equipmentTag: "HC-E-302", template: COVER_TEMPLATE },
      }),
    );
    const { designId } = await created.json();
    const saved = await designPut(
      appRequest(`/api/v1/designs/${designId}`, {
        method: "PUT",
        cookie: dana,
        body: {
          document: result.candidates[0].design,
          baseVersion: 1,
          patternOrigin: { suggestion: 1, of: 1 },
        },
      }),
      { params: Promise.resolve({ designId }) },
    );
    expect(saved.status).toBe(200);
    const stored = await db
      .selectFrom("design_revisions")
      .select("document")
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    expect(stored.document.fastener.materialId).toBe(`org:${own}`);
    expect(stored.document.fastener.stockedMaterial?.ranges[0].yieldMpa).toBe(250);
  });

  it("another organisation's row, an unknown id and rows in the body are 422s naming them", async () => {
    const theirs = await post({ design, sizes: M("M16"), materialIds: ["iso-898-1-8.8", `org:${foreign}`] });
    expect(theirs.status).toBe(422);
    const body = await theirs.json();
    expect(body.error.message).toBe(`Unknown Stockroom bolting row: org:${foreign}.`);
    expect(body.error.fieldErrors["materialIds[1]"][0]).toBe(
      `no bolting row "org:${foreign}" in your organisation's Stockroom`,
    );
    const none = await post({ design, sizes: M("M16"), materialIds: ["org:not-a-row"] });
    expect(none.status).toBe(422);
    expect((await none.json()).error.fieldErrors["materialIds[0]"][0]).toMatch(
      /no bolting row "org:not-a-row"/,
    );
    const smuggled = await post({
      design,
      sizes: M("M16"),
      stockedBolting: [{ id: "org:x", material: { ...yard, modulusMpa: 1 } }],
    });
    expect(smuggled.status).toBe(422);
    expect(JSON.stringify(await smuggled.json())).toMatch(/stockedBolting/);
  });
});

describe("a save of a pattern applied from a suggestion", () => {
  it("records its origin in the design activity, as its own entry; a bad origin is a 422 and nothing is saved", async () => {
    const created = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: dana,
        body: { name: "Suggested cover", equipmentTag: "HC-E-301", template: COVER_TEMPLATE },
      }),
    );
    expect(created.status).toBe(201);
    const { designId } = await created.json();
    const stored = await db
      .selectFrom("design_revisions")
      .select("document")
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    const put = (body: Record<string, unknown>) =>
      designPut(
        appRequest(`/api/v1/designs/${designId}`, {
          method: "PUT",
          cookie: dana,
          body: { document: stored.document, ...body },
        }),
        { params: Promise.resolve({ designId }) },
      );
    const bad = await put({ baseVersion: 1, patternOrigin: { suggestion: 8, of: 7 } });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(await bad.json())).toContain(
      "suggestion must not exceed the number of suggestions",
    );
    expect((await put({ baseVersion: 1 })).status).toBe(200);
    // A plain save right after is folded into the burst; the applied pattern is not.
    expect((await put({ baseVersion: 2, patternOrigin: { suggestion: 2, of: 7 } })).status).toBe(200);
    const details = (await listActivity(db, org.organizationId, designId)).map(
      (e) => `${e.kind}: ${e.detail}`,
    );
    expect(details).toContain("saved: version 3 · pattern applied from suggestion 2 of 7");
    expect(details.filter((d) => d.startsWith("saved"))).toHaveLength(2);
  });
});
