import { cacheControl } from "@/server/http/cache-control";

export const dynamic = "force-dynamic";

// Liveness: the process is up and serving. Touches nothing (no database, no queue), so an
// outage of either never makes an orchestrator restart healthy app processes. Not logged.
export function GET(): Response {
  return Response.json({ ok: true }, { headers: cacheControl("fresh") });
}
