import type { Instrumentation } from "next";

// Next.js calls register() once when a server process starts (not during `next build`), and
// onRequestError() for any error that escapes a page, action or route. The Node.js side starts
// this process's background services: the sheet-queue and FE cross-check workers (so queued jobs resume after a
// restart without waiting for a request), the readiness refresh behind /api/health and, under the
// web launcher, the answer to the launcher's metrics requests; escaped
// errors become JSON log lines. NEXT_RUNTIME is set by Next itself and read here (not in
// server/env.ts) because the bundler must see it literally to leave the Node-only imports out
// of the edge bundle.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const [
    { getDb },
    { SHEET_QUEUE, FE_QUEUE },
    { startQueueWorkers },
    { ensureSheetWorker },
    { ensureFeWorker },
    { startReadinessRefresh },
    { answerMetricsCollects },
    { fillScrapeGauges },
  ] = await Promise.all([
    import("./db/index"),
    import("./db/job-queues"),
    import("./server/jobs/queue"),
    import("./features/exports/sheet-job"),
    import("./features/fe-check/fe-job"),
    import("./features/health/readiness"),
    import("./server/metrics/web-workers"),
    import("./server/metrics/scrape"),
  ]);
  const db = getDb();
  // Every queue of the app, in one list: a new queue's workers are added here.
  startQueueWorkers([
    { queue: SHEET_QUEUE, ensure: () => ensureSheetWorker(db) },
    { queue: FE_QUEUE, ensure: () => ensureFeWorker(db) },
  ]);
  startReadinessRefresh();
  // Under the web launcher (scripts/serve.ts): this worker's part of a scrape of all workers.
  answerMetricsCollects(fillScrapeGauges);
}

export const onRequestError: Instrumentation.onRequestError = async (error, request, context) => {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { getLogger, errorText } = await import("./server/log/logger");
  const requestId = request.headers["x-request-id"];
  getLogger().error(
    {
      reqId: typeof requestId === "string" ? requestId : undefined,
      method: request.method,
      route: context.routePath,
      routeType: context.routeType,
      err: errorText(error),
      digest: (error as { digest?: string }).digest,
    },
    "unhandled error",
  );
};
