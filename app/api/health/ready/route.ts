import { readinessResponse } from "@/features/health/readiness";

export const dynamic = "force-dynamic";

// Readiness for a load balancer or orchestrator (the same answer as /api/health).
export function GET(): Promise<Response> {
  return readinessResponse();
}
