import { describe, expect, it } from "vitest";
import { webWorkerPlan } from "@/server/http/web-workers";

const instance = { cores: 2, databasePoolMax: 10, jobWorkers: 1, feWorkers: 1 };

describe("the web launcher's plan of its workers", () => {
  it("runs the queue and FE workers in worker 1 only", () => {
    const plan = webWorkerPlan({ ...instance, workers: 2 });
    expect(plan.map((w) => [w.SEALPITCH_WEB_WORKER, w.JOB_WORKERS, w.FE_WORKERS])).toEqual([
      ["1", "1", "1"],
      ["2", "0", "0"],
    ]);
  });

  it("splits the connection budget, so N workers open no more than one process did", () => {
    expect(webWorkerPlan({ ...instance, workers: 2 }).map((w) => w.DATABASE_POOL_MAX)).toEqual(["5", "5"]);
    const three = webWorkerPlan({ ...instance, workers: 3 });
    expect(three.map((w) => Number(w.DATABASE_POOL_MAX)).reduce((a, b) => a + b)).toBeLessThanOrEqual(12);
    // …but never below two per process (one request and the readiness refresh at once).
    expect(webWorkerPlan({ ...instance, databasePoolMax: 2, workers: 4 })[3]!.DATABASE_POOL_MAX).toBe("2");
  });

  it("divides the analysis threads between the workers, at least one each, unless set", () => {
    // One worker: the pool's own default (one fewer than the cores).
    expect(webWorkerPlan({ ...instance, cores: 8, workers: 1 })[0]!.ANALYSIS_WORKERS).toBe("7");
    expect(webWorkerPlan({ ...instance, cores: 8, workers: 4 }).map((w) => w.ANALYSIS_WORKERS)).toEqual([
      "1",
      "1",
      "1",
      "1",
    ]);
    expect(webWorkerPlan({ ...instance, workers: 2 }).map((w) => w.ANALYSIS_WORKERS)).toEqual(["1", "1"]);
    expect(webWorkerPlan({ ...instance, workers: 2, analysisWorkers: 3 })[1]!.ANALYSIS_WORKERS).toBe("3");
  });

  it("is the settings of one process when WEB_WORKERS is 1", () => {
    expect(webWorkerPlan({ ...instance, workers: 1 })).toEqual([
      {
        SEALPITCH_WEB_WORKER: "1",
        JOB_WORKERS: "1",
        FE_WORKERS: "1",
        DATABASE_POOL_MAX: "10",
        ANALYSIS_WORKERS: "1",
      },
    ]);
  });
});
