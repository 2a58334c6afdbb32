import { spawn, type ChildProcess } from "node:child_process";
import { sql } from "kysely";
import PgBoss from "pg-boss";
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import { SHEET_JOB_OPTIONS, SHEET_QUEUE } from "@/db/job-queues";
import { createDesign } from "@/features/designs/mutations";
import { enqueueSheetJob, retrySheetJob, sweepStaleSheets } from "@/features/exports/sheet-job";
import { closeAnalysisPool } from "@/server/analysis/pool";
import { createExportFile, STALE_EXPORT_MESSAGE } from "@/server/jobs/export-files";
import { getQueue, stopQueue } from "@/server/jobs/queue";
import { createOrganizationWithMembers, type OrganizationFixture } from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";
import { manyBoltFlange } from "./fixtures";

// A queued sheet whose worker dies mid-job: the worker is a separate process (as on another app
// instance), frozen while the row says "running" and then killed with SIGKILL, so it never
// finishes, fails or tells the queue anything. pg-boss's expiry (run here by a maintenance
// instance every second, with the sheet queue's expiry cut to seconds for the test) either
// hands the job to another worker, or, with no retry left, moves it to the dead-letter queue,
// whose worker marks the export failed with the reason; Retry sheet then queues it again. This
// process itself runs no sheet workers (JOB_WORKERS=0, like a web-only instance).
vi.stubEnv("JOB_WORKERS", "0");

const db = getTestDb();
let works: OrganizationFixture<"designer">;
let rival: OrganizationFixture<"outsider">;
let ownerBoss: PgBoss;
let maintenance: PgBoss;
let revision: { designId: string; revisionId: string; designName: string; equipmentTag: string };
const children: ChildProcess[] = [];

async function setSheetQueue(options: Partial<PgBoss.Queue>): Promise<void> {
  await ownerBoss.updateQueue(SHEET_QUEUE, { name: SHEET_QUEUE, ...SHEET_JOB_OPTIONS, ...options });
}

/** A sheet worker in its own process; resolves once its workers are registered. */
async function startWorkerProcess(): Promise<ChildProcess> {
  const child = spawn(
    process.execPath,
    ["--import", "tsx", "--conditions=react-server", "tests/fixtures/sheet-worker/run-sheet-worker.ts"],
    { env: { ...process.env, JOB_WORKERS: "1" }, stdio: ["ignore", "pipe", "inherit"] },
  );
  children.push(child);
  await new Promise<void>((resolve, reject) => {
    child.stdout!.on("data", (chunk: Buffer) => {
      if (chunk.toString().includes("ready")) resolve();
    });
    child.once("exit", (code) => reject(new Error(`the worker process stopped (${code})`)));
  });
  return child;
}

const exportRow = (id: string) =>
  db
    .selectFrom("export_files")
    .select(["status", "error", "byte_size", "progress"])
    .where("id", "=", id)
    .executeTakeFirstOrThrow();

async function waitFor<T>(what: string, read: () => Promise<T>, done: (v: T) => boolean, ms = 60_000) {
  const until = Date.now() + ms;
  for (;;) {
    const value = await read();
    if (done(value)) return value;
    if (Date.now() > until) throw new Error(`timed out waiting for ${what}: ${JSON.stringify(value)}`);
    await new Promise((resolve) => setTimeout(resolve, 5));
  }
}

/** Stops the worker the moment it has claimed the sheet (SIGSTOP), checks it is mid-job, kills it. */
async function killMidJob(worker: ChildProcess, exportFileId: string): Promise<void> {
  await waitFor(
    "the worker to claim the sheet",
    () => exportRow(exportFileId),
    (r) => r.status !== "queued",
  );
  worker.kill("SIGSTOP");
  expect((await exportRow(exportFileId)).status).toBe("running"); // not finished: frozen mid-job
  worker.kill("SIGKILL");
  await new Promise((resolve) => worker.once("exit", resolve));
  expect((await exportRow(exportFileId)).status).toBe("running");
}

async function jobState(id: string) {
  const { rows } = await sql<{ state: string; retry_count: number }>`
    select state::text as state, retry_count from pgboss.job where id = ${id}`.execute(db);
  return rows[0];
}

const queueSheet = () =>
  enqueueSheetJob(db, {
    organizationId: works.organizationId,
    ...revision,
    requestedBy: works.users.designer.userId,
    revisionNumber: 1,
    paper: "a4",
    units: "SI",
  });

beforeAll(async () => {
  works = await createOrganizationWithMembers(db, { designer: ["designer"] });
  rival = await createOrganizationWithMembers(db, { outsider: ["designer", "admin"] });
  const document = { ...manyBoltFlange(96), name: "Girth flange, recovery" };
  const { designId } = await createDesign(db, {
    organizationId: works.organizationId,
    ownerId: works.users.designer.userId,
    name: document.name,
    equipmentTag: "E-4410",
    document,
  });
  const row = await db
    .selectFrom("design_revisions")
    .select("id")
    .where("design_id", "=", designId)
    .executeTakeFirstOrThrow();
  revision = { designId, revisionId: row.id, designName: document.name, equipmentTag: "E-4410" };
  ownerBoss = new PgBoss({
    connectionString: process.env.MIGRATION_DATABASE_URL,
    max: 1,
    migrate: false,
    supervise: false,
    schedule: false,
  });
  await ownerBoss.start();
  maintenance = new PgBoss({
    connectionString: process.env.DATABASE_URL,
    max: 2,
    migrate: false,
    schedule: false,
    maintenanceIntervalSeconds: 1,
  });
  await maintenance.start();
});

