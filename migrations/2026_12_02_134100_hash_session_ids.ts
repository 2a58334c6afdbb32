import { type Kysely, sql } from "kysely";

// sessions.id holds SHA-256 (hex) of the session id instead of the id itself, as lucia v3's guides
// describe (server/auth/session-id.ts): reading the table no longer yields live sessions. Existing
// sessions stay valid: their stored ids are hashed in place, so the cookies that carry them still
// match. The check makes the table refuse anything that is not such a hash (issued ids are 40
// base32 characters, never 64 hex digits).
export async function up(db: Kysely<any>): Promise<void> {
  await sql`update sessions set id = encode(sha256(convert_to(id, 'UTF8')), 'hex')`.execute(db);
  await sql`alter table sessions add constraint sessions_id_is_sha256 check (id ~ '^[0-9a-f]{64}$')`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  // A hash cannot be turned back into the id: going down signs everybody out.
  await sql`alter table sessions drop constraint if exists sessions_id_is_sha256`.execute(db);
  await sql`delete from sessions`.execute(db);
}
