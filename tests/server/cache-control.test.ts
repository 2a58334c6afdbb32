import { readdirSync, readFileSync, statSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { GET as liveGet } from "@/app/api/health/live/route";
import { CACHE_POLICIES, cacheControl } from "@/server/http/cache-control";

// Internal checks (no published source): the app's Cache-Control values live in one module.
const walk = (dir: string): string[] =>
  readdirSync(dir).flatMap((f) => {
    const p = path.join(dir, f);
    return statSync(p).isDirectory() ? walk(p) : /\.(ts|tsx)$/.test(f) ? [p] : [];
  });

describe("cache-control policies", () => {
  it("no route, feature or server module writes a cache-control literal of its own", () => {
    const files = ["app", "features", "server"].flatMap(walk);
    expect(files.length).toBeGreaterThan(50);
    const offenders = files.filter(
      (f) =>
        f !== path.join("server", "http", "cache-control.ts") &&
        /["'`]cache-control["'`]\s*:/i.test(readFileSync(f, "utf8")),
    );
    expect(offenders).toEqual([]);
  });

  it("names each policy once and a route sends the named value", async () => {
    expect(cacheControl("userData")).toEqual({ "cache-control": "private, no-store" });
    expect(new Set(Object.values(CACHE_POLICIES)).size).toBe(Object.keys(CACHE_POLICIES).length);
    const live = await liveGet(new Request("http://127.0.0.1/api/health/live"));
    expect(live.headers.get("cache-control")).toBe(CACHE_POLICIES.fresh);
  });
});
