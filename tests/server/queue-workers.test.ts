import { describe, expect, it } from "vitest";
import { startQueueWorkers } from "@/server/jobs/queue";

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
});
