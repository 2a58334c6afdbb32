import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { exportFileName, CONTENT_TYPES } from "@/features/exports/file-names";
import { loadSheetInput } from "@/features/exports/sheet/load-sheet-input";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import type PgBoss from "pg-boss";
import { recordActivity } from "@/features/activity/queries";
import type { ActionResult } from "@/features/forms/action-result";
import {
  claimExportFile,
  createExportFile,
  failExportFile,
  failUnfinishedExportFile,
  finishExportFile,
  requeueFailedExportFile,
  setExportProgress,
  sweepStaleExports,
} from "@/server/jobs/export-files";
import type { SheetJobOptions } from "@/db/tables/exports";
import { SHEET_DEAD_LETTER_QUEUE, SHEET_QUEUE, ensureWorker, getQueue } from "@/server/jobs/queue";
import { errorText, getLogger } from "@/server/log/logger";
import { observeJob } from "@/server/metrics/registry";
import { getEnv } from "@/server/env";

interface SheetJobData {
  exportFileId: string;
}

/**
 * Renders one queued sheet and stores its bytes in export_files. Never throws: a failure is
 * written to the row (the status route shows it), and pg-boss is told the job is done.
 */
export async function runSheetJob(db: Kysely<Database>, exportFileId: string): Promise<void> {
  const row = await claimExportFile(db, exportFileId);
  if (!row) return;
  const started = performance.now();
  const logJob = (outcome: "done" | "failed", err?: string) => {
    const durationMs = Math.round(performance.now() - started);
    observeJob(SHEET_QUEUE, outcome, durationMs / 1000);
    getLogger()[outcome === "done" ? "info" : "warn"](
      {
        queue: SHEET_QUEUE,
        jobId: exportFileId,
        organizationId: row.organization_id,
        userId: row.requested_by,
        outcome,
        durationMs,
        ...(err ? { err } : {}),
      },
      "job",
    );
  };
  try {
    const options = row.options;
    const loaded = await loadSheetInput(db, row.organization_id, row.design_id, options.revisionNumber, {
      paper: options.paper,
      units: options.units,
      createdAt: new Date(),
    });
    if (!loaded || loaded.revision.revisionId !== row.revision_id)
      throw new Error("The revision of this export no longer exists.");
    let last = 0;
    const bytes = await renderSpacingSheet(loaded.input, {
      onProgress: async (fraction) => {
        const pct = Math.round(fraction * 100);
        if (pct - last >= 10 && pct < 100) {
          last = pct;
          await setExportProgress(db, exportFileId, pct);
        }
      },
    });
    await finishExportFile(db, exportFileId, bytes);
    logJob("done");
  } catch (error) {
    await failExportFile(db, exportFileId, errorText(error));
    logJob("failed", errorText(error));
  }
}

/** What a dead-letter job says about why its sheet job failed for good, in words for the panel. */
export function deadSheetMessage(job: Pick<PgBoss.JobWithMetadata, "output" | "retryLimit">): string {
  const output = (job.output ?? {}) as { message?: unknown; value?: { message?: unknown } };
  const raw = String(output.value?.message ?? output.message ?? "");
  const reason = /timeout in active state/.test(raw)
    ? "the worker preparing it stopped or ran out of time"
    : raw || "its job failed";
  const attempts = job.retryLimit + 1;
  return `The sheet was not finished: ${reason}, ${attempts === 1 ? "on its one attempt" : `on each of ${attempts} attempts`}. Use Retry sheet to queue it again.`;
}

/** The dead-letter worker: a sheet job that failed for good marks its export row failed, with why. */
export async function runDeadSheetJob(
  db: Kysely<Database>,
  job: PgBoss.JobWithMetadata<SheetJobData>,
): Promise<void> {
  const message = deadSheetMessage(job);
  if (await failUnfinishedExportFile(db, job.data.exportFileId, message)) {
    observeJob(SHEET_QUEUE, "failed", 0);
    getLogger().warn(
      { queue: SHEET_DEAD_LETTER_QUEUE, jobId: job.data.exportFileId, outcome: "failed", err: message },
      "job",
    );
  }
}

const SWEEP_EVERY_MS = 5 * 60_000;
const globalForSweep = globalThis as unknown as { sealpitchSheetSweep?: NodeJS.Timeout };

/** Marks sheets whose job died without reaching the dead-letter queue failed (see sweepStaleExports). */
export async function sweepStaleSheets(db: Kysely<Database>): Promise<string[]> {
  const ids = await sweepStaleExports(db, SHEET_QUEUE);
  for (const id of ids)
    getLogger().warn({ queue: SHEET_QUEUE, jobId: id, outcome: "failed", err: "stale" }, "job");
  return ids;
}

