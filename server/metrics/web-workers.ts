import "server-only";
import cluster from "node:cluster";
import { randomUUID } from "node:crypto";
import {
  METRICS_COLLECT,
  METRICS_GATHER,
  METRICS_PART,
  METRICS_WHOLE,
  type MetricsMessage,
} from "@/server/http/web-workers";
import { getMetrics } from "./registry";

// Metrics across the web launcher's workers (scripts/serve.ts). A scrape reaches one worker; that
// worker asks the launcher (METRICS_GATHER over the cluster's IPC channel), the launcher asks
// every worker for its metrics (METRICS_COLLECT → METRICS_PART, prom-client's JSON form), adds
// them up with prom-client's AggregatorRegistry and answers with the text (METRICS_WHOLE). A
// process that is no cluster worker (plain `next start`) serves its own metrics as before.

const GATHER_TIMEOUT_MS = 5000;

declare global {
  var sealpitchMetricsPartsAnswered: boolean | undefined;
}

/** Worker side, once per process (instrumentation.ts): answers the launcher's collect requests. */
export function answerMetricsCollects(fill: () => Promise<void>): void {
  if (!cluster.isWorker || globalThis.sealpitchMetricsPartsAnswered) return;
  globalThis.sealpitchMetricsPartsAnswered = true;
  process.on("message", (message: MetricsMessage) => {
    if (message?.type !== METRICS_COLLECT) return;
    void (async () => {
      await fill().catch(() => {});
      const metrics = await getMetrics().registry.getMetricsAsJSON();
      process.send?.({ type: METRICS_PART, id: message.id, metrics } satisfies MetricsMessage);
    })();
  });
}

/** Every web worker's metrics added up, or undefined outside the launcher (or when it does not answer). */
export function gatherFromWebWorkers(): Promise<{ body: string; contentType: string } | undefined> {
  if (!cluster.isWorker || !process.send) return Promise.resolve(undefined);
  const id = randomUUID();
  return new Promise((resolve) => {
    const done = (value: { body: string; contentType: string } | undefined) => {
      clearTimeout(timer);
      process.off("message", onMessage);
      resolve(value);
    };
    const onMessage = (message: MetricsMessage) => {
      if (message?.type === METRICS_WHOLE && message.id === id)
        done({ body: message.body, contentType: message.contentType });
    };
    const timer = setTimeout(() => done(undefined), GATHER_TIMEOUT_MS);
    process.on("message", onMessage);
    process.send!({ type: METRICS_GATHER, id } satisfies MetricsMessage);
  });
}
