import { parse } from "csv-parse/sync";
import DxfParser from "dxf-parser";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { GET as jobGet } from "@/app/api/v1/jobs/[jobId]/route";
import { GET as dxfGet } from "@/app/api/v1/designs/[designId]/revisions/[number]/drilling.dxf/route";
import { GET as csvGet } from "@/app/api/v1/designs/[designId]/revisions/[number]/holes.csv/route";
import { GET as kitGet } from "@/app/api/v1/designs/[designId]/revisions/[number]/bolting-kit.csv/route";
import { GET as logGet } from "@/app/api/v1/designs/[designId]/revisions/[number]/pass-log.csv/route";
import { GET as logPdfGet } from "@/app/api/v1/designs/[designId]/revisions/[number]/pass-log.pdf/route";
import {
  GET as pdfGet,
  POST as pdfPost,
} from "@/app/api/v1/designs/[designId]/revisions/[number]/sheet.pdf/route";
import type { JointDesign } from "@/features/analysis/core/design";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { computeContentHash } from "@/features/analysis/content-hash";
import { stopQueue } from "@/server/jobs/queue";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "../../setup/fixtures";
import { getTestDb, deleteWithFrozenGuardOff } from "../../setup/test-db";
import { analyse, loadExample, manyBoltFlange, pdfToText } from "./fixtures";

// The export routes through the real database and real sessions: any member may export, another
// organisation's design is a 404, the big sheet goes through the pg-boss queue.
const db = getTestDb();
let works: OrganizationFixture<"designer" | "approver">;
let rival: OrganizationFixture<"outsider">;
let smallId: string;
let bigId: string;

