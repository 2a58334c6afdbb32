import { type Kysely, sql } from "kysely";

// Users, organisations, memberships with roles, and sessions. A person may belong to several
// organisations and hold several roles in each; roles are a checked text array rather than a
// join table because the set is small and fixed (designer, approver, admin).
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("users")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("email", "text", (col) => col.notNull())
    .addColumn("display_name", "text", (col) => col.notNull())
    .addColumn("password_hash", "text")
    .addColumn("unit_system", "text", (col) =>
      col
        .notNull()
        .defaultTo("SI")
        .check(sql`unit_system in ('SI', 'US')`),
    )
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("disabled_at", "timestamptz")
    .addCheckConstraint("users_email_lower", sql`email = lower(email)`)
    .execute();
  await db.schema.createIndex("users_email_key").on("users").column("email").unique().execute();

  await db.schema
    .createTable("organizations")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("name", "text", (col) => col.notNull())
    .addColumn("slug", "text", (col) => col.notNull().unique())
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable("memberships")
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("user_id", "uuid", (col) => col.notNull().references("users.id").onDelete("cascade"))
    .addColumn("roles", sql`text[]`, (col) => col.notNull().defaultTo(sql`'{}'::text[]`))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("memberships_pkey", ["organization_id", "user_id"])
    .addCheckConstraint(
      "memberships_roles_known",
      sql`roles <@ array['designer', 'approver', 'admin']::text[]`,
    )
    .execute();
  await db.schema.createIndex("memberships_user_idx").on("memberships").column("user_id").execute();

  await db.schema
    .createTable("sessions")
    .addColumn("id", "text", (col) => col.primaryKey())
    .addColumn("user_id", "uuid", (col) => col.notNull().references("users.id").onDelete("cascade"))
    .addColumn("expires_at", "timestamptz", (col) => col.notNull())
    .addColumn("active_organization_id", "uuid", (col) =>
      col.references("organizations.id").onDelete("set null"),
    )
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex("sessions_user_idx").on("sessions").column("user_id").execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("sessions").execute();
  await db.schema.dropTable("memberships").execute();
  await db.schema.dropTable("organizations").execute();
  await db.schema.dropTable("users").execute();
}
