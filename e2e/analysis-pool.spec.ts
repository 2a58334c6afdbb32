import { randomUUID } from "node:crypto";
import { rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { ChildProcess } from "node:child_process";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { heavyDesign, lightDesign } from "../tests/setup/analysis-designs";
import { startInstance, stopInstances, waitReady } from "./helpers/app-instance";
import { DEMO_PASSWORD } from "./helpers/sign-in";
import { expect, test, type Page } from "./helpers/test";

// Analyses run on the server's worker-thread pool (server/analysis/pool.ts), over real HTTP
// against two `next start` instances of this build on the test database: P with two analysis
// workers and the default time limit, T with one worker and a 100 ms limit (the heavy design
// takes 0.2–0.9 s in a worker, the light one a few ms). Ordering, not timings, is asserted:
// while a heavy analysis is running (the pool's own gauge says so), /api/health and a light
// analysis answer before it does.
const basePort = Number(new URL(process.env.APP_URL ?? "http://127.0.0.1:3100").port);
const P = `http://127.0.0.1:${basePort + 40}`;
const T = `http://127.0.0.1:${basePort + 41}`;
const METRICS_TOKEN = `metrics-${randomUUID()}`;
const DESIGNER = "dana.designer@kestrel-ridge.example";

const instances: ChildProcess[] = [];
const logs: string[] = [];

test.beforeAll(async () => {
  test.setTimeout(180_000);
  for (const [origin, extra] of [
    [P, { ANALYSIS_WORKERS: "2" }],
    [T, { ANALYSIS_WORKERS: "1", ANALYSIS_TIME_LIMIT_MS: "100" }],
  ] as const) {
    const log = path.join(tmpdir(), `sealpitch-analysis-pool-${new URL(origin).port}-${randomUUID()}.log`);
    logs.push(log);
    instances.push(
      startInstance(
        origin,
        {
          ...process.env,
          APP_URL: origin,
          JOB_WORKERS: "0",
          METRICS_TOKEN,
          NODE_ENV: "production",
          ...extra,
        },
        log,
      ),
    );
  }
  await Promise.all([waitReady(P, instances[0]!), waitReady(T, instances[1]!)]);
});

test.afterAll(async () => {
  await stopInstances(instances);
  for (const log of logs) rmSync(log, { force: true });
});

async function sessionCookie(page: Page, origin: string): Promise<string> {
  await page.goto(`${origin}/sign-in`);
  await page.getByLabel("E-mail").fill(DESIGNER);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/desk$/);
  return (await page.context().cookies(origin)).map((c) => `${c.name}=${c.value}`).join("; ");
}

const analyse = (origin: string, cookie: string, document: unknown) =>
  fetch(`${origin}/api/v1/analyses`, {
    method: "POST",
    headers: { cookie, origin, "content-type": "application/json" },
    body: JSON.stringify(document),
  });

async function poolGauge(origin: string, state: "running" | "queued" | "workers"): Promise<number> {
  const text = await (
    await fetch(`${origin}/api/metrics`, { headers: { authorization: `Bearer ${METRICS_TOKEN}` } })
  ).text();
  const line = new RegExp(`^sealpitch_analysis_pool_tasks\\{state="${state}"\\} (\\d+)$`, "m").exec(text);
  return line ? Number(line[1]) : -1;
}

test("a heavy analysis does not hold up /api/health or a light analysis, and its result is the in-thread one", async ({
  page,
}) => {
  test.setTimeout(120_000);
  const cookie = await sessionCookie(page, P);
  const heavy = heavyDesign();
  const light = lightDesign();
  // Both workers have loaded the bundle (each new thread also warms up on an example).
  await Promise.all([analyse(P, cookie, light), analyse(P, cookie, light)]);
  expect(await poolGauge(P, "workers")).toBe(2);

  const order: string[] = [];
  const started = performance.now();
  const heavyDone = analyse(P, cookie, heavy).then(async (response) => {
    order.push("heavy");
    return { status: response.status, text: await response.text(), ms: performance.now() - started };
  });
  // Wait until a worker is on the heavy analysis, then ask for the two light things.
  await expect.poll(() => poolGauge(P, "running"), { intervals: [5], timeout: 20_000 }).toBe(1);
  const healthStarted = performance.now();
  const health = await fetch(`${P}/api/health`);
  const healthMs = performance.now() - healthStarted;
  order.push("health");
  expect(health.status).toBe(200);
  const lightStarted = performance.now();
  const lightResponse = await analyse(P, cookie, light);
  const lightMs = performance.now() - lightStarted;
  order.push("light");
  expect(lightResponse.status).toBe(200);
  expect(await lightResponse.text()).toBe(JSON.stringify(analyzeJoint(light)));

  const done = await heavyDone;
  expect(order).toEqual(["health", "light", "heavy"]);
  expect(done.status).toBe(200);
  // Bit for bit the core's result computed here, in this thread.
  expect(done.text).toBe(JSON.stringify(analyzeJoint(heavy)));
  console.log(
    `analysis pool: heavy analysis ${Math.round(done.ms)} ms (${(done.text.length / 1e6).toFixed(1)} MB); while it ran /api/health took ${Math.round(healthMs)} ms and a light analysis ${Math.round(lightMs)} ms`,
  );
});

test("an analysis past the time limit is a 503 with the reason, and the next request works", async ({
  page,
}) => {
  test.setTimeout(120_000);
  const cookie = await sessionCookie(page, T);
  expect((await analyse(T, cookie, lightDesign())).status).toBe(200);

  const stopped = await analyse(T, cookie, heavyDesign());
  expect(stopped.status).toBe(503);
  expect(stopped.headers.get("retry-after")).toBe("5");
  expect(await stopped.json()).toEqual({
    error: {
      message:
        "The analysis took longer than the server's limit of 100 ms per analysis and was stopped; nothing was stored. Lower the samples per pitch or the heat-map grid, or try again when the server is less busy.",
      reason: "time-limit",
    },
  });

  // The stopped worker was replaced: the next analysis and the health check answer as usual.
  const next = await analyse(T, cookie, lightDesign());
  expect(next.status).toBe(200);
  expect(await next.text()).toBe(JSON.stringify(analyzeJoint(lightDesign())));
  expect((await fetch(`${T}/api/health`)).status).toBe(200);
  const metrics = await (
    await fetch(`${T}/api/metrics`, { headers: { authorization: `Bearer ${METRICS_TOKEN}` } })
  ).text();
  expect(metrics).toMatch(/^sealpitch_analysis_refusals_total\{reason="time-limit"\} 1$/m);
});
