import "server-only";
import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import path from "node:path";
import { MessageChannel } from "node:worker_threads";
import { Piscina } from "piscina";
import type { JointDesign } from "@/features/analysis/core/design";
import { DesignRefusedError } from "@/features/analysis/core/validate";
import { parseEnvKeys } from "@/server/env";
import { countAnalysisRefusal as countRefusal } from "@/server/metrics/registry";
import type { SuggestionRequest } from "@/features/analysis/core/suggest/request";
import { SuggestionRefusedError } from "@/features/analysis/core/suggest/search";
import type { AnalysisTask, AnalysisTaskResult, SuggestionTask } from "./worker-protocol";

// Every analysis the server computes (the stateless API, saves and creates, submit for review,
// the seed) runs here, on a pool of worker threads (piscina), never on the request thread: a
// heavy analysis occupies one worker while pages, /api/health and other requests go on. Each task
// has a time limit, counted from the moment a worker starts on it; a task past it is stopped by
// terminating its thread, and piscina starts a fresh one. Tasks beyond what the workers can take
// wait in a bounded queue; past that bound a request is refused at once instead of piling up.
// The worker file is the core bundled by scripts/build-workers.mjs (.build/analysis-worker.mjs).

/** The error a route answers with 503 and an action with a refusal: nothing was computed or stored. */
export class AnalysisUnavailableError extends Error {
  override name = "AnalysisUnavailableError";
  constructor(
    message: string,
    readonly reason: "time-limit" | "busy",
  ) {
    super(message);
  }
}

export interface AnalysisPoolOptions {
  /** Worker threads (fixed: all started at once and kept). */
  workers: number;
  /** Longest a task may run in its worker. */
  timeLimitMs: number;
  /** Tasks that may wait for a worker before new ones are refused. */
  maxQueue?: number;
  /** The worker module; the bundled analysis worker by default (tests pass their own). */
  filename?: string;
}

export interface AnalysisPool {
  /** Runs `task` (minus its `started` port, which the pool adds) in a worker. */
  run<R>(task: Record<string, unknown>): Promise<R>;
  readonly options: Readonly<Required<AnalysisPoolOptions>>;
  /** Threads alive now (piscina replaces a terminated one). */
  threadIds(): number[];
  /** Tasks a worker is on, and tasks waiting for one. */
  stats(): { running: number; queued: number };
  close(): Promise<void>;
}

export const ANALYSIS_WORKER_FILE = path.join(process.cwd(), ".build", "analysis-worker.mjs");

/** One fewer than the machine's cores (the request thread keeps one), at least 1. */
export function defaultAnalysisWorkers(cores = availableParallelism()): number {
  return Math.max(1, cores - 1);
}

/**
 * Outside production the worker is rebuilt when a process first needs it, so `next dev`, vitest
 * and the scripts always run the current core; a production process builds it only when
 * missing (`npm run build` and the start and test scripts make it beforehand).
 */
function ensureWorkerFile(production: boolean): void {
  if (production && existsSync(ANALYSIS_WORKER_FILE)) return;
  execFileSync(process.execPath, [path.join(process.cwd(), "scripts", "build-workers.mjs")], {
    stdio: ["ignore", "ignore", "inherit"],
  });
}

function timeLimitMessage(limitMs: number): string {
  const limit = limitMs >= 1000 ? `${limitMs / 1000} s` : `${limitMs} ms`;
  return `The analysis took longer than the server's limit of ${limit} per analysis and was stopped; nothing was stored. Lower the samples per pitch or the heat-map grid, or try again when the server is less busy.`;
}

const BUSY_MESSAGE =
  "The server is busy with other analyses and cannot take this one now; nothing was stored. Try again in a few seconds.";

