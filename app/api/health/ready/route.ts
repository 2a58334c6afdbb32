import { readinessResponse } from "@/features/health/readiness";
import { withRequestId } from "@/server/log/with-logging";

export const dynamic = "force-dynamic";

// Readiness for a load balancer or orchestrator (the same answer as /api/health).
export const GET = withRequestId(() => readinessResponse());
