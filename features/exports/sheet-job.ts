import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { exportFileName, CONTENT_TYPES } from "@/features/exports/file-names";
import { loadSheetInput } from "@/features/exports/sheet/load-sheet-input";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import {
  claimExportFile,
  createExportFile,
  failExportFile,
  finishExportFile,
  setExportProgress,
} from "@/server/jobs/export-files";
import type { SheetJobOptions } from "@/db/tables/exports";
import { SHEET_QUEUE, ensureWorker, getQueue } from "@/server/jobs/queue";
import { errorText, getLogger } from "@/server/log/logger";
import { observeJob } from "@/server/metrics/registry";

/** From this many bolts the export buttons queue the sheet instead of rendering it in the request. */
export { BACKGROUND_SHEET_MIN_BOLTS } from "@/features/exports/cache-keys";

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

/**
 * Makes sure this process works the sheet queue with JOB_WORKERS workers (none when 0). Called at
 * server start (instrumentation.ts) and by enqueueSheetJob, so scripts and tests that queue work it too.
 */
export async function ensureSheetWorker(db: Kysely<Database>): Promise<void> {
  await ensureWorker<SheetJobData>(SHEET_QUEUE, (data) => runSheetJob(db, data.exportFileId));
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
    await ensureSheetWorker(db);
    const boss = await getQueue();
    await boss.send(SHEET_QUEUE, { exportFileId: id } satisfies SheetJobData, { id, retryLimit: 0 });
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
 * Server start (instrumentation.ts): this process's sheet workers, without blocking the start;
 * a database that is down is retried every few seconds until it answers.
 */
export function startSheetWorkers(db: Kysely<Database>, retryMs = 5000): void {
  ensureSheetWorker(db).catch((error: unknown) => {
    getLogger().warn({ event: "jobs", err: errorText(error) }, "queue workers not started, retrying");
    setTimeout(() => startSheetWorkers(db, retryMs), retryMs).unref();
  });
}
