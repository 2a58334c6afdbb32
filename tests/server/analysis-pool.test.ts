import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as analysesPost } from "@/app/api/v1/analyses/route";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { WORK_LIMITS } from "@/features/analysis/core/bounds";
import {
  AnalysisUnavailableError,
  analyzeInWorker,
  closeAnalysisPool,
  createAnalysisPool,
  defaultAnalysisWorkers,
  getAnalysisPool,
  type AnalysisPool,
} from "@/server/analysis/pool";
import { loggedAction, withRequestLog } from "@/server/log/with-logging";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "../setup/fixtures";
import { EXAMPLE_NAMES, exampleDesign, heavyDesign, lightDesign } from "../setup/analysis-designs";
import { getTestDb } from "../setup/test-db";

// The analysis pool (server/analysis/pool.ts): analyses run in worker threads with a time limit,
// so the request thread stays free; the numbers are the core's own, to the last bit.
const TEST_WORKER = path.resolve("tests/fixtures/analysis-pool/test-worker.mjs");

afterAll(async () => {
  await closeAnalysisPool();
});

describe("results from the pool are the in-thread results, bit for bit", () => {
  it.each(EXAMPLE_NAMES)("%s", async (name) => {
    const document = exampleDesign(name);
    expect(await analyzeInWorker(document)).toBe(JSON.stringify(analyzeJoint(document)));
  });

  it("a design at the work cap (512 bolts × 128 samples per pitch)", async () => {
    const document = heavyDesign();
    const inWorker = await analyzeInWorker(document);
    expect(inWorker.length).toBeGreaterThan(1_000_000); // the heavy one really is heavy
    expect(inWorker).toBe(JSON.stringify(analyzeJoint(document)));
  });

  it("a design the core refuses throws the core's own DesignRefusedError", async () => {
    const document = { ...lightDesign(), bolts: [] };
    await expect(analyzeInWorker(document)).rejects.toMatchObject({
      name: "DesignRefusedError",
      message: expect.stringMatching(/^invalid design: bolts/),
    });
  });
});

describe("the request thread does not wait for a calculation", () => {
  it("while a heavy analysis runs, the event loop turns and a light one on another worker finishes first", async () => {
    const pool = createAnalysisPool({ workers: 2, timeLimitMs: 60_000 });
    try {
      // Both workers warm (their first task also loads the bundle).
      await Promise.all([pool.run({ document: lightDesign() }), pool.run({ document: lightDesign() })]);
      const order: string[] = [];
      const heavy = pool.run({ document: heavyDesign() }).then(() => order.push("heavy"));
      await new Promise((resolve) => setTimeout(resolve, 0)).then(() => order.push("timer"));
      await pool.run({ document: lightDesign() }).then(() => order.push("light"));
      await heavy;
      expect(order).toEqual(["timer", "light", "heavy"]);
    } finally {
      await pool.close();
    }
  });

  it("the default size is one worker fewer than the cores, at least one", () => {
    expect(defaultAnalysisWorkers(8)).toBe(7);
    expect(defaultAnalysisWorkers(2)).toBe(1);
    expect(defaultAnalysisWorkers(1)).toBe(1);
  });
});

