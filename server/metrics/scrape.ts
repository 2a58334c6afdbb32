import "server-only";
import { sql } from "kysely";
import { getDb, getPoolStats } from "@/db/index";
import { getEnv } from "@/server/env";
import { peekAnalysisPool } from "@/server/analysis/pool";
import { SHEET_QUEUE } from "@/server/jobs/queue";
import { getMetrics } from "./registry";
import { gatherFromWebWorkers } from "./web-workers";

/**
 * The exposition text of this process, or under the web launcher (scripts/serve.ts) of every web
 * worker summed (server/metrics/web-workers.ts): counters and histograms add up, the gauges of
 * the pools too, the queue depth is one count.
 */
export async function renderMetrics(): Promise<{ body: string; contentType: string }> {
  const whole = await gatherFromWebWorkers();
  if (whole) return whole;
  const metrics = getMetrics();
  await fillScrapeGauges();
  return { body: await metrics.registry.metrics(), contentType: metrics.registry.contentType };
}

/** Fills the scrape-time gauges (pool use, queue depth) of this process. */
export async function fillScrapeGauges(): Promise<void> {
  const metrics = getMetrics();
  const pool = getPoolStats();
  metrics.poolConnections.set({ state: "total" }, pool.total);
  metrics.poolConnections.set({ state: "idle" }, pool.idle);
  metrics.poolConnections.set({ state: "waiting" }, pool.waiting);
  metrics.poolConnections.set({ state: "max" }, getEnv().DATABASE_POOL_MAX);
  const analysisPool = peekAnalysisPool();
  const tasks = analysisPool?.stats() ?? { running: 0, queued: 0 };
  metrics.analysisPool.set({ state: "workers" }, analysisPool?.options.workers ?? 0);
  metrics.analysisPool.set({ state: "running" }, tasks.running);
  metrics.analysisPool.set({ state: "queued" }, tasks.queued);
  try {
    const { rows } = await sql<{ state: string; jobs: number }>`
      select state::text as state, count(*)::int as jobs from pgboss.job
      where name = ${SHEET_QUEUE} and state in ('created', 'retry', 'active') group by state`.execute(
      getDb(),
    );
    const count = (states: string[]) =>
      rows.filter((row) => states.includes(row.state)).reduce((sum, row) => sum + row.jobs, 0);
    metrics.queueDepth.set({ queue: SHEET_QUEUE, state: "queued" }, count(["created", "retry"]));
    metrics.queueDepth.set({ queue: SHEET_QUEUE, state: "active" }, count(["active"]));
  } catch {
    // Queue tables not there yet (no job ever queued) or the database is down: the gauges keep
    // their last values and readiness says what is wrong.
  }
}
