import { type Kysely, sql } from "kysely";

// An approval records the unverified values (table values taken from memory, features/analysis/
// unverified-values.ts) that the approver acknowledged: a JSON array of { key, what, value, source }.
// revision_decisions is append-only, so the list is part of the frozen approval record. Earlier
// decisions, and every return, hold an empty list.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table revision_decisions
      add column acknowledged_unverified jsonb not null default '[]'::jsonb,
      add constraint revision_decisions_acknowledged_is_list
        check (jsonb_typeof(acknowledged_unverified) = 'array'),
      add constraint revision_decisions_return_acknowledges_nothing
        check (kind = 'approved' or acknowledged_unverified = '[]'::jsonb)
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table revision_decisions drop column if exists acknowledged_unverified`.execute(db);
}
