import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { JointDesign } from "@/features/analysis/core/design";
import { FE_QUEUE } from "@/db/job-queues";
import { getEnv } from "@/server/env";
import { ensureWorker, getQueue } from "@/server/jobs/queue";
import { errorText, getLogger } from "@/server/log/logger";
import { observeJob } from "@/server/metrics/registry";
import { CcxCancelled } from "./ccx-runner";
import { FeRunError, runFeCheck } from "./run-fe-check";
import {
  claimFeCheck,
  createFeCheck,
  endFeCheck,
  finishFeCheck,
  isFeCancelRequested,
  setFeProgress,
  type NewFeCheck,
} from "./store";

// The FE cross-check's background job: one pg-boss job per run (job id = fe_checks.id). The worker
// solves the revision's document as it was when the run was requested (a later save makes the
// result "of an earlier save", and it says so), writes progress after every solver run, and polls
// the row once a second for a cancel, which kills the solver. A worker that dies mid-run leaves
// the job to expire; the queue retries it once on another worker, and reads sweep what stays stuck.

interface FeJobData {
  feCheckId: string;
}

const CANCEL_POLL_MS = 1000;

/** Runs one queued FE cross-check to its end. Never throws: the outcome is written to the row. */
export async function runFeJob(db: Kysely<Database>, feCheckId: string): Promise<void> {
  const row = await claimFeCheck(db, feCheckId);
  if (!row) return;
  const started = performance.now();
  const abort = new AbortController();
  const poll = setInterval(() => {
    isFeCancelRequested(db, feCheckId)
      .then((cancel) => cancel && abort.abort())
      .catch(() => undefined);
  }, CANCEL_POLL_MS);
  const log = (outcome: "done" | "failed" | "cancelled", err?: string) => {
    const durationMs = Math.round(performance.now() - started);
    observeJob(FE_QUEUE, outcome === "done" ? "done" : "failed", durationMs / 1000);
    getLogger()[outcome === "done" ? "info" : "warn"](
      {
        queue: FE_QUEUE,
        jobId: feCheckId,
        organizationId: row.organization_id,
        outcome,
        attempt: row.attempts,
        durationMs,
        ...(err ? { err } : {}),
      },
      "job",
    );
  };
  try {
    const result = await runFeCheck(row.document as JointDesign, {
      signal: abort.signal,
      timeLimitMs: getEnv().FE_TIME_LIMIT_SECONDS * 1000,
      onProgress: async (stage, progress) => {
        const { cancelRequested } = await setFeProgress(db, feCheckId, stage, progress);
        if (cancelRequested) abort.abort();
      },
    });
    if (result.documentHash !== row.document_hash)
      throw new FeRunError(
        "The revision's document changed while it was read; run the FE cross-check again.",
      );
    await finishFeCheck(db, feCheckId, result);
    log("done");
  } catch (error) {
    if (error instanceof CcxCancelled || abort.signal.aborted) {
      await endFeCheck(db, feCheckId, "cancelled", "Cancelled while running; nothing was stored.");
      log("cancelled");
    } else {
      const message =
        error instanceof FeRunError
          ? error.message
          : `The FE cross-check could not finish: ${errorText(error)}`;
      await endFeCheck(db, feCheckId, "failed", message);
      log("failed", errorText(error));
    }
  } finally {
    clearInterval(poll);
  }
}

/** This process's FE workers (FE_WORKERS of them; none when 0). */
export async function ensureFeWorker(db: Kysely<Database>): Promise<void> {
  await ensureWorker<FeJobData>(FE_QUEUE, (job) => runFeJob(db, job.data.feCheckId), getEnv().FE_WORKERS);
}

/** Records a run of the revision's current document and queues it; returns its id. */
export async function enqueueFeCheck(db: Kysely<Database>, input: NewFeCheck): Promise<string> {
  const id = await createFeCheck(db, input);
  try {
    await ensureFeWorker(db);
    const boss = await getQueue();
    await boss.send(FE_QUEUE, { feCheckId: id } satisfies FeJobData, { id });
  } catch (error) {
    await endFeCheck(db, id, "failed", `Could not queue the FE cross-check: ${errorText(error)}`);
  }
  return id;
}
