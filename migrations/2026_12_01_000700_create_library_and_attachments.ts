import { type Kysely, sql } from "kysely";

// The Stockroom (each organisation's own gaskets, bolting materials and flange templates, plus the
// built-in catalogue rows it chose to hide) and design attachments with their blobs.
// Engineering values are double precision so they come back from pg as numbers, in the core's
// internal units (mm, MPa). A design never references these rows: it embeds a copy of the values
// it used, so editing or deleting a row here cannot change a saved revision.
export async function up(db: Kysely<any>): Promise<void> {
  const org = (col: any) => col.notNull().references("organizations.id").onDelete("cascade");
  const timestamps = (t: any) =>
    t
      .addColumn("created_by", "uuid", (col: any) => col.references("users.id").onDelete("set null"))
      .addColumn("created_at", "timestamptz", (col: any) => col.notNull().defaultTo(sql`now()`))
      .addColumn("updated_at", "timestamptz", (col: any) => col.notNull().defaultTo(sql`now()`));

  await timestamps(
    db.schema
      .createTable("library_gaskets")
      .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
      .addColumn("organization_id", "uuid", org)
      .addColumn("name", "text", (col) => col.notNull())
      .addColumn("gasket_type", "text", (col) => col.notNull())
      .addColumn("m", "double precision", (col) => col.notNull())
      .addColumn("y_mpa", "double precision", (col) => col.notNull())
      // { "L1.0": { qMinMpa, qsMinMpa }, "L0.1": …, "L0.01": … } from an EN 13555 test report.
      .addColumn("tightness", "jsonb", (col) => col.notNull().defaultTo(sql`'{}'::jsonb`))
      .addColumn("qs_max_mpa", "double precision")
      .addColumn("pqr", "double precision")
      .addColumn("eg_mpa", "double precision")
      .addColumn("modulus_mpa", "double precision", (col) => col.notNull())
      .addColumn("thickness_mm", "double precision", (col) => col.notNull())
      .addColumn("source", "text", (col) => col.notNull())
      .addColumn("edition", "text", (col) => col.notNull().defaultTo("")),
  ).execute();
  await sql`create unique index library_gaskets_org_name_key on library_gaskets (organization_id, lower(name))`.execute(
    db,
  );

  await timestamps(
    db.schema
      .createTable("library_bolting")
      .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
      .addColumn("organization_id", "uuid", org)
      .addColumn("name", "text", (col) => col.notNull())
      .addColumn("modulus_mpa", "double precision", (col) => col.notNull())
      // [{ maxDiameterMm, proofMpa|null, yieldMpa, tensileMpa, allowableMpa|null }] ascending by size.
      .addColumn("ranges", "jsonb", (col) => col.notNull())
      .addColumn("source", "text", (col) => col.notNull())
      .addColumn("edition", "text", (col) => col.notNull().defaultTo("")),
  ).execute();
  await sql`create unique index library_bolting_org_name_key on library_bolting (organization_id, lower(name))`.execute(
    db,
  );

  await timestamps(
    db.schema
      .createTable("library_flange_templates")
      .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
      .addColumn("organization_id", "uuid", org)
      .addColumn("standard", "text", (col) => col.notNull())
      .addColumn("pressure_class", "text", (col) => col.notNull())
      .addColumn("size", "text", (col) => col.notNull())
      .addColumn("outside_diameter_mm", "double precision", (col) => col.notNull())
      .addColumn("bore_diameter_mm", "double precision")
      .addColumn("bolt_circle_diameter_mm", "double precision", (col) => col.notNull())
      .addColumn("bolt_count", "integer", (col) => col.notNull())
      .addColumn("bolt_designation", "text", (col) => col.notNull())
      .addColumn("bolt_diameter_mm", "double precision", (col) => col.notNull())
      .addColumn("hole_diameter_mm", "double precision", (col) => col.notNull())
      .addColumn("source", "text", (col) => col.notNull())
      .addColumn("edition", "text", (col) => col.notNull().defaultTo(""))
      .addCheckConstraint(
        "library_flange_templates_geometry",
        sql`bolt_count >= 2 and bolt_circle_diameter_mm < outside_diameter_mm`,
      ),
  ).execute();
  await sql`create unique index library_flange_templates_key on library_flange_templates (organization_id, lower(standard), lower(pressure_class), lower(size))`.execute(
    db,
  );

  await db.schema
    .createTable("library_hidden_builtins")
    .addColumn("organization_id", "uuid", org)
    .addColumn("kind", "text", (col) => col.notNull().check(sql`kind in ('gasket', 'bolting', 'flange')`))
    .addColumn("builtin_id", "text", (col) => col.notNull())
    .addColumn("hidden_by", "uuid", (col) => col.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("library_hidden_builtins_pkey", ["organization_id", "kind", "builtin_id"])
    .execute();

  // Blobs live in PostgreSQL so a backup of the database is a backup of everything; only
  // server/storage touches this table.
  await db.schema
    .createTable("blobs")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", org)
    .addColumn("bytes", "bytea", (col) => col.notNull())
    .addColumn("size_bytes", "integer", (col) => col.notNull())
    .addColumn("sha256", "text", (col) => col.notNull())
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable("design_attachments")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", org)
    .addColumn("design_id", "uuid", (col) => col.notNull().references("designs.id").onDelete("cascade"))
    .addColumn("blob_id", "uuid", (col) => col.notNull().references("blobs.id"))
    .addColumn("file_name", "text", (col) => col.notNull())
    // Detected from the bytes (never the browser's declared type): pdf, png, jpeg, dxf.
    .addColumn("kind", "text", (col) => col.notNull().check(sql`kind in ('pdf', 'png', 'jpeg', 'dxf')`))
    .addColumn("content_type", "text", (col) => col.notNull())
    .addColumn("size_bytes", "integer", (col) => col.notNull())
    .addColumn("sha256", "text", (col) => col.notNull())
    .addColumn("uploaded_by", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex("design_attachments_design_idx")
    .on("design_attachments")
    .columns(["organization_id", "design_id", "created_at"])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("design_attachments").execute();
  await db.schema.dropTable("blobs").execute();
  await db.schema.dropTable("library_hidden_builtins").execute();
  await db.schema.dropTable("library_flange_templates").execute();
  await db.schema.dropTable("library_bolting").execute();
  await db.schema.dropTable("library_gaskets").execute();
}
