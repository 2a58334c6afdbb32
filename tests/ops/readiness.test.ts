import { sql } from "kysely";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { listMigrationNames } from "@/db/migration-names";
import {
  getReadiness,
  readinessResponse,
  refreshReadiness,
  resetReadiness,
} from "@/features/health/readiness";
import { stopQueue } from "@/server/jobs/queue";
import { getOwnerTestDb } from "../setup/test-db";

// Readiness is a cached state refreshed in the background: the health routes answer from it,
// and the public answer is { ok } alone (the reason goes to the server log).
afterEach(() => resetReadiness());
afterAll(async () => {
  await stopQueue();
});

describe("readiness", () => {
  it("is ready with the database migrated and the queue started; the answer is { ok: true } only", async () => {
    const state = await getReadiness();
    expect(state).toMatchObject({ ready: true, reason: null });
    const response = await readinessResponse();
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ ok: true });
  });

  it("answers from the cache until the next refresh, then says 503 { ok: false } with no detail", async () => {
    expect((await getReadiness()).ready).toBe(true);
    const newest = (await listMigrationNames()).at(-1)!;
    await sql`delete from kysely_migration where name = ${newest}`.execute(getOwnerTestDb());
    try {
      // The cached state still stands: a probe costs no query.
      expect((await readinessResponse()).status).toBe(200);
      const state = await refreshReadiness();
      expect(state).toMatchObject({ ready: false, reason: `migrations pending: ${newest}` });
      const response = await readinessResponse();
      expect(response.status).toBe(503);
      expect(response.headers.get("retry-after")).toBe("5");
      const text = await response.text();
      expect(JSON.parse(text)).toEqual({ ok: false });
      expect(text).not.toContain(newest);
    } finally {
      await sql`insert into kysely_migration (name, timestamp) values (${newest}, now()::text)`.execute(
        getOwnerTestDb(),
      );
    }
    expect((await refreshReadiness()).ready).toBe(true);
  });
});
