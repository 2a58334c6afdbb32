import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { POST as analysesPost } from "@/app/api/v1/analyses/route";
import { PUT as designPut } from "@/app/api/v1/designs/[designId]/route";
import { POST as designsPost } from "@/app/api/v1/designs/route";
import { POST as gasketCsvPost } from "@/app/api/v1/library/gaskets/csv/route";
import { POST as suggestionsPost } from "@/app/api/v1/suggestions/route";
import { POST as teamPost } from "@/app/api/v1/team/route";
import * as accountSchemas from "@/features/accounts/schema";
import * as analysisSchemas from "@/features/analysis/schema";
import * as designSchemas from "@/features/designs/schema";
import * as templateSchemas from "@/features/designs/template-schema";
import * as importSchemas from "@/features/imports/schema";
import * as librarySchemas from "@/features/library/schema";
import * as reviewSchemas from "@/features/reviews/schema";
import { MULTI_LINE_TEXT, SINGLE_LINE_TEXT } from "@/features/forms/plain-text";
import { MAX_JSON_DEPTH, jsonNestingDepth } from "@/server/http/request-body";
import {
  COVER_TEMPLATE,
  appRequest,
  createOrganizationWithMembers,
  type OrganizationFixture,
} from "../setup/fixtures";
import { getTestDb } from "../setup/test-db";
import { countOrgRows } from "../setup/suite-org";

// No input may end in a 500: NUL and other control characters in text, deep JSON and huge
// bodies each get a clear 4xx with a message, and nothing is stored.
const db = getTestDb();
let org: OrganizationFixture<"dana" | "ines">;
let dana: string;
let ines: string;

const countDesigns = () => countOrgRows("designs", org.organizationId);

const rawRequest = (path: string, body: BodyInit, headers: Record<string, string> = {}) =>
  new Request(new URL(path, process.env.APP_URL ?? "http://127.0.0.1:3100"), {
    method: "POST",
    headers: {
      cookie: dana,
      origin: new URL(process.env.APP_URL ?? "http://127.0.0.1:3100").origin,
      "content-type": "application/json",
      ...headers,
    },
    body,
    duplex: "half",
  } as RequestInit);

beforeAll(async () => {
  org = await createOrganizationWithMembers(db, { dana: ["designer"], ines: ["admin", "designer"] });
  dana = await org.cookieFor("dana");
  ines = await org.cookieFor("ines");
});
afterAll(async () => {
  // Only drafts were created here, so the frozen-revision trigger has nothing to refuse.
  await db.deleteFrom("designs").where("organization_id", "=", org.organizationId).execute();
  await org.cleanup();
});

