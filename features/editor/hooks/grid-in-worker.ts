"use client";
import type { JointDesign } from "@/features/analysis/core/design";
import type { GasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import type { GridWorkerReply, GridWorkerRequest } from "../workers/core-worker-protocol";
import { startCoreWorker } from "../workers/start-core-worker";

// One core worker for the heat map's grid, started on the first request and kept for the page's
// life (a grid is asked for at most once per settled edit); null once it failed to start or stopped.
let worker: Worker | null | undefined;
let seq = 0;
const waiting = new Map<number, { resolve: (g: GasketStressGrid) => void; reject: (e: Error) => void }>();

function gridWorker(): Worker | null {
  if (worker !== undefined) return worker;
  const w = startCoreWorker();
  worker = w;
  if (w) {
    w.onmessage = (e: MessageEvent<GridWorkerReply>) => {
      const m = e.data;
      const job = waiting.get(m.seq);
      waiting.delete(m.seq);
      if (!job) return;
      if (m.ok) job.resolve(m.grid);
      else job.reject(new Error(m.message));
    };
    w.onerror = () => {
      worker = null;
      w.terminate();
      for (const job of waiting.values()) job.reject(new Error("The core worker stopped."));
      waiting.clear();
    };
  }
  return worker;
}

/**
 * The core's `computeGasketStressGrid(design, nx, ny)` in a core worker (workers/core-worker.ts),
 * its values transferred back; null when there is no worker (the caller computes on the page).
 * Rejects with the core's message when the core gives no grid.
 */
export function gridInWorker(design: JointDesign, nx: number, ny: number): Promise<GasketStressGrid> | null {
  const w = gridWorker();
  if (!w) return null;
  const id = ++seq;
  return new Promise((resolve, reject) => {
    waiting.set(id, { resolve, reject });
    w.postMessage({ type: "grid", seq: id, design, nx, ny } satisfies GridWorkerRequest);
  });
}