export function createAnalysisPool(options: AnalysisPoolOptions): AnalysisPool {
  const filled: Required<AnalysisPoolOptions> = {
    filename: ANALYSIS_WORKER_FILE,
    maxQueue: Math.max(16, options.workers * 8),
    ...options,
  };
  const piscina = new Piscina({
    filename: filled.filename,
    minThreads: filled.workers,
    maxThreads: filled.workers,
    idleTimeout: Number.POSITIVE_INFINITY,
    name: "default",
  });
  // A worker whose thread dies mid-task rejects that task; piscina replaces the thread. The
  // event keeps such an exit from being an unhandled 'error' on the pool.
  piscina.on("error", () => {});

  // Counted here rather than with piscina's maxQueue, which stops counting right after a thread
  // was replaced.
  let running = 0;
  let outstanding = 0;
  async function run<R>(task: Record<string, unknown>): Promise<R> {
    if (outstanding >= filled.workers + filled.maxQueue) {
      countRefusal("busy");
      throw new AnalysisUnavailableError(BUSY_MESSAGE, "busy");
    }
    outstanding++;
    const { port1, port2 } = new MessageChannel();
    const controller = new AbortController();
    let timer: NodeJS.Timeout | undefined;
    let timedOut = false;
    let started = false;
    port1.once("message", () => {
      started = true;
      running++;
      timer = setTimeout(() => {
        timedOut = true;
        controller.abort();
      }, filled.timeLimitMs);
    });
    try {
      return (await piscina.run({ ...task, started: port2 } satisfies Partial<AnalysisTask>, {
        transferList: [port2],
        signal: controller.signal,
      })) as R;
    } catch (error) {
      if (timedOut) {
        countRefusal("time-limit");
        throw new AnalysisUnavailableError(timeLimitMessage(filled.timeLimitMs), "time-limit");
      }
      throw error;
    } finally {
      outstanding--;
      clearTimeout(timer);
      port1.close();
      if (started) running--;
    }
  }

  return {
    run,
    options: filled,
    threadIds: () => piscina.threads.map((t) => t.threadId),
    stats: () => ({ running, queued: outstanding - running }),
    close: () => piscina.close({ force: true }),
  };
}

declare global {
  var sealpitchAnalysisPool: AnalysisPool | undefined;
}

/** The process's pool, made on first use from ANALYSIS_WORKERS and ANALYSIS_TIME_LIMIT_MS. */
export function getAnalysisPool(): AnalysisPool {
  if (!globalThis.sealpitchAnalysisPool) {
    const env = parseEnvKeys(["NODE_ENV", "ANALYSIS_WORKERS", "ANALYSIS_TIME_LIMIT_MS"]);
    ensureWorkerFile(env.NODE_ENV === "production");
    globalThis.sealpitchAnalysisPool = createAnalysisPool({
      workers: env.ANALYSIS_WORKERS ?? defaultAnalysisWorkers(),
      timeLimitMs: env.ANALYSIS_TIME_LIMIT_MS,
    });
  }
  return globalThis.sealpitchAnalysisPool;
}

/** The process's pool if one was made (the metrics scrape does not start one). */
export function peekAnalysisPool(): AnalysisPool | undefined {
  return globalThis.sealpitchAnalysisPool;
}

/** Stops the process's pool (scripts and tests; the server keeps it for its lifetime). */
export async function closeAnalysisPool(): Promise<void> {
  const pool = globalThis.sealpitchAnalysisPool;
  globalThis.sealpitchAnalysisPool = undefined;
  await pool?.close();
}

/**
 * `JSON.stringify(analyzeJoint(document))`, computed in a worker: the same text, bit for bit.
 * Throws the core's DesignRefusedError for a design it refuses, AnalysisUnavailableError past the
 * time limit or when every worker and the queue are taken.
 */
export async function analyzeInWorker(document: JointDesign): Promise<string> {
  const outcome = await getAnalysisPool().run<AnalysisTaskResult>({ document });
  if (!outcome.ok) throw new DesignRefusedError(outcome.issues, outcome.prefix);
  return outcome.json;
}

/**
 * `JSON.stringify(suggestPatterns(request))`, computed in a worker under the same time limit as
 * an analysis (a search is many analyses). Throws SuggestionRefusedError for a request the core
 * cannot run, AnalysisUnavailableError past the limit (with a message about narrowing the search)
 * or when the pool is full.
 */
export async function suggestInWorker(request: SuggestionRequest): Promise<string> {
  let outcome: AnalysisTaskResult;
  try {
    outcome = await getAnalysisPool().run<AnalysisTaskResult>({
      suggestion: request,
    } satisfies Omit<SuggestionTask, "started">);
  } catch (error) {
    if (error instanceof AnalysisUnavailableError && error.reason === "time-limit") {
      const ms = getAnalysisPool().options.timeLimitMs;
      const limit = ms >= 1000 ? `${ms / 1000} s` : `${ms} ms`;
      throw new AnalysisUnavailableError(
        `The pattern search took longer than the server's limit of ${limit} and was stopped. Allow fewer sizes, materials or offsets, lower maxAnalyses, or try again when the server is less busy.`,
        "time-limit",
      );
    }
    throw error;
  }
  if (!outcome.ok) throw new SuggestionRefusedError(outcome.issues, outcome.prefix);
  return outcome.json;
}