const killWorkers = () => {
  for (const child of children)
    if (child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
};
// No worker outlives its test, whatever its outcome (a stray one would take the next test's job).
afterEach(killWorkers);

afterAll(async () => {
  killWorkers();
  await setSheetQueue({});
  await maintenance.stop({ graceful: false, wait: true });
  await ownerBoss.stop({ graceful: false, wait: true });
  await stopQueue();
  await closeAnalysisPool();
  await db.deleteFrom("designs").where("organization_id", "=", works.organizationId).execute();
  await works.cleanup();
  await rival.cleanup();
  vi.unstubAllEnvs();
});

describe("a sheet whose worker was killed mid-job", () => {
  it("is retried by another worker once its job expires, and finishes", async () => {
    // Expiry long enough for a slow render on a busy machine, short enough for a test.
    await setSheetQueue({ retryLimit: 1, retryDelay: 1, retryBackoff: false, expireInSeconds: 12 });
    const first = await startWorkerProcess();
    const id = await queueSheet();
    await killMidJob(first, id);
    expect(await jobState(id)).toMatchObject({ state: "active", retry_count: 0 }); // its worker is gone

    await startWorkerProcess();
    const done = await waitFor(
      "the retried sheet",
      () => exportRow(id),
      (r) => r.status !== "running",
    );
    expect(done).toMatchObject({ status: "done", progress: 100, error: null });
    expect(done.byte_size).toBeGreaterThan(10_000);
    // The queue hears of it just after the row is written.
    const job = await waitFor(
      "the job to complete",
      () => jobState(id),
      (j) => j?.state !== "active",
    );
    expect(job).toMatchObject({ state: "completed", retry_count: 1 });
  }, 90_000);

  it("with no retry left is marked failed with the reason, and Retry sheet queues it again", async () => {
    await setSheetQueue({ retryLimit: 0, expireInSeconds: 10 });
    const first = await startWorkerProcess();
    const id = await queueSheet();
    await killMidJob(first, id);

    // The other instance's dead-letter worker marks the row failed.
    await startWorkerProcess();
    const failed = await waitFor(
      "the sheet to be marked failed",
      () => exportRow(id),
      (r) => r.status !== "running",
    );
    expect(failed).toMatchObject({
      status: "failed",
      error:
        "The sheet was not finished: the worker preparing it stopped or ran out of time, on its one attempt. Use Retry sheet to queue it again.",
    });

    // Another organisation cannot retry it; this one's member can, once.
    const outsider = { organizationId: rival.organizationId, userId: rival.users.outsider.userId };
    expect(await retrySheetJob(db, outsider, id)).toEqual({
      ok: false,
      message: "This sheet does not exist.",
    });
    const designer = { organizationId: works.organizationId, userId: works.users.designer.userId };
    expect(await retrySheetJob(db, designer, id)).toEqual({ ok: true, data: { jobId: id } });
    expect(await retrySheetJob(db, designer, id)).toEqual({
      ok: false,
      message: "Only a sheet that failed can be retried; this one is queued, in progress or done.",
    });
    const done = await waitFor(
      "the sheet queued again",
      () => exportRow(id),
      (r) => r.status === "done" || r.status === "failed",
    );
    expect(done).toMatchObject({ status: "done", error: null });
    const activity = await db
      .selectFrom("design_activity")
      .select("detail")
      .where("design_id", "=", revision.designId)
      .where("kind", "=", "exported")
      .execute();
    expect(activity.map((a) => a.detail)).toContainEqual(expect.stringMatching(/\(A4, SI, queued again\)$/));
  }, 90_000);
});

describe("the sweep of stale sheets", () => {
  it("fails rows left running or queued without a live job, and leaves rows whose job still waits", async () => {
    const row = (note: string) =>
      createExportFile(db, {
        organizationId: works.organizationId,
        designId: revision.designId,
        revisionId: revision.revisionId,
        kind: "spacing-sheet",
        options: { revisionNumber: 1, paper: "a4", units: "SI" },
        fileName: `${note}.pdf`,
        contentType: "application/pdf",
        requestedBy: works.users.designer.userId,
      });
    const orphan = await row("orphan");
    const waiting = await row("waiting");
    const fresh = await row("fresh");
    await db
      .updateTable("export_files")
      .set({ status: "running", updated_at: new Date(Date.now() - 10 * 60_000) })
      .where("id", "in", [orphan, waiting])
      .execute();
    // A job for `waiting` that no worker may take yet (a retry waiting for its delay looks the same).
    const boss = await getQueue();
    await boss.send(SHEET_QUEUE, { exportFileId: waiting }, { id: waiting, startAfter: 3600 });

    const swept = await sweepStaleSheets(db);
    expect(swept).toContain(orphan);
    expect(swept).not.toContain(waiting);
    expect(swept).not.toContain(fresh); // written just now: its job may be on the way
    expect(await exportRow(orphan)).toMatchObject({ status: "failed", error: STALE_EXPORT_MESSAGE });
    expect((await exportRow(waiting)).status).toBe("running");
    expect((await exportRow(fresh)).status).toBe("queued");
    await boss.deleteJob(SHEET_QUEUE, waiting);
  });
});