describe("time limit and queue bound", () => {
  let pool: AnalysisPool;
  beforeAll(() => {
    pool = createAnalysisPool({ workers: 1, timeLimitMs: 300, maxQueue: 1, filename: TEST_WORKER });
  });
  afterAll(async () => {
    await pool.close();
  });

  it("a task past its limit is stopped with a clear error, its worker replaced, and the next task runs", async () => {
    const first = await pool.run<number>({});
    const stopped = await pool.run({ spin: true }).then(
      () => null,
      (error: unknown) => error,
    );
    expect(stopped).toBeInstanceOf(AnalysisUnavailableError);
    expect((stopped as AnalysisUnavailableError).reason).toBe("time-limit");
    expect((stopped as Error).message).toBe(
      "The analysis took longer than the server's limit of 300 ms per analysis and was stopped; nothing was stored. Lower the samples per pitch or the heat-map grid, or try again when the server is less busy.",
    );
    const next = await pool.run<number>({});
    expect(next).not.toBe(first); // a fresh thread
    expect(pool.threadIds()).toEqual([next]);
  });

  it("the limit counts from when a worker starts the task, not while it waits", async () => {
    // The second task waits ~300 ms behind the first, then runs at once: it must not time out.
    const results = await Promise.allSettled([pool.run({ spin: true }), pool.run<number>({})]);
    expect(results[0]).toMatchObject({ status: "rejected", reason: { reason: "time-limit" } });
    expect(results[1].status).toBe("fulfilled");
  });

  it("past the queue bound a task is refused at once as busy", async () => {
    // One task runs away on the only worker and one waits (maxQueue 1): a third is refused.
    const running = pool.run({ spin: true }).catch((e: unknown) => e);
    const waiting = pool.run<number>({});
    const refused = await pool.run({}).then(
      () => null,
      (error: unknown) => error,
    );
    expect(refused).toBeInstanceOf(AnalysisUnavailableError);
    expect((refused as AnalysisUnavailableError).reason).toBe("busy");
    expect((refused as Error).message).toBe(
      "The server is busy with other analyses and cannot take this one now; nothing was stored. Try again in a few seconds.",
    );
    await expect.poll(() => pool.stats()).toEqual({ running: 1, queued: 1 });
    expect(await running).toMatchObject({ reason: "time-limit" });
    expect(typeof (await waiting)).toBe("number"); // the waiting one ran once the worker was replaced
    expect(pool.stats()).toEqual({ running: 0, queued: 0 });
  });
});

describe("routes and actions answer a stopped analysis with its message", () => {
  const stopped = () =>
    new AnalysisUnavailableError("The analysis took longer than the limit.", "time-limit");

  it("a route handler: 503 JSON with the message and Retry-After", async () => {
    const handler = withRequestLog("/test", async () => {
      throw stopped();
    });
    const response = await handler(new Request("http://127.0.0.1/test", { method: "POST" }));
    expect(response.status).toBe(503);
    expect(response.headers.get("retry-after")).toBe("5");
    expect(await response.json()).toEqual({
      error: { message: "The analysis took longer than the limit.", reason: "time-limit" },
    });
  });

  it("a server action: a refusal with the message", async () => {
    const action = loggedAction("test.stopped", async () => {
      throw stopped();
    });
    expect(await action()).toEqual({ ok: false, message: "The analysis took longer than the limit." });
  });
});

describe("POST /api/v1/analyses through the pool", () => {
  const db = getTestDb();
  let org: OrganizationFixture<"dana">;
  let dana: string;
  beforeAll(async () => {
    org = await createOrganizationWithMembers(db, { dana: ["designer"] });
    dana = await org.cookieFor("dana");
  });
  afterAll(async () => {
    await org.cleanup();
  });

  it("answers the worker's JSON text unchanged", async () => {
    const document = exampleDesign("obround-manway");
    const response = await analysesPost(
      appRequest("/api/v1/analyses", { method: "POST", cookie: dana, body: document }),
    );
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/json");
    expect(await response.text()).toBe(JSON.stringify(analyzeJoint(document)));
    expect(getAnalysisPool().options.workers).toBeGreaterThanOrEqual(1);
  });

  it("bolts × samples past the work cap is a 422 naming the limit, before any worker is asked", async () => {
    const document = heavyDesign() as unknown as { estimator: { samplesPerPitch: number } };
    document.estimator.samplesPerPitch = 256;
    const response = await analysesPost(
      appRequest("/api/v1/analyses", { method: "POST", cookie: dana, body: document }),
    );
    expect(response.status).toBe(422);
    expect(JSON.stringify(await response.json())).toContain(
      `512 bolts × 256 samples per pitch = 131072 gasket-path samples, over the work limit of ${WORK_LIMITS.pathSamples.max}`,
    );
  });
});
