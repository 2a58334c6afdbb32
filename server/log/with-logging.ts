import "server-only";
import { headers } from "next/headers";
import { getLogger, errorText } from "./logger";
import { currentRequest, REQUEST_ID_HEADER, requestIdFrom, runWithRequest } from "./request-context";
import { observeRequest } from "@/server/metrics/registry";
import { AnalysisUnavailableError } from "@/server/analysis/pool";
import { cacheControl } from "@/server/http/cache-control";

// One log line per request, written where the outcome is known. Next 16's proxy.ts runs before
// the route and never sees the final status, so every route handler is wrapped in
// withRequestLog (status, duration, user and organisation, the X-Request-Id it answered with)
// and every server action in loggedAction (outcome instead of status); the unlogged routes (health,
// metrics) in withRequestId. proxy.ts gives page requests and actions their request id;
// instrumentation.ts's onRequestError logs what escapes.

function finishLine(route: string, method: string, status: number, started: number, extra: object = {}) {
  const context = currentRequest();
  const durationMs = Math.round((performance.now() - started) * 10) / 10;
  observeRequest(route, method, status, durationMs / 1000);
  const level = status >= 500 ? "error" : "info";
  getLogger()[level](
    {
      reqId: context?.requestId,
      method,
      route,
      status,
      durationMs,
      userId: context?.userId ?? null,
      organizationId: context?.organizationId ?? null,
      ...extra,
    },
    "request",
  );
}

/**
 * An analysis past the pool's time limit, or refused because every worker and the queue are
 * taken (server/analysis/pool.ts), is answered here for every route: 503 with the reason and
 * Retry-After. Nothing was stored (the analysis runs before, or inside, the write's transaction).
 */
function analysisUnavailableResponse(error: AnalysisUnavailableError): Response {
  return Response.json(
    { error: { message: error.message, reason: error.reason } },
    { status: 503, headers: { ...cacheControl("fresh"), "retry-after": "5" } },
  );
}

/** `export const GET = withRequestLog("/api/v1/designs/[designId]", handler)`. */
export function withRequestLog<A extends unknown[]>(
  route: string,
  handler: (request: Request, ...rest: A) => Promise<Response> | Response,
): (request: Request, ...rest: A) => Promise<Response> {
  return async (request, ...rest) => {
    const started = performance.now();
    const requestId = requestIdFrom(request.headers.get(REQUEST_ID_HEADER));
    return runWithRequest({ requestId }, async () => {
      let response: Response;
      try {
        response = await handler(request, ...rest);
      } catch (error) {
        if (!(error instanceof AnalysisUnavailableError)) {
          finishLine(route, request.method, 500, started, { err: errorText(error) });
          throw error;
        }
        response = analysisUnavailableResponse(error);
      }
      finishLine(route, request.method, response.status, started);
      return withIdHeader(response, requestId);
    });
  };
}

function withIdHeader(response: Response, requestId: string): Response {
  try {
    response.headers.set(REQUEST_ID_HEADER, requestId);
  } catch {
    // A response with immutable headers (a fetched one) keeps its own; the log line has the id.
  }
  return response;
}

/**
 * For the routes that are not logged per request (health probes, the metrics scrape): the same
 * X-Request-Id answer as withRequestLog, without the log line, the metrics or the request scope.
 * API routes skip proxy.ts, so without one of the two wrappers a route would answer with no id.
 * Its cost is one header read, a pattern test (or a new UUID) and one header write.
 */
export function withRequestId<A extends unknown[]>(
  handler: (request: Request, ...rest: A) => Promise<Response> | Response,
): (request: Request, ...rest: A) => Promise<Response> {
  return async (request, ...rest) =>
    withIdHeader(await handler(request, ...rest), requestIdFrom(request.headers.get(REQUEST_ID_HEADER)));
}

/** Next's own control-flow throws (redirect, notFound, forbidden) are outcomes, not failures. */
function controlFlowStatus(error: unknown): number | null {
  const digest = (error as { digest?: unknown } | null)?.digest;
  if (typeof digest !== "string") return null;
  if (digest.startsWith("NEXT_REDIRECT")) return 303;
  const fallback = /^NEXT_HTTP_ERROR_FALLBACK;(\d{3})/.exec(digest);
  return fallback ? Number(fallback[1]) : null;
}

/** The id proxy.ts gave this request; none outside a request scope (scripts, tests). */
async function incomingRequestId(): Promise<string | null> {
  try {
    return (await headers()).get(REQUEST_ID_HEADER);
  } catch {
    return null;
  }
}

/**
 * Wraps a server action: one "action" line with its name, outcome ("ok", "refused" for an
 * ActionResult with ok: false, "redirect"), status and duration. The arguments (form data with
 * passwords, documents) are never logged.
 */
export function loggedAction<A extends unknown[], R>(
  name: string,
  action: (...args: A) => Promise<R>,
): (...args: A) => Promise<R> {
  return async (...args: A) => {
    const started = performance.now();
    const requestId = requestIdFrom(await incomingRequestId());
    return runWithRequest({ requestId }, async () => {
      const route = `action ${name}`;
      try {
        const result = await action(...args);
        const refused = (result as { ok?: unknown } | null)?.ok === false;
        finishLine(route, "POST", refused ? 422 : 200, started, { outcome: refused ? "refused" : "ok" });
        return result;
      } catch (error) {
        // The same for actions: an ActionResult refusal with the pool's message.
        if (error instanceof AnalysisUnavailableError) {
          finishLine(route, "POST", 503, started, { outcome: "refused", err: error.message });
          return { ok: false, message: error.message } as R;
        }
        const status = controlFlowStatus(error);
        if (status !== null)
          finishLine(route, "POST", status, started, { outcome: status === 303 ? "redirect" : "refused" });
        else finishLine(route, "POST", 500, started, { outcome: "error", err: errorText(error) });
        throw error;
      }
    });
  };
}
