import { cacheControl } from "@/server/http/cache-control";
import { withRequestId } from "@/server/log/with-logging";

export const dynamic = "force-dynamic";

// Liveness: the process is up and serving. Touches nothing (no database, no queue), so an
// outage of either never makes an orchestrator restart healthy app processes. Not logged.
export const GET = withRequestId(() => Response.json({ ok: true }, { headers: cacheControl("fresh") }));
