// The web launcher: `npm start` and the bench and test stacks run the production server as
// `tsx scripts/serve.ts -H HOST -p PORT`. It starts WEB_WORKERS `next start` processes (unset: the
// machine's cores) through Node's cluster module, so they share one port: this primary process
// accepts each connection and hands it to the workers in turn, and each worker is Next's own
// `next start`, unchanged (same request handling, headers, cookies, logs). One process cannot use
// more than one core for Next's request handling; the app keeps no state in a process that
// another needs (sessions, the queue and the sign-in limits are rows in PostgreSQL).
// Each worker's settings come from webWorkerPlan (server/http/web-workers.ts): queue and FE
// workers in worker 1 only, the connection budget and the analysis threads divided.
// A worker that stops after it was serving is replaced; one that stops before it ever listened
// (a bad setting, the port taken) stops the launcher with its exit code. SIGTERM or SIGINT
// (`npm run stop`, Ctrl-C) is passed to every worker, which finish their requests and exit;
// the launcher exits after them.
import cluster, { type Worker } from "node:cluster";
import { createRequire } from "node:module";
import { availableParallelism } from "node:os";
import { AggregatorRegistry } from "prom-client";
import { parseEnvKeys } from "@/server/env";
import {
  METRICS_COLLECT,
  METRICS_GATHER,
  METRICS_PART,
  METRICS_WHOLE,
  webWorkerPlan,
  type MetricsMessage,
  type WebWorkerEnv,
} from "@/server/http/web-workers";

const STOP_GRACE_MS = 10_000;
const RESPAWN_DELAY_MS = 1000;
const PART_TIMEOUT_MS = 3000;

function say(text: string): void {
  console.log(`sealpitch: ${text}`);
}

function main(): void {
  const args = process.argv.slice(2);
  const settings = parseEnvKeys([
    "WEB_WORKERS",
    "DATABASE_POOL_MAX",
    "JOB_WORKERS",
    "FE_WORKERS",
    "ANALYSIS_WORKERS",
  ]);
  const cores = availableParallelism();
  const plan = webWorkerPlan({
    workers: settings.WEB_WORKERS ?? cores,
    cores,
    databasePoolMax: settings.DATABASE_POOL_MAX,
    jobWorkers: settings.JOB_WORKERS,
    feWorkers: settings.FE_WORKERS,
    analysisWorkers: settings.ANALYSIS_WORKERS,
  });
  const nextBin = createRequire(import.meta.url).resolve("next/dist/bin/next");
  // The workers run Next's own command line in plain Node (not under tsx).
  cluster.setupPrimary({ exec: nextBin, args: ["start", ...args], execArgv: [] });

  const listening = new Set<Worker>();
  const slotOf = new Map<Worker, WebWorkerEnv>();
  let stopping = false;

  const fork = (env: WebWorkerEnv): void => {
    const worker = cluster.fork(env);
    slotOf.set(worker, env);
    say(
      `web worker ${env.SEALPITCH_WEB_WORKER} of ${plan.length} (pid ${worker.process.pid}): queue workers ${env.JOB_WORKERS}, FE workers ${env.FE_WORKERS}, analysis threads ${env.ANALYSIS_WORKERS}, pool ${env.DATABASE_POOL_MAX} connections`,
    );
  };

  cluster.on("listening", (worker) => listening.add(worker));
  cluster.on("exit", (worker, code, signal) => {
    const env = slotOf.get(worker)!;
    slotOf.delete(worker);
    const served = listening.delete(worker);
    if (stopping) {
      if (slotOf.size === 0) process.exit(process.exitCode ?? 0);
      return;
    }
    const how = signal ? `signal ${signal}` : `code ${code}`;
    if (!served) {
      say(`web worker ${env.SEALPITCH_WEB_WORKER} stopped before it served (${how}); stopping`);
      stop();
      process.exitCode = code || 1;
      if (slotOf.size === 0) process.exit(process.exitCode);
      return;
    }
    say(`web worker ${env.SEALPITCH_WEB_WORKER} stopped (${how}); starting a new one`);
    setTimeout(() => stopping || fork(env), RESPAWN_DELAY_MS);
  });

  const stop = (): void => {
    if (stopping) return;
    stopping = true;
    for (const worker of slotOf.keys()) worker.process.kill("SIGTERM");
    setTimeout(() => {
      for (const worker of slotOf.keys()) worker.process.kill("SIGKILL");
      process.exit(process.exitCode ?? 0);
    }, STOP_GRACE_MS).unref();
  };
  // A scrape of /api/metrics reaches one worker, which asks here for every worker's metrics
  // (server/metrics/web-workers.ts); a worker that does not answer in time is left out.
  const partOf = (worker: Worker, id: string): Promise<unknown[] | undefined> =>
    new Promise((resolve) => {
      const done = (metrics: unknown[] | undefined) => {
        clearTimeout(timer);
        worker.off("message", onMessage);
        resolve(metrics);
      };
      const onMessage = (message: MetricsMessage) => {
        if (message?.type === METRICS_PART && message.id === id) done(message.metrics);
      };
      const timer = setTimeout(() => done(undefined), PART_TIMEOUT_MS);
      worker.on("message", onMessage);
      worker.send({ type: METRICS_COLLECT, id } satisfies MetricsMessage);
    });
  cluster.on("message", (from, message: MetricsMessage) => {
    if (message?.type !== METRICS_GATHER) return;
    void (async () => {
      const parts = await Promise.all([...listening].map((worker) => partOf(worker, message.id)));
      const registry = AggregatorRegistry.aggregate(parts.filter((part) => part !== undefined) as never);
      from.send({
        type: METRICS_WHOLE,
        id: message.id,
        body: await registry.metrics(),
        contentType: registry.contentType,
      } satisfies MetricsMessage);
    })().catch((error: unknown) => say(`metrics of the web workers could not be added up: ${String(error)}`));
  });

  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);

  for (const env of plan) fork(env);
}

main();
