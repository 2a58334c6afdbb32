"use client";

/**
 * Starts one core worker (workers/core-worker.ts): the live analysis's channel, the heat map's
 * grid and the Pattern finder's search each start theirs here. The bundler finds the worker by
 * this `new Worker(new URL(…))` form, so it stands here once. Null when the browser cannot start
 * one (the caller computes on the page or reports it).
 */
export function startCoreWorker(): Worker | null {
  try {
    return new Worker(new URL("./core-worker.ts", import.meta.url), { type: "module" });
  } catch {
    return null;
  }
}
