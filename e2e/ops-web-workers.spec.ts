import type { ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { readFileSync, rmSync } from "node:fs";
import { get } from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import { startWebLauncher, stopInstances, waitReady } from "./helpers/app-instance";
import { expect, test } from "./helpers/test";

// The web launcher (scripts/serve.ts) with two web workers on one port, over real HTTP against
// the test database: both workers answer, only worker 1 runs the queue workers, /api/metrics adds
// up every worker's counters whichever worker the scrape reaches, a worker that dies is replaced,
// and SIGTERM stops every worker and then the launcher.
const basePort = Number(new URL(process.env.APP_URL ?? "http://127.0.0.1:3100").port);
const W = `http://127.0.0.1:${basePort + 42}`;
const METRICS_TOKEN = `metrics-${randomUUID()}`;
const log = path.join(tmpdir(), `sealpitch-web-workers-${randomUUID()}.log`);
let launcher: ChildProcess;

test.beforeAll(async () => {
  test.setTimeout(180_000);
  launcher = startWebLauncher(
    W,
    {
      ...process.env,
      APP_URL: W,
      NODE_ENV: "production",
      WEB_WORKERS: "2",
      JOB_WORKERS: "1",
      FE_WORKERS: "0",
      LOG_LEVEL: "info",
      METRICS_TOKEN,
    },
    log,
  );
  await waitReady(W, launcher);
});

test.afterAll(async () => {
  await stopInstances([launcher]);
  rmSync(log, { force: true });
});

/** One GET on a connection of its own (the launcher hands connections, not requests, round). */
function getOnce(
  url: string,
  headers: Record<string, string> = {},
): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    get(url, { agent: false, headers }, (response) => {
      let body = "";
      response.setEncoding("utf8");
      response.on("data", (chunk: string) => (body += chunk));
      response.on("end", () => resolve({ status: response.statusCode ?? 0, body }));
    }).on("error", reject);
  });
}

/** The launcher's line per started worker: its number, pid and queue workers. */
function startedWorkers(): { n: number; pid: number; queueWorkers: number }[] {
  return [
    ...readFileSync(log, "utf8").matchAll(/web worker (\d+) of 2 \(pid (\d+)\): queue workers (\d+)/g),
  ].map((m) => ({ n: Number(m[1]), pid: Number(m[2]), queueWorkers: Number(m[3]) }));
}

/** The pids of the processes that logged a request line for GET /api/v1/me. */
function pidsThatAnsweredMe(): Set<number> {
  const pids = readFileSync(log, "utf8")
    .split("\n")
    .filter((line) => line.startsWith("{"))
    .map((line) => JSON.parse(line) as { msg: string; route?: string; pid: number })
    .filter((line) => line.msg === "request" && line.route === "/api/v1/me")
    .map((line) => line.pid);
  return new Set(pids);
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

test("two web workers share the port, one runs the queue, metrics add up, a dead worker is replaced", async () => {
  test.setTimeout(120_000);
  const [one, two] = startedWorkers();
  expect(one).toMatchObject({ n: 1, queueWorkers: 1 });
  expect(two).toMatchObject({ n: 2, queueWorkers: 0 });

  // Requests on fresh connections reach both processes.
  let asked = 0;
  await expect
    .poll(
      async () => {
        expect((await getOnce(`${W}/api/v1/me`)).status).toBe(401);
        asked++;
        return [...pidsThatAnsweredMe()].sort();
      },
      { timeout: 30_000 },
    )
    .toEqual([one!.pid, two!.pid].sort());

  // Every scrape counts every request, whichever worker it reaches (each alone saw only some).
  const count = new RegExp(
    `sealpitch_http_request_duration_seconds_count\\{route="/api/v1/me",method="GET",status="401"\\} ${asked}\\n`,
  );
  for (let i = 0; i < 4; i++) {
    const scrape = await getOnce(`${W}/api/metrics`, { authorization: `Bearer ${METRICS_TOKEN}` });
    expect(scrape.status).toBe(200);
    expect(scrape.body).toMatch(count);
    expect(scrape.body).toMatch(/sealpitch_db_pool_connections\{state="max"\} 10\n/);
  }

  // A worker that dies is replaced in its slot (no queue workers), and the new one serves.
  process.kill(two!.pid, "SIGKILL");
  await expect.poll(() => startedWorkers().length, { timeout: 60_000 }).toBe(3);
  const three = startedWorkers()[2]!;
  expect(three).toMatchObject({ n: 2, queueWorkers: 0 });
  await expect
    .poll(
      async () => {
        await getOnce(`${W}/api/v1/me`);
        return pidsThatAnsweredMe().has(three.pid);
      },
      { timeout: 60_000 },
    )
    .toBe(true);
});

test("SIGTERM stops every web worker, then the launcher", async () => {
  test.setTimeout(60_000);
  const pids = startedWorkers()
    .map((w) => w.pid)
    .filter(alive);
  expect(pids.length).toBe(2);
  await stopInstances([launcher]);
  expect(launcher.exitCode !== null || launcher.signalCode !== null).toBe(true);
  await expect.poll(() => pids.filter(alive)).toEqual([]);
});