describe("control characters in text get a field message and store nothing", () => {
  it("a NUL in a design name (POST /api/v1/designs) is a 422 naming the field", async () => {
    const before = await countDesigns();
    const response = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: dana,
        body: { name: "Channel cover\u0000E-2107", equipmentTag: "E-2107", template: COVER_TEMPLATE },
      }),
    );
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.error.fieldErrors.name[0]).toBe(
      "Remove the control character U+0000 (NUL): text may not hold control characters.",
    );
    expect(await countDesigns()).toBe(before);
  });

  it("a NUL or an escape character inside the saved document is a 422 naming its path", async () => {
    const created = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: dana,
        body: { name: "Clean", template: COVER_TEMPLATE },
      }),
    );
    expect(created.status).toBe(201);
    const { designId } = await created.json();
    const stored = await db
      .selectFrom("design_revisions")
      .select(["document", "version"])
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    const document = stored.document as { gasket: { material: { source: string } }; name: string };
    for (const [bad, field] of [
      [{ ...document, name: "Cover\u0000" }, "document.name"],
      [
        {
          ...document,
          gasket: { ...document.gasket, material: { ...document.gasket.material, source: "a\u001bb" } },
        },
        "document.gasket.material.source",
      ],
    ] as const) {
      const response = await designPut(
        appRequest(`/api/v1/designs/${designId}`, {
          method: "PUT",
          cookie: dana,
          body: { baseVersion: stored.version, document: bad },
        }),
        { params: Promise.resolve({ designId }) },
      );
      expect(response.status, field).toBe(422);
      const text = JSON.stringify(await response.json());
      expect(text).toContain(field);
      expect(text).toContain("Remove the control character");
    }
    const after = await db
      .selectFrom("design_revisions")
      .select("version")
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    expect(after.version).toBe(stored.version);
  });

  it("a CSV cell with a NUL is refused with its row and field, nothing imported", async () => {
    const csv = [
      "name,gasket_type,m,y_mpa,modulus_mpa,thickness_mm,source",
      "NUL ring,graphite,2,15,1200,2,Report\u0000A",
      "NUL number ring,graphite,2\u0000,15,1200,2,Report B",
    ].join("\n");
    const response = await gasketCsvPost(
      new Request(new URL("/api/v1/library/gaskets/csv?step=commit", process.env.APP_URL), {
        method: "POST",
        headers: { cookie: ines, origin: new URL(process.env.APP_URL!).origin, "content-type": "text/csv" },
        body: csv,
      }),
    );
    expect(response.status).toBe(422);
    const body = await response.json();
    expect(body.ok).toBe(false);
    expect(body.errors).toEqual([
      {
        line: 2,
        field: "source",
        message: "Remove the control character U+0000 (NUL): text may not hold control characters.",
      },
      { line: 3, field: "m", message: "must be a number" },
    ]);
    const stored = await db
      .selectFrom("library_gaskets")
      .select("id")
      .where("organization_id", "=", org.organizationId)
      .execute();
    expect(stored).toEqual([]);
  });

  it("single-line fields refuse line breaks and C1 controls; multi-line fields keep line breaks", () => {
    const name = accountSchemas.signUpSchema.safeParse({
      displayName: "Ines\u0085Admin",
      email: "ines@example.com",
      organizationName: "Kestrel Ridge",
      password: "long-enough-pass",
      confirmPassword: "long-enough-pass",
    });
    expect(name.success).toBe(false);
    expect(name.error?.issues[0]).toMatchObject({
      path: ["displayName"],
      message: expect.stringContaining("U+0085"),
    });
    const designId = "4f1f7f7e-3a55-4d0d-9d52-8d3c7a1e2b10";
    expect(
      reviewSchemas.returnRevisionSchema.safeParse({
        designId,
        number: 1,
        comment: "Line one\nline two\tend",
      }).success,
    ).toBe(true);
    expect(
      reviewSchemas.returnRevisionSchema.safeParse({ designId, number: 1, comment: "bell\u0007" }).success,
    ).toBe(false);
  });

  it("every text field of every input schema carries the shared control-character rule", () => {
    const missing: string[] = [];
    let checked = 0;
    const walk = (schema: z.core.$ZodType, path: string, seen: Set<unknown>) => {
      if (seen.has(schema)) return;
      seen.add(schema);
      const def = schema._zod.def as unknown as Record<string, unknown> & { type: string };
      switch (def.type) {
        case "string": {
          if (def.format) return; // uuid, email…: a fixed pattern with no room for controls
          const checks = (def.checks ?? []) as { _zod: { def: { pattern?: RegExp } } }[];
          const ok = checks.some(
            (c) => c._zod.def.pattern === SINGLE_LINE_TEXT || c._zod.def.pattern === MULTI_LINE_TEXT,
          );
          checked++;
          if (!ok) missing.push(path);
          return;
        }
        case "object":
          for (const [key, value] of Object.entries(def.shape as Record<string, z.core.$ZodType>))
            walk(value, `${path}.${key}`, seen);
          return;
        case "array":
          return walk(def.element as z.core.$ZodType, `${path}[]`, seen);
        case "record":
          walk(def.keyType as z.core.$ZodType, `${path}{key}`, seen);
          return walk(def.valueType as z.core.$ZodType, `${path}{value}`, seen);
        case "union":
          return (def.options as z.core.$ZodType[]).forEach((o, i) => walk(o, `${path}|${i}`, seen));
        case "intersection":
          walk(def.left as z.core.$ZodType, path, seen);
          return walk(def.right as z.core.$ZodType, path, seen);
        case "pipe":
          walk(def.in as z.core.$ZodType, path, seen);
          return walk(def.out as z.core.$ZodType, path, seen);
        case "optional":
        case "nullable":
        case "default":
        case "prefault":
        case "catch":
        case "readonly":
        case "nonoptional":
          return walk(def.innerType as z.core.$ZodType, path, seen);
        default:
          return;
      }
    };
    const modules = {
      accountSchemas,
      analysisSchemas,
      designSchemas,
      templateSchemas,
      importSchemas,
      librarySchemas,
      reviewSchemas,
    };
    for (const [moduleName, exports] of Object.entries(modules))
      for (const [name, value] of Object.entries(exports))
        if (value instanceof z.ZodType) walk(value, `${moduleName}.${name}`, new Set());
    expect(missing).toEqual([]);
    expect(checked).toBeGreaterThan(40); // the walk reaches the text fields (it can fail)
  });
});

