import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "kysely";
import {
  GET as feGet,
  POST as fePost,
} from "@/app/api/v1/designs/[designId]/revisions/[number]/fe-check/route";
import { POST as cancelPost } from "@/app/api/v1/fe-checks/[feCheckId]/cancel/route";
import { sha256OfJson } from "@/features/analysis/content-hash";
import { loadSheetInput } from "@/features/exports/sheet/load-sheet-input";
import { cancelFeCheck, readLatestFeCheck, startFeCheck } from "@/features/fe-check/commands";
import { runFeJob } from "@/features/fe-check/fe-job";
import { feCheckForSheet, findFeCheck, type FeCheckDto } from "@/features/fe-check/store";
import { approveRevision, submitRevision } from "@/features/reviews/transitions";
import type { Viewer } from "@/server/auth/guard";
import { stopQueue } from "@/server/jobs/queue";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "../../setup/fixtures";
import { getOwnerTestDb, getTestDb } from "../../setup/test-db";
import {
  createReviewOrg,
  createSampleDesign,
  dropReviewOrg,
  justifyAll,
  revisionRow,
} from "../reviews/helpers";

// The FE cross-check as a background job through the real database, the real pg-boss queue and
// the real solver: queue → progress → result with its hash; one run at a time; cancel kills the
// solver and stores nothing; a lost worker's run is retried or swept; an approval cites the run
// and freezes it; nothing runs on an approved revision.
const db = getTestDb();
let org: Awaited<ReturnType<typeof createReviewOrg>>;
let rival: OrganizationFixture<"outsider">;
const viewer = (a: { userId: string; organizationId: string; roles: readonly string[] }) =>
  a as unknown as Viewer;

async function waitFor(
  designId: string,
  who: Viewer,
  until: (f: FeCheckDto) => boolean,
  timeoutMs = 90_000,
): Promise<FeCheckDto> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const r = await readLatestFeCheck(db, who, { designId, number: 1 });
    if (r.ok && r.data && until(r.data)) return r.data;
    if (Date.now() > end) throw new Error(`FE check did not reach the state in time: ${JSON.stringify(r)}`);
    await new Promise((res) => setTimeout(res, 250));
  }
}

beforeAll(async () => {
  org = await createReviewOrg("fe");
  rival = await createOrganizationWithMembers(db, { outsider: ["designer", "approver"] });
});

afterAll(async () => {
  await stopQueue();
  await dropReviewOrg(org.organizationId);
  await rival.cleanup();
});

