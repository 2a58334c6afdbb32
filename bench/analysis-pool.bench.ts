/**
 * The request thread during a heavy analysis (512 bolts × 128 samples per pitch, the work cap):
 * the longest gap between 1 ms timer ticks, which is how long a request such as /api/health
 * would wait. In-thread (how the server ran analyses before the pool) the loop stops for the
 * whole calculation and its JSON; through the pool (server/analysis/pool.ts) it keeps turning.
 */
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { closeAnalysisPool, createAnalysisPool } from "@/server/analysis/pool";
import { heavyDesign, lightDesign } from "@/tests/setup/analysis-designs";
import { printMedian } from "./measure";
import { figure, formatMs } from "./report";

async function longestGapMs(work: () => Promise<unknown>): Promise<{ gap: number; total: number }> {
  let last = performance.now();
  let gap = 0;
  const ticker = setInterval(() => {
    const now = performance.now();
    gap = Math.max(gap, now - last);
    last = now;
  }, 1);
  const started = performance.now();
  await new Promise((resolve) => setTimeout(resolve, 5));
  await work();
  const total = performance.now() - started;
  await new Promise((resolve) => setTimeout(resolve, 5));
  clearInterval(ticker);
  return { gap: Math.max(gap, performance.now() - last), total };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export async function run(): Promise<void> {
  const heavy = heavyDesign();
  const pool = createAnalysisPool({ workers: 1, timeLimitMs: 60_000 });
  await pool.run({ document: lightDesign() });
  const n = 5;
  const cases: [string, () => Promise<unknown>][] = [
    ["in-thread analyzeJoint + JSON (before the pool)", async () => JSON.stringify(analyzeJoint(heavy))],
    ["through the analysis pool", () => pool.run({ document: heavy })],
  ];
  const stalls: number[] = [];
  const totals: number[] = [];
  for (const [label, work] of cases) {
    await work();
    const runs: { gap: number; total: number }[] = [];
    for (let i = 0; i < n; i++) runs.push(await longestGapMs(work));
    totals.push(median(runs.map((r) => r.total)));
    stalls.push(median(runs.map((r) => r.gap)));
    printMedian("analysis-pool", `heavy analysis, ${label}: total`, totals.at(-1)!, n);
    printMedian("analysis-pool", `  request thread's longest stall`, stalls.at(-1)!, n);
  }
  figure(
    "Request thread's longest stall during a heavy analysis (512 bolts × 128 samples), through the pool",
    `${formatMs(stalls[1])}; the analysis took ${formatMs(totals[1])} (medians of ${n})`,
    {
      ratio: `in-thread in the same run: ${formatMs(stalls[0])} (${((100 * stalls[1]) / stalls[0]).toFixed(1)} %)`,
    },
  );
  await pool.close();
  await closeAnalysisPool();
}