async function insertDesign(
  org: OrganizationFixture<string>,
  ownerId: string,
  approverId: string,
  document: JointDesign,
  tag: string,
  status: "in_review" | "approved",
) {
  const design = await db
    .insertInto("designs")
    .values({
      organization_id: org.organizationId,
      name: document.name,
      equipment_tag: tag,
      outline_kind: document.outline.kind,
      owner_id: ownerId,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  const result = analyse(document);
  await db
    .insertInto("design_revisions")
    .values({
      design_id: design.id,
      organization_id: org.organizationId,
      number: 1,
      status,
      document: JSON.stringify(document),
      result: JSON.stringify(result),
      core_version: CORE_VERSION,
      content_hash: computeContentHash({ document, result, coreVersion: CORE_VERSION }),
      created_by: ownerId,
      last_edited_by: ownerId,
      submitted_by: ownerId,
      submitted_at: new Date(),
      decided_by: status === "approved" ? approverId : null,
      decided_at: status === "approved" ? new Date("2026-11-30T10:00:00Z") : null,
    })
    .execute();
  return design.id;
}

async function dropOrg(org: OrganizationFixture<string>) {
  await deleteWithFrozenGuardOff(async (trx) => {
    await trx.deleteFrom("export_files").where("organization_id", "=", org.organizationId).execute();
    await trx.deleteFrom("design_revisions").where("organization_id", "=", org.organizationId).execute();
    await trx.deleteFrom("designs").where("organization_id", "=", org.organizationId).execute();
  });
  await org.cleanup();
}

const ctx = (designId: string, number = "1") => ({ params: Promise.resolve({ designId, number }) });
const url = (designId: string, file: string, query = "") =>
  `/api/v1/designs/${designId}/revisions/1/${file}${query}`;

beforeAll(async () => {
  works = await createOrganizationWithMembers(db, { designer: ["designer"], approver: ["approver"] });
  rival = await createOrganizationWithMembers(db, { outsider: ["designer", "approver", "admin"] });
  smallId = await insertDesign(
    works,
    works.users.designer.userId,
    works.users.approver.userId,
    loadExample("pipe-flange-nps6-spiral-wound"),
    "E-2107",
    "approved",
  );
  bigId = await insertDesign(
    works,
    works.users.designer.userId,
    works.users.approver.userId,
    manyBoltFlange(96),
    "E-3301",
    "in_review",
  );
});

afterAll(async () => {
  await stopQueue();
  await dropOrg(works);
  await dropOrg(rival);
});

/** A 200 download of the small design's revision 1 under our file name, ending in `ending`. */
function expectDownload(res: Response, ending: string, contentType?: string) {
  expect(res.status).toBe(200);
  if (contentType) expect(res.headers.get("content-type")).toBe(contentType);
  expect(res.headers.get("content-disposition")).toBe(
    `attachment; filename="e-2107-inlet-nozzle-n1-nps-6-class-150-rf-${smallId.slice(0, 8)}-rev1-${ending}"`,
  );
}

describe("export routes", () => {
  it("streams the sheet to any member with our file name, in the viewer's units, and logs the export", async () => {
    const cookie = await works.cookieFor("approver");
    const res = await pdfGet(
      appRequest(url(smallId, "sheet.pdf", "?paper=letter&units=US"), { cookie }),
      ctx(smallId),
    );
    expectDownload(res, "spacing-sheet.pdf", "application/pdf");
    const pdf = Buffer.from(await res.arrayBuffer());
    const text = pdfToText(pdf);
    expect(text).toContain("APPROVED");
    expect(text).not.toContain("NOT APPROVED");
    expect(text).toContain(works.users.approver.displayName);
    expect(text).toContain("x in");
    expect(text).toContain("Snapshot integrity: verified");
    const log = await db
      .selectFrom("design_activity")
      .select(["kind", "detail"])
      .where("design_id", "=", smallId)
      .execute();
    expect(log.some((l) => l.kind === "exported" && l.detail.includes("spacing-sheet.pdf"))).toBe(true);
  });

  it("answers the hole list and drilling template with the design's unit", async () => {
    const cookie = await works.cookieFor("designer");
    const csv = await csvGet(appRequest(url(smallId, "holes.csv"), { cookie }), ctx(smallId));
    expectDownload(csv, "hole-list.csv");
    const rows = parse(await csv.text(), { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(8);
    expect(Object.keys(rows[0])).toContain("x_in"); // the example is a US design
    const dxf = await dxfGet(appRequest(url(smallId, "drilling.dxf"), { cookie }), ctx(smallId));
    expectDownload(dxf, "drilling-template.dxf");
    const parsed = new DxfParser().parseSync(await dxf.text());
    expect((parsed!.header as Record<string, unknown>).$INSUNITS).toBe(1);
    const kit = await kitGet(appRequest(url(smallId, "bolting-kit.csv"), { cookie }), ctx(smallId));
    expectDownload(kit, "bolting-kit.csv", "text/csv; charset=utf-8");
    const kitRows = parse(await kit.text(), { columns: true }) as Record<string, string>[];
    expect(kitRows.map((r) => [r.part, r.quantity, r.length_in])).toEqual([
      ["stud", "8", "4.000"],
      ["nut", "16", ""],
    ]);
    const log = await db
      .selectFrom("design_activity")
      .select("detail")
      .where("design_id", "=", smallId)
      .where("kind", "=", "exported")
      .execute();
    expect(log.some((l) => l.detail.endsWith("-bolting-kit.csv"))).toBe(true);
    const passLog = await logGet(appRequest(url(smallId, "pass-log.csv"), { cookie }), ctx(smallId));
    expectDownload(passLog, "pass-log.csv");
    const logRows = parse(await passLog.text(), { columns: true }) as Record<string, string>[];
    expect(logRows).toHaveLength(5 * 8);
    expect(Object.keys(logRows[0])).toContain("target_torque_ft_lb");
    const logPdf = await logPdfGet(
      appRequest(url(smallId, "pass-log.pdf", "?paper=letter&units=US"), { cookie }),
      ctx(smallId),
    );
    expectDownload(logPdf, "pass-log.pdf", "application/pdf");
    const logText = pdfToText(Buffer.from(await logPdf.arrayBuffer()));
    expect(logText).toContain("PASS LOG");
    expect(logText).toContain("ft·lb");
  });

  it("is a 404 for another organisation's design, a 401 signed out, a 400 for bad options", async () => {
    const outsider = await rival.cookieFor("outsider");
    for (const [handler, file] of [
      [pdfGet, "sheet.pdf"],
      [csvGet, "holes.csv"],
      [dxfGet, "drilling.dxf"],
      [kitGet, "bolting-kit.csv"],
      [logGet, "pass-log.csv"],
      [logPdfGet, "pass-log.pdf"],
    ] as const) {
      const res = await handler(appRequest(url(smallId, file), { cookie: outsider }), ctx(smallId));
      expect(res.status).toBe(404);
      expect(((await res.json()) as { error: { message: string } }).error.message).toBe(
        "This revision does not exist.",
      );
    }
    expect(
      (await pdfPost(appRequest(url(bigId, "sheet.pdf"), { method: "POST", cookie: outsider }), ctx(bigId)))
        .status,
    ).toBe(404);
    expect((await pdfGet(appRequest(url(smallId, "sheet.pdf")), ctx(smallId))).status).toBe(401);
    const cookie = await works.cookieFor("designer");
    expect((await pdfGet(appRequest(url(smallId, "sheet.pdf"), { cookie }), ctx(smallId, "9"))).status).toBe(
      404,
    );
    const bad = await pdfGet(appRequest(url(smallId, "sheet.pdf", "?paper=a3"), { cookie }), ctx(smallId));
    expect(bad.status).toBe(400);
    expect(
      ((await bad.json()) as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors.paper,
    ).toEqual(["Paper must be a4 or letter."]);
    // A post from another site is refused before anything is queued.
    expect(
      (
        await pdfPost(
          appRequest(url(bigId, "sheet.pdf"), { method: "POST", cookie, origin: "http://evil.example" }),
          ctx(bigId),
        )
      ).status,
    ).toBe(403);
  });

  it("renders a 96-bolt sheet in the background job queue and hands it out when done", async () => {
    const cookie = await works.cookieFor("designer");
    const res = await pdfPost(
      appRequest(url(bigId, "sheet.pdf", "?paper=a4&units=SI"), { method: "POST", cookie }),
      ctx(bigId),
    );
    expect(res.status).toBe(202);
    const { jobId, statusUrl } = (await res.json()) as { jobId: string; statusUrl: string };
    expect(statusUrl).toBe(`/api/v1/jobs/${jobId}`);
    const jobCtx = { params: Promise.resolve({ jobId }) };
    // Another organisation cannot see the job.
    expect(
      (await jobGet(appRequest(statusUrl, { cookie: await rival.cookieFor("outsider") }), jobCtx)).status,
    ).toBe(404);
    let status: { status: string; progress: number; downloadUrl: string | null; error: string | null } = {
      status: "queued",
      progress: 0,
      downloadUrl: null,
      error: null,
    };
    const seen = new Set<string>();
    for (let i = 0; i < 120 && status.status !== "done" && status.status !== "failed"; i++) {
      const poll = await jobGet(appRequest(statusUrl, { cookie }), jobCtx);
      expect(poll.status).toBe(200);
      status = (await poll.json()) as typeof status;
      seen.add(status.status);
      if (status.status !== "done") await new Promise((r) => setTimeout(r, 250));
    }
    expect(status.error).toBeNull();
    expect(status.status).toBe("done");
    expect(status.progress).toBe(100);
    expect(status.downloadUrl).toBe(`/api/v1/jobs/${jobId}?download=1`);
    const file = await jobGet(appRequest(status.downloadUrl!, { cookie }), jobCtx);
    expect(file.status).toBe(200);
    expect(file.headers.get("content-disposition")).toBe(
      `attachment; filename="e-3301-girth-flange-96-bolts-${bigId.slice(0, 8)}-rev1-spacing-sheet.pdf"`,
    );
    const text = pdfToText(Buffer.from(await file.arrayBuffer()));
    expect(text).toContain("NOT APPROVED");
    for (let i = 1; i <= 96; i++) expect(text).toMatch(new RegExp(`^${i}\\s+b${i}\\b`, "m"));
  }, 60_000);
});
