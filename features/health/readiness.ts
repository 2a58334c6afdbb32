import "server-only";
import { getDb } from "@/db/index";
import { getHealth } from "@/features/health/queries";
import { getQueue } from "@/server/jobs/queue";
import { errorText, getLogger } from "@/server/log/logger";
import { cacheControl } from "@/server/http/cache-control";

// Readiness of this process (database reachable, every migration applied, job queue started),
// kept as a cached state that a background timer refreshes every REFRESH_MS. The health routes
// answer from the cache, so a flood of probes costs no queries and a slow database cannot make
// the probe itself slow. Only a change of state is logged, with the reason; the public answer
// says ready or not, nothing more (no host, port or error text for anonymous callers).
export const REFRESH_MS = 5000;

export interface ReadinessState {
  ready: boolean;
  /** Why not ready, for the server log only. */
  reason: string | null;
  checkedAt: number;
}

declare global {
  var sealpitchReadiness:
    { state: ReadinessState | null; timer?: NodeJS.Timeout; pending?: Promise<ReadinessState> } | undefined;
}
const holder = (globalThis.sealpitchReadiness ??= { state: null });

async function check(): Promise<ReadinessState> {
  const checkedAt = Date.now();
  try {
    const health = await getHealth(getDb());
    if (!health.ok) return { ready: false, reason: health.reason, checkedAt };
  } catch (error) {
    return { ready: false, reason: `database check failed: ${errorText(error)}`, checkedAt };
  }
  try {
    await getQueue();
  } catch (error) {
    return { ready: false, reason: `job queue not running: ${errorText(error)}`, checkedAt };
  }
  return { ready: true, reason: null, checkedAt };
}

/** Runs one check now and stores it (one at a time; concurrent callers share it). */
export function refreshReadiness(): Promise<ReadinessState> {
  holder.pending ??= check()
    .then((next) => {
      const previous = holder.state;
      if (!previous || previous.ready !== next.ready || previous.reason !== next.reason) {
        const log = getLogger();
        if (next.ready) log.info({ event: "readiness" }, "ready");
        else log.warn({ event: "readiness", reason: next.reason }, "not ready");
      }
      holder.state = next;
      return next;
    })
    .finally(() => {
      holder.pending = undefined;
    });
  return holder.pending;
}

/** Starts the background refresh (idempotent); the timer never keeps the process alive. */
export function startReadinessRefresh(intervalMs: number = REFRESH_MS): void {
  if (holder.timer) return;
  holder.timer = setInterval(() => void refreshReadiness(), intervalMs);
  holder.timer.unref();
  void refreshReadiness();
}

/** The cached state; before the first check has finished, waits for it. */
export async function getReadiness(): Promise<ReadinessState> {
  startReadinessRefresh();
  return holder.state ?? (await refreshReadiness());
}

/** Stops the refresh and forgets the state (tests). */
export function resetReadiness(): void {
  if (holder.timer) clearInterval(holder.timer);
  holder.timer = undefined;
  holder.state = null;
}

/**
 * The public answer: 200 { ok: true }, or 503 { ok: false } with Retry-After. Nothing else, so
 * an anonymous caller learns no host, port or error text (those are in the server log).
 */
export async function readinessResponse(): Promise<Response> {
  const state = await getReadiness();
  return Response.json(
    { ok: state.ready },
    {
      status: state.ready ? 200 : 503,
      headers: { ...cacheControl("fresh"), ...(state.ready ? {} : { "retry-after": "5" }) },
    },
  );
}
