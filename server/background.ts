import "server-only";
import { getDb } from "@/db/index";
import { ensureSheetWorker } from "@/server/jobs/sheet-job";

// The background services of a server process, started once from instrumentation.ts. Nothing
// here blocks the start: a database that is down is retried until it answers.
const RETRY_MS = 5000;

export function startBackgroundServices(): void {
  const startWorkers = () => {
    ensureSheetWorker(getDb()).catch((error: unknown) => {
      console.error(
        `[jobs] workers not started, retrying: ${error instanceof Error ? error.message : String(error)}`,
      );
      setTimeout(startWorkers, RETRY_MS).unref();
    });
  };
  startWorkers();
}
