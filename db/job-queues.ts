import type PgBoss from "pg-boss";

// The job queues and their options, in one place: `npm run db:migrate` creates or updates them as
// the owner role (creating a queue creates a table, which the runtime role may not do), and the app
// only sends to and works on them.
export const SHEET_QUEUE = "spacing-sheet";
export const FE_QUEUE = "fe-check";
/** Longest an FE cross-check job may run before the queue counts its worker as lost. */
export const FE_JOB_EXPIRE_SECONDS = 15 * 60;

export const QUEUE_DEFINITIONS: { name: string; options: PgBoss.Queue }[] = [
  {
    name: SHEET_QUEUE,
    options: { name: SHEET_QUEUE, retryLimit: 0, expireInSeconds: 300, retentionMinutes: 24 * 60 },
  },
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
