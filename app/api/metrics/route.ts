import { timingSafeEqual } from "node:crypto";
import { getEnv } from "@/server/env";
import { renderMetrics } from "@/server/metrics/scrape";
import { cacheControl } from "@/server/http/cache-control";
import { withRequestId } from "@/server/log/with-logging";

export const dynamic = "force-dynamic";

// Prometheus metrics of this process (prom-client): request latency by route, analysis time,
// queue depth, job failures, database pool use, and Node's process metrics. Off unless
// METRICS_TOKEN is set (404, as if absent); the scraper sends `Authorization: Bearer <token>`.
// Not logged per request, so a 15-second scrape does not flood the log.
function tokenMatches(header: string | null, token: string): boolean {
  const given = Buffer.from(header?.replace(/^Bearer\s+/i, "") ?? "");
  const wanted = Buffer.from(token);
  return given.length === wanted.length && timingSafeEqual(given, wanted);
}

export const GET = withRequestId(async (request: Request): Promise<Response> => {
  const token = getEnv().METRICS_TOKEN;
  if (!token) return new Response("Not found", { status: 404 });
  if (!tokenMatches(request.headers.get("authorization"), token)) {
    return Response.json(
      { error: { message: "A metrics token is required." } },
      { status: 401, headers: { "www-authenticate": 'Bearer realm="metrics"', ...cacheControl("fresh") } },
    );
  }
  const { body, contentType } = await renderMetrics();
  return new Response(body, { headers: { "content-type": contentType, ...cacheControl("fresh") } });
});
