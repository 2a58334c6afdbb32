import "server-only";
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from "prom-client";

// The process's Prometheus metrics (prom-client), served by /api/metrics when METRICS_TOKEN is
// set. Kept on globalThis: a metric registered twice throws, and development reloads re-evaluate
// modules. Gauges that need a look at the pool or the queue are filled by collectors at scrape
// time (server/metrics/scrape.ts), so nothing polls in between.
interface Metrics {
  registry: Registry;
  requestSeconds: Histogram<"route" | "method" | "status">;
  analysisSeconds: Histogram<"kind">;
  analysisPool: Gauge<"state">;
  analysisRefusals: Counter<"reason">;
  jobSeconds: Histogram<"queue" | "outcome">;
  jobFailures: Counter<"queue">;
  queueDepth: Gauge<"queue" | "state">;
  poolConnections: Gauge<"state">;
}

declare global {
  var sealpitchMetrics: Metrics | undefined;
}

function createMetrics(): Metrics {
  const registry = new Registry();
  collectDefaultMetrics({ register: registry, prefix: "sealpitch_" });
  return {
    registry,
    requestSeconds: new Histogram({
      name: "sealpitch_http_request_duration_seconds",
      help: "Route handler and server action time, by route pattern, method and status.",
      labelNames: ["route", "method", "status"],
      buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
      registers: [registry],
    }),
    analysisSeconds: new Histogram({
      name: "sealpitch_analysis_duration_seconds",
      help: "Time of one engineering-core analysis (analyzeJoint) on the server.",
      labelNames: ["kind"],
      buckets: [0.001, 0.0025, 0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5],
      registers: [registry],
    }),
    analysisPool: new Gauge({
      name: "sealpitch_analysis_pool_tasks",
      help: "The analysis worker pool of this process: its workers, the analyses running in them and those waiting.",
      labelNames: ["state"],
      registers: [registry],
    }),
    analysisRefusals: new Counter({
      name: "sealpitch_analysis_refusals_total",
      help: "Analyses stopped at the time limit (time-limit) or refused with every worker and the queue taken (busy).",
      labelNames: ["reason"],
      registers: [registry],
    }),
    jobSeconds: new Histogram({
      name: "sealpitch_job_duration_seconds",
      help: "Time of one background job, by queue and outcome.",
      labelNames: ["queue", "outcome"],
      buckets: [0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10, 30, 60],
      registers: [registry],
    }),
    jobFailures: new Counter({
      name: "sealpitch_job_failures_total",
      help: "Background jobs that ended in failure, by queue.",
      labelNames: ["queue"],
      registers: [registry],
    }),
    queueDepth: new Gauge({
      name: "sealpitch_queue_jobs",
      help: "Jobs in the queue by state (queued: waiting for a worker; active: being worked).",
      labelNames: ["queue", "state"],
      // Every web worker counts the same rows: across workers the figure is one count, not a sum.
      aggregator: "max",
      registers: [registry],
    }),
    poolConnections: new Gauge({
      name: "sealpitch_db_pool_connections",
      help: "The app's PostgreSQL pool of this process: total, idle and waiting clients, and its maximum.",
      labelNames: ["state"],
      registers: [registry],
    }),
  };
}

export function getMetrics(): Metrics {
  globalThis.sealpitchMetrics ??= createMetrics();
  return globalThis.sealpitchMetrics;
}

export function observeRequest(route: string, method: string, status: number, seconds: number): void {
  getMetrics().requestSeconds.observe({ route, method, status: String(status) }, seconds);
}

/** Times `work` as one analysis of the given kind ("stored", "stateless"). */
/** Times one analysis; `work` may return a promise (the analysis pool), timed until it settles. */
export async function timeAnalysis<T>(kind: string, work: () => Promise<T>): Promise<T> {
  const end = getMetrics().analysisSeconds.startTimer({ kind });
  try {
    return await work();
  } finally {
    end();
  }
}

export function countAnalysisRefusal(reason: "time-limit" | "busy"): void {
  getMetrics().analysisRefusals.inc({ reason });
}

export function observeJob(queue: string, outcome: "done" | "failed", seconds: number): void {
  const metrics = getMetrics();
  metrics.jobSeconds.observe({ queue, outcome }, seconds);
  if (outcome === "failed") metrics.jobFailures.inc({ queue });
}