describe("FE cross-check job", () => {
  it("queues, reports progress, and stores the result with its hash; the approval cites it and freezes it", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "FE run one");
    const designer = viewer(org.designer);
    const started = await startFeCheck(db, designer, { designId, number: 1 });
    expect(started).toMatchObject({ ok: true, data: { status: "queued", current: true } });
    const again = await startFeCheck(db, designer, { designId, number: 1 });
    expect(again).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringContaining("already queued or running"),
    });

    const done = await waitFor(designId, designer, (f) => f.status === "done" || f.status === "failed");
    expect(done.error).toBeNull();
    expect(done.status).toBe("done");
    expect(done.progress.runs).toBeGreaterThan(0);
    expect(done.progress.elements).toBeGreaterThan(100);
    expect(done.resultHash).toBe(sha256OfJson(done.result));
    const stiffness = done.result!.comparison.find((r) => r.key === "member-stiffness")!;
    expect(stiffness.fe).toBeGreaterThan(0);
    expect(stiffness.difference).toBeCloseTo((stiffness.fe! - stiffness.estimate!) / stiffness.estimate!, 12);
    expect(done.result!.cautions.join(" ")).toMatch(
      /not a substitute for an FE analysis qualified under the governing code/,
    );
    expect(done.result!.stack!.fe.reactionRatio).toBeGreaterThan(0.999);
    // The gasket path model ran too: its profile on the estimate's s, compared like for like.
    const path = done.result!.gasketPath!;
    expect(done.result!.gasketPathError).toBeNull();
    expect(path.stressMpa).toHaveLength(path.sMm.length);
    expect(path.estimateMpa).toHaveLength(path.sMm.length);
    expect(path.forceBalanceError).toBeLessThan(0.01);
    const minRow = done.result!.comparison.find((r) => r.key === "min-gasket-stress")!;
    expect(minRow).toMatchObject({ estimate: path.estimate.minMpa, fe: path.minStressMpa });
    expect(minRow.fe!).toBeLessThanOrEqual(path.maxStressMpa);
    // This cover (bolts 18 mm outside a 43 mm wide soft gasket on 30 mm plates) turns about the
    // gasket: FE seats its outer part only and opens the centre line the estimate follows, and the
    // run says so. A ring rotation estimate agrees in kind: moment F·(35.5 mm) per bolt over the ring's
    // bending stiffness turns it ~0.02 rad, ~1 mm across the gasket against ~0.07 mm of compression
    // (our own hand check).
    expect(path.closedAreaFraction).toBeGreaterThan(0.2);
    expect(path.closedAreaFraction).toBeLessThan(0.8);
    expect(path.peakCellMpa).toBeGreaterThan(path.estimate.maxMpa);
    expect(path.warnings.join(" ")).toMatch(/in contact over \d+ % of its area/);

    // A finished row never changes, even for the owner role.
    await expect(
      getOwnerTestDb().updateTable("fe_checks").set({ error: "edited" }).where("id", "=", done.id).execute(),
    ).rejects.toThrow(/is finished/);

    await submitRevision(db, org.designer, { designId, number: 1 });
    const row = await revisionRow(designId);
    const approved = await approveRevision(db, org.approver, {
      acknowledgeUnverifiedValues: true,
      designId,
      number: 1,
      comment: "",
      justifications: justifyAll(row.result),
    });
    expect(approved).toMatchObject({ ok: true });
    const decision = await db
      .selectFrom("revision_decisions")
      .select(["fe_check_id", "fe_result_hash"])
      .where("revision_id", "=", row.id)
      .where("kind", "=", "approved")
      .executeTakeFirstOrThrow();
    expect(decision).toEqual({ fe_check_id: done.id, fe_result_hash: done.resultHash });
    const sheet = await feCheckForSheet(db, org.organizationId, row.id);
    expect(sheet).toMatchObject({ cited: true, dto: { id: done.id } });
    const loaded = await loadSheetInput(db, org.organizationId, designId, 1, {
      paper: "a4",
      units: "SI",
      createdAt: new Date(),
    });
    expect(loaded?.input.feCheck).toMatchObject({ cited: true, resultHash: done.resultHash });

    // Nothing new runs on the approved revision: refused by the command and by the database.
    expect(await startFeCheck(db, designer, { designId, number: 1 })).toMatchObject({
      ok: false,
      status: 409,
    });
    await expect(
      getOwnerTestDb()
        .insertInto("fe_checks")
        .values({
          organization_id: org.organizationId,
          design_id: designId,
          revision_id: row.id,
          document_hash: "x",
          requested_by: org.designer.userId,
        })
        .execute(),
    ).rejects.toThrow(/is approved/);
  });

  it("cancel kills the running solver and stores nothing", async () => {
    const { designId } = await createSampleDesign(
      org.organizationId,
      org.designer.userId,
      "FE run cancelled",
    );
    const designer = viewer(org.designer);
    const started = await startFeCheck(db, designer, { designId, number: 1 });
    if (!started.ok) throw new Error(started.message);
    await waitFor(designId, designer, (f) => f.status === "running" && f.progress.runs >= 1);
    expect(await cancelFeCheck(db, viewer(org.approver), started.data.id)).toMatchObject({ ok: true });
    const ended = await waitFor(designId, designer, (f) => f.status !== "running", 20_000);
    expect(ended).toMatchObject({ status: "cancelled", result: null, resultHash: null });
    expect(await cancelFeCheck(db, designer, started.data.id)).toMatchObject({ ok: false, status: 409 });
  });

  it("a run whose worker was lost is taken again by the retry, and one left stuck is swept as failed", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "FE run lost");
    const rev = await revisionRow(designId);
    const insert = () =>
      db
        .insertInto("fe_checks")
        .values({
          organization_id: org.organizationId,
          design_id: designId,
          revision_id: rev.id,
          document_hash: sha256OfJson(rev.document),
          status: "running",
          attempts: 1,
          started_at: new Date(),
          requested_by: org.designer.userId,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
    // A worker claimed it and died: the queue's retry hands the job to a worker again.
    const lost = await insert();
    await runFeJob(db, lost.id);
    const retried = await findFeCheck(db, org.organizationId, lost.id);
    expect(retried).toMatchObject({ status: "done" });
    const attempts = await db
      .selectFrom("fe_checks")
      .select("attempts")
      .where("id", "=", lost.id)
      .executeTakeFirstOrThrow();
    expect(attempts.attempts).toBe(2);
    // No worker is left: the first read after the stale limit marks it failed with a message.
    const stuck = await insert();
    await db
      .updateTable("fe_checks")
      .set({ updated_at: sql<Date>`now() - interval '6 minutes'` })
      .where("id", "=", stuck.id)
      .execute();
    const swept = await readLatestFeCheck(db, viewer(org.designer), { designId, number: 1 });
    expect(swept).toMatchObject({
      ok: true,
      data: { id: stuck.id, status: "failed", error: expect.stringContaining("stopped answering") },
    });
  });

  it("HTTP: 401 signed out, 404 for another organisation, 202 to start, and cancel answers", async () => {
    const { designId } = await createSampleDesign(org.organizationId, org.designer.userId, "FE run http");
    const ctx = { params: Promise.resolve({ designId, number: "1" }) };
    const path = `/api/v1/designs/${designId}/revisions/1/fe-check`;
    expect((await feGet(appRequest(path), ctx)).status).toBe(401);
    const outsider = await rival.cookieFor("outsider");
    expect((await feGet(appRequest(path, { cookie: outsider }), ctx)).status).toBe(404);
    expect((await fePost(appRequest(path, { method: "POST", cookie: outsider }), ctx)).status).toBe(404);
    const before = await db.selectFrom("fe_checks").select("id").where("design_id", "=", designId).execute();
    expect(before).toHaveLength(0);
  });
});

