import { type Kysely, sql } from "kysely";

// Invitations, password reset tokens and the sign-in/reset attempt log used for rate limiting.
// Tokens are stored only as their sha-256 hex digest: a copy of this table cannot be replayed as
// links. The attempt log lives in PostgreSQL so several app instances share one limit.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("invitations")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("email", "text", (col) => col.notNull())
    .addColumn("roles", sql`text[]`, (col) => col.notNull())
    .addColumn("token_hash", "text", (col) => col.notNull().unique())
    .addColumn("invited_by", "uuid", (col) => col.references("users.id").onDelete("set null"))
    .addColumn("expires_at", "timestamptz", (col) => col.notNull())
    .addColumn("accepted_at", "timestamptz")
    .addColumn("revoked_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("invitations_email_lower", sql`email = lower(email)`)
    .addCheckConstraint(
      "invitations_roles_known",
      sql`roles <@ array['designer', 'approver', 'admin']::text[] and cardinality(roles) > 0`,
    )
    .execute();
  // One open invitation per address and organisation; a resend replaces its token.
  await sql`create unique index invitations_open_key on invitations (organization_id, email) where accepted_at is null and revoked_at is null`.execute(
    db,
  );

  await db.schema
    .createTable("password_reset_tokens")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("user_id", "uuid", (col) => col.notNull().references("users.id").onDelete("cascade"))
    .addColumn("token_hash", "text", (col) => col.notNull().unique())
    .addColumn("expires_at", "timestamptz", (col) => col.notNull())
    .addColumn("used_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex("password_reset_tokens_user_idx")
    .on("password_reset_tokens")
    .column("user_id")
    .execute();

  await db.schema
    .createTable("auth_attempts")
    .addColumn("id", "bigserial", (col) => col.primaryKey())
    .addColumn("kind", "text", (col) => col.notNull())
    .addColumn("key", "text", (col) => col.notNull())
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex("auth_attempts_lookup_idx")
    .on("auth_attempts")
    .columns(["kind", "key", "created_at"])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("auth_attempts").execute();
  await db.schema.dropTable("password_reset_tokens").execute();
  await db.schema.dropTable("invitations").execute();
}
