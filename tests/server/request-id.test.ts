import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { GET as healthGet } from "@/app/api/health/route";
import { GET as liveGet } from "@/app/api/health/live/route";
import { GET as readyGet } from "@/app/api/health/ready/route";
import { GET as metricsGet } from "@/app/api/metrics/route";
import { GET as meGet } from "@/app/api/v1/me/route";
import { resetReadiness } from "@/features/health/readiness";
import { stopQueue } from "@/server/jobs/queue";
import { appRequest } from "../setup/fixtures";

// Internal behaviour (no published source): API routes skip proxy.ts (next.config.ts gives them
// their fixed headers), so each route handler answers with X-Request-Id itself, through
// withRequestLog or, for the routes that are not logged per request, withRequestId.
afterEach(() => resetReadiness());
afterAll(async () => {
  await stopQueue();
});

function routeFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return routeFiles(full);
    return name === "route.ts" ? [full] : [];
  });
}

const METHOD = "(GET|HEAD|POST|PUT|PATCH|DELETE|OPTIONS)";
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

describe("X-Request-Id on API routes", () => {
  it("every method of every API route handler is wrapped by withRequestLog or withRequestId", () => {
    const files = routeFiles("app/api");
    expect(files.length).toBeGreaterThan(20);
    const unwrapped: string[] = [];
    let methods = 0;
    for (const file of files) {
      const text = readFileSync(file, "utf8");
      for (const m of text.matchAll(
        new RegExp(`^export (?:async )?(?:function|const) ${METHOD}\\b.*$`, "gm"),
      )) {
        methods++;
        if (!/^export const \w+ = (withRequestLog|withRequestId)\(/.test(m[0]))
          unwrapped.push(`${file}: ${m[0]}`);
      }
    }
    expect(methods).toBeGreaterThan(files.length - 1);
    expect(unwrapped).toEqual([]);
  });

  it("the health, readiness, liveness and metrics routes answer with the caller's id or a new one", async () => {
    const handlers: [string, (request: Request) => Promise<Response>][] = [
      ["/api/health", healthGet],
      ["/api/health/ready", readyGet],
      ["/api/health/live", liveGet],
      ["/api/metrics", metricsGet],
    ];
    for (const [route, handler] of handlers) {
      const echoed = await handler(appRequest(route, { headers: { "x-request-id": "probe-0001.lb:7" } }));
      expect(echoed.headers.get("x-request-id"), route).toBe("probe-0001.lb:7");
      const fresh = await handler(appRequest(route));
      expect(fresh.headers.get("x-request-id"), route).toMatch(UUID);
      // A value that does not look like an id (too short, or with a space) is not echoed back.
      const refused = await handler(appRequest(route, { headers: { "x-request-id": "bad id" } }));
      expect(refused.headers.get("x-request-id"), route).toMatch(UUID);
    }
    expect((await healthGet(appRequest("/api/health"))).status).toBe(200);
  });

  it("a logged route answers with the id too, also when it refuses the request", async () => {
    const response = await meGet(
      appRequest("/api/v1/me", { headers: { "x-request-id": "client-abcdef12" } }),
    );
    expect(response.status).toBe(401);
    expect(response.headers.get("x-request-id")).toBe("client-abcdef12");
  });
});