describe("FE cross-check through HTTP with a session", () => {
  let works: OrganizationFixture<"designer">;
  beforeAll(async () => {
    works = await createOrganizationWithMembers(db, { designer: ["designer"] });
  });
  afterAll(async () => {
    await dropReviewOrg(works.organizationId);
  });
  it("POST → 202 queued, GET shows it, cancel → cancelled", async () => {
    const { designId } = await createSampleDesign(
      works.organizationId,
      works.users.designer.userId,
      "FE http",
    );
    const ctx = { params: Promise.resolve({ designId, number: "1" }) };
    const path = `/api/v1/designs/${designId}/revisions/1/fe-check`;
    const cookie = await works.cookieFor("designer");
    const res = await fePost(appRequest(path, { method: "POST", cookie }), ctx);
    expect(res.status).toBe(202);
    const { feCheck } = (await res.json()) as { feCheck: FeCheckDto };
    const got = (await (await feGet(appRequest(path, { cookie }), ctx)).json()) as { feCheck: FeCheckDto };
    expect(got.feCheck.id).toBe(feCheck.id);
    const cancel = await cancelPost(
      appRequest(`/api/v1/fe-checks/${feCheck.id}/cancel`, { method: "POST", cookie }),
      {
        params: Promise.resolve({ feCheckId: feCheck.id }),
      },
    );
    expect([200, 409]).toContain(cancel.status);
    const end = Date.now() + 30_000;
    let last: FeCheckDto;
    do {
      last = ((await (await feGet(appRequest(path, { cookie }), ctx)).json()) as { feCheck: FeCheckDto })
        .feCheck;
      if (last.status !== "queued" && last.status !== "running") break;
      await new Promise((r) => setTimeout(r, 250));
    } while (Date.now() < end);
    expect(["cancelled", "done"]).toContain(last.status);
  });
});
