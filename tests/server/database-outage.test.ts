import net from "node:net";
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Database } from "@/db/types";
import { isDatabaseUnavailable } from "@/db/connection-errors";
import { GET as meGet } from "@/app/api/v1/me/route";
import { GET as designsGet } from "@/app/api/v1/designs/route";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "../setup/fixtures";
import { getTestDb } from "../setup/test-db";

// A database outage seen through the API: the app's own pool reaches the real PostgreSQL through a
// loopback TCP relay that the test cuts and restores. While it is cut every API route answers a
// JSON 503 with Retry-After that names no host or port; once it is back the same pool (no restart)
// serves the same request again.
const db = getTestDb();
let org: OrganizationFixture<"dana">;
let cookie: string;
let relay: net.Server | undefined;
const sockets = new Set<net.Socket>();
let relayPort = 0;
const target = new URL(process.env.DATABASE_URL!);
const globalForDb = globalThis as unknown as { sealpitchDb?: Kysely<Database> };
let appDb: Kysely<Database>;
let previous: Kysely<Database> | undefined;

function openRelay(port = 0): Promise<number> {
  relay = net.createServer((client) => {
    const upstream = net.connect(Number(target.port), target.hostname);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on("close", () => sockets.delete(s));
      s.on("error", () => s.destroy());
    }
    client.pipe(upstream).pipe(client);
  });
  return new Promise((resolve) =>
    relay!.listen(port, "127.0.0.1", () => resolve((relay!.address() as net.AddressInfo).port)),
  );
}

function cutRelay(): Promise<void> {
  for (const s of sockets) s.destroy();
  return new Promise((resolve) => (relay ? relay.close(() => resolve()) : resolve()));
}

beforeAll(async () => {
  org = await createOrganizationWithMembers(db, { dana: ["designer"] });
  cookie = await org.cookieFor("dana");
  relayPort = await openRelay();
  const url = new URL(process.env.DATABASE_URL!);
  url.port = String(relayPort);
  // Like db/index.ts: a dropped idle connection is an 'error' event on the pool, not a crash.
  const pool = new pg.Pool({ connectionString: url.toString(), max: 2, connectionTimeoutMillis: 3000 });
  pool.on("error", () => undefined);
  // A connection cut while a client is checked out errors on that client too; its query is refused.
  pool.on("connect", (client) => client.on("error", () => undefined));
  appDb = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  previous = globalForDb.sealpitchDb;
  globalForDb.sealpitchDb = appDb;
});

afterAll(async () => {
  globalForDb.sealpitchDb = previous;
  await cutRelay();
  await appDb.destroy().catch(() => undefined);
  await org.cleanup();
});

describe("database outage through the API", () => {
  it("answers 503 with Retry-After while the database is unreachable, and recovers without a restart", async () => {
    expect((await meGet(appRequest("/api/v1/me", { cookie }))).status).toBe(200);

    await cutRelay();
    for (const handler of [meGet, designsGet]) {
      const response = await handler(appRequest("/api/v1/designs", { cookie }));
      expect(response.status).toBe(503);
      expect(response.headers.get("retry-after")).toBe("5");
      expect(response.headers.get("content-type")).toMatch(/application\/json/);
      const body = await response.text();
      expect(JSON.parse(body)).toMatchObject({ error: { message: expect.stringContaining("database") } });
      expect(body).not.toContain(String(relayPort));
      expect(body).not.toContain("127.0.0.1");
      expect(body).not.toMatch(/ECONNREFUSED|ECONNRESET/);
    }

    await openRelay(relayPort);
    const back = await meGet(appRequest("/api/v1/me", { cookie }));
    expect(back.status).toBe(200);
    expect(await back.json()).toMatchObject({ email: org.users.dana.email });
  });

  it("tells an outage from a query the database refused", () => {
    expect(
      isDatabaseUnavailable(
        Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:1"), { code: "ECONNREFUSED" }),
      ),
    ).toBe(true);
    expect(isDatabaseUnavailable(new Error("Connection terminated unexpectedly"))).toBe(true);
    expect(isDatabaseUnavailable(Object.assign(new Error("terminating connection"), { code: "57P01" }))).toBe(
      true,
    );
    expect(isDatabaseUnavailable(Object.assign(new Error("duplicate key"), { code: "23505" }))).toBe(false);
    expect(isDatabaseUnavailable(Object.assign(new Error("permission denied"), { code: "42501" }))).toBe(
      false,
    );
  });
});