describe("work limits of one analysis", () => {
  it("a 2048² grid is a 422 naming the limit (bolts × samples: tests/features/analysis/bounds.test.ts)", async () => {
    const created = await designsPost(
      appRequest("/api/v1/designs", {
        method: "POST",
        cookie: dana,
        body: { name: "Work", template: COVER_TEMPLATE },
      }),
    );
    const { designId } = await created.json();
    const { document } = await db
      .selectFrom("design_revisions")
      .select("document")
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    const heavy = {
      ...document,
      estimator: { ...document.estimator, samplesPerPitch: 1024, grid: { nx: 2048, ny: 2048 } },
    };
    const response = await analysesPost(
      appRequest("/api/v1/analyses", { method: "POST", cookie: dana, body: heavy }),
    );
    expect(response.status).toBe(422);
    const text = JSON.stringify(await response.json());
    expect(text).toContain("2048 × 2048 = 4194304 heat-map cells, over the work limit of 1048576");
  });

  it("a pattern search past its caps is a 422 naming them (POST /api/v1/suggestions)", async () => {
    const { document } = await db
      .selectFrom("design_revisions as r")
      .innerJoin("designs as d", "d.id", "r.design_id")
      .select("r.document")
      .where("d.organization_id", "=", org.organizationId)
      .executeTakeFirstOrThrow();
    const sizes = ["M12", "M16", "M20", "M24", "M30", "M36"].map((designation) => ({
      designation,
      threadSeries: "metric-coarse",
    }));
    for (const [body, field, message] of [
      [{ maxAnalyses: 100_000 }, "maxAnalyses", "must be at most 2000 (the work cap of one search)"],
      [
        { keepOuts: Array.from({ length: 33 }, () => ({ kind: "parameter", from: 0.1, to: 0.2 })) },
        "keepOuts",
        "at most 32 keep-out zones",
      ],
      [{ minToolClearanceMm: 5000 }, "minToolClearanceMm", "must be at most 200 mm"],
      [
        {
          sizes,
          materialIds: ["iso-898-1-8.8", "astm-a193-b7", "iso-898-1-10.9", "astm-a193-b16"],
          offsetRangeMm: { fromMm: 20, toMm: 40, stepMm: 1 },
        },
        "sizes",
        "combinations of size, material and offset, over the limit of 400",
      ],
    ] as const) {
      const response = await suggestionsPost(
        appRequest("/api/v1/suggestions", {
          method: "POST",
          cookie: dana,
          body: { design: document, ...body },
        }),
      );
      expect(response.status, field).toBe(422);
      const fieldErrors = (await response.json()).error.fieldErrors;
      expect(fieldErrors[field]?.join(" "), field).toContain(message);
    }
  });
});

describe("JSON bodies: size and nesting limits", () => {
  const deep = (levels: number) => "[".repeat(levels) + "]".repeat(levels);

  it("counts nesting outside strings only", () => {
    expect(jsonNestingDepth('{"a":[1,{"b":"[[[[{{"}]}')).toBe(3);
    expect(jsonNestingDepth('"\\"[["')).toBe(0);
    expect(jsonNestingDepth(deep(5000))).toBe(5000);
  });

  it("a 5,000-deep JSON document is a 400 with a message on every JSON route", async () => {
    const before = await countDesigns();
    for (const [label, call] of [
      ["analyses", () => analysesPost(rawRequest("/api/v1/analyses", deep(5000)))],
      [
        "designs",
        () => designsPost(rawRequest("/api/v1/designs", `{"name":"Deep","document":${deep(5000)}}`)),
      ],
      ["team", () => teamPost(rawRequest("/api/v1/team", `{"email":${deep(5000)}}`, { cookie: ines }))],
      ["suggestions", () => suggestionsPost(rawRequest("/api/v1/suggestions", `{"keepOuts":${deep(5000)}}`))],
    ] as const) {
      const response = await call();
      expect(response.status, label).toBe(400);
      expect((await response.json()).error.message, label).toBe(
        `The JSON body nests arrays and objects more than ${MAX_JSON_DEPTH} levels deep; no document of ours does.`,
      );
    }
    expect(await countDesigns()).toBe(before);
  });

  it("a 20 MB JSON body is a 413 with a message, declared or streamed, and nothing is stored", async () => {
    const before = await countDesigns();
    const huge = JSON.stringify({
      name: "Huge",
      template: COVER_TEMPLATE,
      description: "x".repeat(20 * 1024 * 1024),
    });
    const declared = await designsPost(
      rawRequest("/api/v1/designs", huge, { "content-length": String(Buffer.byteLength(huge)) }),
    );
    expect(declared.status).toBe(413);
    expect((await declared.json()).error.message).toBe("The request body is larger than 1 MB; send less.");
    // Without a Content-Length (chunked), reading stops once the limit is passed.
    const bytes = new TextEncoder().encode(huge);
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent >= bytes.length) return controller.close();
        controller.enqueue(bytes.subarray(sent, sent + 64 * 1024));
        sent += 64 * 1024;
      },
    });
    const streamed = await designsPost(rawRequest("/api/v1/designs", stream));
    expect(streamed.status).toBe(413);
    expect(sent).toBeLessThan(2 * 1024 * 1024);
    expect(await countDesigns()).toBe(before);
  });

  it("a body that is not JSON, or not UTF-8, is a 400", async () => {
    for (const body of ["{name:", new Uint8Array([0x7b, 0xff, 0x7d])]) {
      const response = await analysesPost(rawRequest("/api/v1/analyses", body));
      expect(response.status).toBe(400);
      expect((await response.json()).error.message).toMatch(/must be JSON/);
    }
  });
});
