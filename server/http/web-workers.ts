import "server-only";

// What each web worker of the launcher (scripts/serve.ts) runs, worked out once from the
// instance's settings: the launcher passes each `next start` process its own environment.
// - Queue and FE cross-check workers (JOB_WORKERS, FE_WORKERS) run in worker 1 only: pg-boss is
//   safe with several instances, but an FE worker keeps a core busy, and N of them would take
//   every core of a small machine from the web workers.
// - The PostgreSQL pool (DATABASE_POOL_MAX) is the instance's budget, split evenly (at least 2
//   per process), so N workers open no more connections than one process did.
// - The analysis threads (ANALYSIS_WORKERS per process when set) default to the cores one
//   process would leave after its request thread, divided between the workers, at least 1 each.

export interface WebWorkerSettings {
  /** WEB_WORKERS, or the machine's cores when unset. */
  workers: number;
  cores: number;
  databasePoolMax: number;
  jobWorkers: number;
  feWorkers: number;
  /** ANALYSIS_WORKERS when set (then per process, as without the launcher). */
  analysisWorkers?: number;
}

/** The settings of web worker n (1-based), as environment variables. */
export type WebWorkerEnv = Record<
  "SEALPITCH_WEB_WORKER" | "JOB_WORKERS" | "FE_WORKERS" | "DATABASE_POOL_MAX" | "ANALYSIS_WORKERS",
  string
>;

export function webWorkerPlan(settings: WebWorkerSettings): WebWorkerEnv[] {
  const { workers, cores } = settings;
  const pool = Math.max(2, Math.ceil(settings.databasePoolMax / workers));
  const analysis = settings.analysisWorkers ?? Math.max(1, Math.floor((cores - 1) / workers));
  return Array.from({ length: workers }, (_, index) => ({
    SEALPITCH_WEB_WORKER: String(index + 1),
    JOB_WORKERS: String(index === 0 ? settings.jobWorkers : 0),
    FE_WORKERS: String(index === 0 ? settings.feWorkers : 0),
    DATABASE_POOL_MAX: String(pool),
    ANALYSIS_WORKERS: String(analysis),
  }));
}

// The launcher's metrics messages over the cluster's IPC channel (server/metrics/web-workers.ts).
export const METRICS_GATHER = "sealpitch:metrics:gather";
export const METRICS_COLLECT = "sealpitch:metrics:collect";
export const METRICS_PART = "sealpitch:metrics:part";
export const METRICS_WHOLE = "sealpitch:metrics:whole";

export type MetricsMessage =
  | { type: typeof METRICS_GATHER; id: string }
  | { type: typeof METRICS_COLLECT; id: string }
  | { type: typeof METRICS_PART; id: string; metrics: unknown[] }
  | { type: typeof METRICS_WHOLE; id: string; body: string; contentType: string };