/**
 * Makes sure this process works the sheet queue with JOB_WORKERS workers (none when 0), and with
 * them the dead-letter queue and the sweep of stale rows (at start, then every 5 minutes). Called
 * at server start (instrumentation.ts) and by enqueueSheetJob, so scripts and tests that queue work it too.
 */
export async function ensureSheetWorker(db: Kysely<Database>): Promise<void> {
  await ensureWorker<SheetJobData>(SHEET_QUEUE, (job) => runSheetJob(db, job.data.exportFileId));
  if (getEnv().JOB_WORKERS < 1) return;
  await ensureWorker<SheetJobData>(SHEET_DEAD_LETTER_QUEUE, (job) => runDeadSheetJob(db, job), 1);
  if (!globalForSweep.sealpitchSheetSweep) {
    const sweep = () =>
      sweepStaleSheets(db).catch((error: unknown) =>
        getLogger().warn({ event: "jobs", err: errorText(error) }, "stale sheet sweep failed"),
      );
    globalForSweep.sealpitchSheetSweep = setInterval(sweep, SWEEP_EVERY_MS).unref();
    void sweep();
  }
}

/** Sends the job of an export row (its options come from the queue: retries, expiry, dead letter). */
async function sendSheetJob(db: Kysely<Database>, exportFileId: string, jobId?: string): Promise<void> {
  await ensureSheetWorker(db);
  const boss = await getQueue();
  const sent = await boss.send(
    SHEET_QUEUE,
    { exportFileId } satisfies SheetJobData,
    jobId ? { id: jobId } : {},
  );
  if (!sent) throw new Error("the queue did not take the job");
}

/** Records the export and queues it; returns the job id (= export_files.id = pg-boss job id). */
export async function enqueueSheetJob(
  db: Kysely<Database>,
  input: {
    organizationId: string;
    designId: string;
    revisionId: string;
    designName: string;
    equipmentTag: string;
    requestedBy: string;
  } & SheetJobOptions,
): Promise<string> {
  const id = await createExportFile(db, {
    organizationId: input.organizationId,
    designId: input.designId,
    revisionId: input.revisionId,
    kind: "spacing-sheet",
    options: { revisionNumber: input.revisionNumber, paper: input.paper, units: input.units },
    fileName: exportFileName(
      { equipmentTag: input.equipmentTag, designName: input.designName, designId: input.designId },
      input.revisionNumber,
      "spacing-sheet",
    ),
    contentType: CONTENT_TYPES["spacing-sheet"],
    requestedBy: input.requestedBy,
  });
  try {
    await sendSheetJob(db, id, id);
  } catch (error) {
    await failExportFile(
      db,
      id,
      `Could not queue the sheet: ${error instanceof Error ? error.message : String(error)}`,
    );
  }
  return id;
}

/**
 * The Retry sheet command: a failed sheet of this organisation is queued again as it was (same
 * row, so its status URL and file name stay), as a new queue job. Any member may, as for the
 * first export; another organisation's sheet is not found, and only a failed one is retried.
 */
export async function retrySheetJob(
  db: Kysely<Database>,
  viewer: { organizationId: string; userId: string },
  exportFileId: string,
): Promise<ActionResult<{ jobId: string }>> {
  const row = await requeueFailedExportFile(db, viewer.organizationId, exportFileId);
  if (!row) {
    const exists = await db
      .selectFrom("export_files")
      .select("status")
      .where("organization_id", "=", viewer.organizationId)
      .where("id", "=", exportFileId)
      .executeTakeFirst();
    return {
      ok: false,
      message: exists
        ? "Only a sheet that failed can be retried; this one is queued, in progress or done."
        : "This sheet does not exist.",
    };
  }
  try {
    await sendSheetJob(db, row.id);
  } catch (error) {
    await failExportFile(db, row.id, `Could not queue the sheet: ${errorText(error)}`);
    return { ok: false, message: `The sheet could not be queued again: ${errorText(error)}` };
  }
  const options = row.options as SheetJobOptions;
  await recordActivity(db, {
    organizationId: viewer.organizationId,
    designId: row.design_id,
    revisionId: row.revision_id,
    actorId: viewer.userId,
    kind: "exported",
    detail: `${row.file_name} (${options.paper.toUpperCase()}, ${options.units}, queued again)`,
  });
  return { ok: true, data: { jobId: row.id } };
}
