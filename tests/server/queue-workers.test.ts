import { describe, expect, it, vi } from "vitest";
import { startQueueWorkers } from "@/server/jobs/queue";
import { createLogger } from "@/server/log/logger";

// Internal behaviour (no published source): server start registers every queue's workers in one
// call; a queue whose start fails is retried on its own, and does not hold the others back.
describe("startQueueWorkers", () => {
  it("starts every queue and retries only the one that failed until it starts", async () => {
    const calls: string[] = [];
    let failuresLeft = 2;
    let started!: () => void;
    const flakyStarted = new Promise<void>((resolve) => (started = resolve));
    startQueueWorkers(
      [
        {
          queue: "flaky",
          ensure: async () => {
            calls.push("flaky");
            if (failuresLeft-- > 0) throw new Error("database is down");
            started();
          },
        },
        {
          queue: "steady",
          ensure: async () => {
            calls.push("steady");
          },
        },
      ],
      5,
    );
    // Both are tried at once, without waiting for either.
    expect(calls).toEqual(["flaky", "steady"]);
    await flakyStarted;
    expect(calls.filter((c) => c === "flaky")).toHaveLength(3);
    expect(calls.filter((c) => c === "steady")).toHaveLength(1);
  });

  it("keeps retrying, and leaves no rejection unhandled, when the log itself throws", async () => {
    // A real pino logger whose stream fails on every line (a closed or full log destination).
    const previous = globalThis.sealpitchLogger;
    globalThis.sealpitchLogger = createLogger("info", {
      write() {
        throw new Error("log stream closed");
      },
    });
    const unhandled: unknown[] = [];
    const onUnhandled = (reason: unknown) => unhandled.push(reason);
    process.on("unhandledRejection", onUnhandled);
    const stderr = vi.spyOn(process.stderr, "write").mockImplementation(() => true);
    try {
      let failuresLeft = 2;
      let started!: () => void;
      const flakyStarted = new Promise<"started">((resolve) => (started = () => resolve("started")));
      startQueueWorkers(
        [
          {
            queue: "flaky-with-broken-log",
            ensure: async () => {
              if (failuresLeft-- > 0) throw new Error("database is down");
              started();
            },
          },
        ],
        5,
      );
      const outcome = await Promise.race([
        flakyStarted,
        new Promise<"gave up">((resolve) => setTimeout(() => resolve("gave up"), 2000)),
      ]);
      // Node reports unhandled rejections after the microtask queue drains: give it a turn.
      await new Promise((resolve) => setTimeout(resolve, 20));
      expect(outcome).toBe("started");
      expect(unhandled).toEqual([]);
      const reported = stderr.mock.calls.map(([line]) => String(line));
      expect(reported).toHaveLength(2);
      expect(reported[0]).toContain("flaky-with-broken-log not started (database is down)");
      expect(reported[0]).toContain("log stream closed");
    } finally {
      stderr.mockRestore();
      process.off("unhandledRejection", onUnhandled);
      globalThis.sealpitchLogger = previous;
    }
  });
});
