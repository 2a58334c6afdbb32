import { readinessResponse } from "@/features/health/readiness";
import { withRequestId } from "@/server/log/with-logging";

export const dynamic = "force-dynamic";

// Public readiness, answered from the cached state that a background timer refreshes
// (features/health/readiness.ts): 200 { ok: true } when the database answers, every migration is
// applied and the job queue runs, else 503 { ok: false }. /api/health/ready gives the same
// answer, /api/health/live only says the process is up. Probes are not logged per request
// (a balancer polls every few seconds); a change of readiness is, with its reason.
export const GET = withRequestId(() => readinessResponse());
