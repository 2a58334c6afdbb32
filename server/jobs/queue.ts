import "server-only";
import PgBoss from "pg-boss";
import { getEnv } from "@/server/env";
import { errorText, getLogger } from "@/server/log/logger";

// The one pg-boss instance of this process, on the app's own PostgreSQL (schema "pgboss"). The
// runtime role may not create tables, so the schema and the queues are installed by
// `npm run db:migrate` as the owner (db/job-queues.ts); here pg-boss only checks that they are
// current. Started lazily, the first time a route needs the queue, so `next build` and pages that
// never export touch nothing. Kept on globalThis so that development hot reloads do not start a
// second instance.
declare global {
  var sealpitchBoss: Promise<PgBoss> | undefined;
  var sealpitchWorkers: Set<string> | undefined;
}

export { SHEET_DEAD_LETTER_QUEUE, SHEET_QUEUE } from "@/db/job-queues";

async function startBoss(): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: getEnv().DATABASE_URL,
    max: 3,
    application_name: "sealpitch-jobs",
    // The schema is the migration's job; no cron schedules; maintenance (expiry, archiving) stays on,
    // every 30 s rather than pg-boss's 120 s, so a job whose worker died is retried soon after it
    // expires (one instance runs it per interval, whichever gets there first).
    migrate: false,
    schedule: false,
    maintenanceIntervalSeconds: 30,
  });
  boss.on("error", (error: Error) => getLogger().error({ event: "jobs", err: error.message }, "queue error"));
  await boss.start();
  return boss;
}

/** The started queue (a failed start is forgotten, so the next call tries again). */
export function getQueue(): Promise<PgBoss> {
  if (!globalThis.sealpitchBoss) {
    globalThis.sealpitchBoss = startBoss().catch((error) => {
      globalThis.sealpitchBoss = undefined;
      throw error;
    });
  }
  return globalThis.sealpitchBoss;
}

/** Registers `count` workers for `name` once per process (none when count is 0). */
export async function ensureWorker<T extends object>(
  name: string,
  handler: (job: PgBoss.JobWithMetadata<T>) => Promise<void>,
  count: number = getEnv().JOB_WORKERS,
): Promise<void> {
  const workers = (globalThis.sealpitchWorkers ??= new Set());
  if (workers.has(name) || count < 1) return;
  workers.add(name);
  try {
    const boss = await getQueue();
    for (let i = 0; i < count; i++) {
      await boss.work<T>(
        name,
        { pollingIntervalSeconds: 0.5, batchSize: 1, includeMetadata: true },
        async (jobs) => {
          for (const job of jobs) await handler(job);
        },
      );
    }
  } catch (error) {
    workers.delete(name);
    throw error;
  }
}

/** One queue's workers as a feature registers them (its `ensure…Worker`), named for the log. */
export interface QueueWorkers {
  queue: string;
  ensure: () => Promise<void>;
}

/**
 * Server start (instrumentation.ts): registers every queue's workers without blocking the start.
 * Each queue is started on its own; one whose database is down is retried every `retryMs` until
 * it answers, and the others do not wait for it.
 */
export function startQueueWorkers(all: readonly QueueWorkers[], retryMs = 5000): void {
  for (const workers of all) {
    const attempt = (): void => {
      // The executor runs ensure() at once, and turns a synchronous throw into a rejection too.
      new Promise<void>((resolve) => resolve(workers.ensure())).catch((error: unknown) => {
        // The retry is scheduled first, and a logger that throws (a closed or full log stream)
        // is caught here: either would otherwise leave this rejection unhandled, which ends a
        // Node process, and the queue would never be retried.
        setTimeout(attempt, retryMs).unref();
        try {
          getLogger().warn(
            { event: "jobs", queue: workers.queue, err: errorText(error) },
            "queue workers not started, retrying",
          );
        } catch (logError) {
          // stderr reports its own write errors as events, never by throwing.
          process.stderr.write(
            `queue workers of ${workers.queue} not started (${errorText(error)}); logging failed: ${errorText(logError)}\n`,
          );
        }
      });
    };
    attempt();
  }
}

/** Stops the queue of this process (tests and scripts; the server keeps it for its lifetime). */
export async function stopQueue(): Promise<void> {
  const pending = globalThis.sealpitchBoss;
  globalThis.sealpitchBoss = undefined;
  globalThis.sealpitchWorkers = undefined;
  if (pending) await (await pending).stop({ graceful: true, wait: true, timeout: 5000 });
}
