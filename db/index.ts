import "server-only";
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import { getEnv } from "@/server/env";
import type { Database } from "./types";

// `pg` returns int8 (bigint) as a string; our bigint columns are counters that fit in a JS number.
pg.types.setTypeParser(pg.types.builtins.INT8, (value) => Number.parseInt(value, 10));

// One pool per process. In development, hot reloads re-evaluate modules, so the instance is kept
// on globalThis instead of opening a new pool every time.
declare global {
  var sealpitchDb: Kysely<Database> | undefined;
  var sealpitchPool: pg.Pool | undefined;
}

function createDb(): Kysely<Database> {
  const env = getEnv();
  // A connection attempt gives up after 5 s (an unreachable host would otherwise hang the
  // request); the route then answers 503 (server/auth/guard.ts). An idle connection the server
  // drops (restart, outage) is an 'error' event on the pool: logged and discarded, never a crash,
  // and the next query opens a new connection.
  // The pool's size is deliberate: DATABASE_POOL_MAX (default 10) is several connections per
  // core of the database machine, the concurrency pgbench is measured at in
  // bench/http-load.bench.ts; its 50-connection case queues in this pool, not in PostgreSQL.
  // Two connections stay open however long the app idles and the others for a minute, so a
  // burst after a quiet spell does not pay a new connection (and its SCRAM handshake) per request.
  const pool = new pg.Pool({
    connectionString: env.DATABASE_URL,
    max: env.DATABASE_POOL_MAX,
    min: Math.min(2, env.DATABASE_POOL_MAX),
    idleTimeoutMillis: 60_000,
    connectionTimeoutMillis: 5000,
  });
  pool.on("error", (error) => console.error(`[db] idle connection lost: ${error.message}`));
  globalThis.sealpitchPool = pool;
  // A connection lost while a client is checked out errors on the client as well as failing its
  // query (which the route answers with a 503): without a listener that event would end the process.
  pool.on("connect", (client) =>
    client.on("error", (error) => console.error(`[db] connection lost: ${error.message}`)),
  );
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

/** Clients of this process's pool (for the metrics endpoint); zeros before the first query. */
export function getPoolStats(): { total: number; idle: number; waiting: number } {
  const pool = globalThis.sealpitchPool;
  return { total: pool?.totalCount ?? 0, idle: pool?.idleCount ?? 0, waiting: pool?.waitingCount ?? 0 };
}

export function getDb(): Kysely<Database> {
  globalThis.sealpitchDb ??= createDb();
  return globalThis.sealpitchDb;
}

export type Db = Kysely<Database>;
