import type PgBoss from "pg-boss";

// The job queues and their options, in one place: `npm run db:migrate` creates or updates them as
// the owner role (creating a queue creates a table, which the runtime role may not do), and the app
// only sends to and works on them.
export const SHEET_QUEUE = "spacing-sheet";
/** Where pg-boss moves a sheet job that failed for good; its worker marks the export row failed. */
export const SHEET_DEAD_LETTER_QUEUE = "spacing-sheet-dead";
export const FE_QUEUE = "fe-check";
/** Longest an FE cross-check job may run before the queue counts its worker as lost. */
export const FE_JOB_EXPIRE_SECONDS = 15 * 60;

/**
 * A sheet takes seconds (the 96-bolt one about 0.2 s), so a job still active after
 * `expireInSeconds` belongs to a worker that died or hung: pg-boss's maintenance (every 30 s,
 * server/jobs/queue.ts) fails it, and it is tried again up to `retryLimit` times, 10 s and then
 * about 20 s later (backoff), by whichever worker is free. After the last attempt the job goes to
 * the dead-letter queue.
 */
export const SHEET_JOB_OPTIONS = {
  retryLimit: 2,
  retryDelay: 10,
  retryBackoff: true,
  expireInSeconds: 120,
  retentionMinutes: 24 * 60,
  deadLetter: SHEET_DEAD_LETTER_QUEUE,
} as const satisfies Omit<PgBoss.Queue, "name">;

// The dead-letter queue first: the sheet queue refers to it.
export const QUEUE_DEFINITIONS: { name: string; options: PgBoss.Queue }[] = [
  {
    name: SHEET_DEAD_LETTER_QUEUE,
    options: {
      name: SHEET_DEAD_LETTER_QUEUE,
      retryLimit: 5,
      retryDelay: 30,
      expireInSeconds: 60,
      retentionMinutes: 7 * 24 * 60,
    },
  },
  { name: SHEET_QUEUE, options: { name: SHEET_QUEUE, ...SHEET_JOB_OPTIONS } },
  {
    // One retry: a run whose worker died (expired) runs once more from the start on another worker.
    name: FE_QUEUE,
    options: {
      name: FE_QUEUE,
      retryLimit: 1,
      retryDelay: 5,
      expireInSeconds: FE_JOB_EXPIRE_SECONDS,
      retentionMinutes: 24 * 60,
    },
  },
];

/** Creates each queue when missing and brings the options of an existing one up to date. */
export async function installQueues(boss: PgBoss): Promise<void> {
  for (const { name, options } of QUEUE_DEFINITIONS) {
    if (await boss.getQueue(name)) await boss.updateQueue(name, options);
    else await boss.createQueue(name, options);
  }
}
