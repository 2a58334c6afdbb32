import { type Kysely, sql } from "kysely";

// What the application's database role may do (README "Security"). `npm run db:migrate` runs as
// the owner role and re-applies these grants after every migration, so a new table is covered the
// moment it exists, by the same rules:
// - history tables (every table with a trigger that runs refuse_change_to_history_row: activity,
//   comments, decisions, justifications, revision editors): SELECT and INSERT only;
// - migration bookkeeping (kysely_migration*, app_meta): SELECT only;
// - every other table in public: SELECT, INSERT, UPDATE, DELETE (the triggers still guard them,
//   e.g. an approved revision refuses any change, whoever asks);
// - sequences: USAGE, SELECT; the job queue's schema (pgboss): SELECT, INSERT, UPDATE, DELETE.
// Never: ownership, TRUNCATE, REFERENCES, TRIGGER, CREATE on any schema, or DDL. The runtime login
// role (DATABASE_URL) gets all this as a member of RUNTIME_GROUP, which scripts/lib/common.sh
// (pg_ensure_database) creates.
export const RUNTIME_GROUP = "sealpitch_runtime";
export const HISTORY_TRIGGER_FUNCTION = "refuse_change_to_history_row";
const READ_ONLY_TABLES = ["kysely_migration", "kysely_migration_lock", "app_meta"];
const QUEUE_SCHEMA = "pgboss";

export type TableAccess = "read" | "append" | "read-write";

/** Each public table's access for the runtime role, decided by the rules above. */
export async function runtimeTableAccess<DB>(db: Kysely<DB>): Promise<Map<string, TableAccess>> {
  const { rows } = await sql<{ name: string; history: boolean }>`
    select c.relname as name, exists (
      select from pg_trigger t join pg_proc p on p.oid = t.tgfoid
      where t.tgrelid = c.oid and p.proname = ${HISTORY_TRIGGER_FUNCTION}
    ) as history
    from pg_class c join pg_namespace n on n.oid = c.relnamespace
    where n.nspname = 'public' and c.relkind in ('r', 'p')
    order by c.relname`.execute(db);
  return new Map(
    rows.map((r) => [
      r.name,
      READ_ONLY_TABLES.includes(r.name) ? "read" : r.history ? "append" : "read-write",
    ]),
  );
}

const PRIVILEGES: Record<TableAccess, string> = {
  read: "select",
  append: "select, insert",
  "read-write": "select, insert, update, delete",
};

/** Re-applies every grant of the runtime role (revoke all, then grant); run as the owner role. */
export async function applyRuntimeGrants<DB>(db: Kysely<DB>): Promise<void> {
  const { rows } = await sql<{ ok: boolean }>`
    select exists (select from pg_roles where rolname = ${RUNTIME_GROUP}) as ok`.execute(db);
  if (!rows[0]?.ok) {
    throw new Error(
      `the database role ${RUNTIME_GROUP} is missing: create it (and grant it to the app's login role) as scripts/lib/common.sh pg_ensure_database does`,
    );
  }
  const group = sql.id(RUNTIME_GROUP);
  await db.transaction().execute(async (trx) => {
    await sql`revoke all on all tables in schema public from ${group}`.execute(trx);
    await sql`revoke all on all sequences in schema public from ${group}`.execute(trx);
    for (const [table, access] of await runtimeTableAccess(trx)) {
      await sql`grant ${sql.raw(PRIVILEGES[access])} on table ${sql.id("public", table)} to ${group}`.execute(
        trx,
      );
    }
    await sql`grant usage, select on all sequences in schema public to ${group}`.execute(trx);
    const queue = await sql<{ ok: boolean }>`
      select exists (select from pg_namespace where nspname = ${QUEUE_SCHEMA}) as ok`.execute(trx);
    if (queue.rows[0]?.ok) {
      const schema = sql.id(QUEUE_SCHEMA);
      await sql`grant usage on schema ${schema} to ${group}`.execute(trx);
      await sql`revoke all on all tables in schema ${schema} from ${group}`.execute(trx);
      await sql`grant select, insert, update, delete on all tables in schema ${schema} to ${group}`.execute(
        trx,
      );
      await sql`grant usage, select on all sequences in schema ${schema} to ${group}`.execute(trx);
    }
  });
}
