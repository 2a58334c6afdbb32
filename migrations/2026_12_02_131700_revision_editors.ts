import { type Kysely, sql } from "kysely";

// Four-eyes independence over the whole life of a revision, not only its last save. Every person
// who created, saved or submitted a revision gets one row in revision_editors; a trigger on
// design_revisions writes it in the same statement as the insert or update, so no code path (create,
// Drawing intake, save, start revision N, submit, or SQL sent by hand) can forget it. The table is
// append-only like the other history tables. A decision (approve or return, on design_revisions or as
// a revision_decisions row) by anyone in that list is refused by the database itself.
// Existing revisions are backfilled from what is known: creator, last editor, submitter and the
// design activity entries (created, saved, submitted, new-revision) that name the revision.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("revision_editors")
    .addColumn("revision_id", "uuid", (col) =>
      col.notNull().references("design_revisions.id").onDelete("cascade"),
    )
    .addColumn("user_id", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("first_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint("revision_editors_pkey", ["revision_id", "user_id"])
    .execute();
  await sql`
    create trigger revision_editors_append_only
    before update or delete on revision_editors
    for each row execute function refuse_change_to_history_row()`.execute(db);

  await sql`
    create function record_revision_editors() returns trigger language plpgsql as $$
    begin
      insert into revision_editors (revision_id, user_id)
      select new.id, who from unnest(array[new.created_by, new.last_edited_by, new.submitted_by]) as who
      where who is not null
      on conflict do nothing;
      return null;
    end $$`.execute(db);
  await sql`
    create trigger design_revisions_record_editors
    after insert or update of created_by, last_edited_by, submitted_by, document, version
    on design_revisions
    for each row execute function record_revision_editors()`.execute(db);

  await sql`
    create function refuse_decision_by_editor() returns trigger language plpgsql as $$
    declare
      revision uuid;
      decider uuid;
    begin
      if tg_table_name = 'design_revisions' then
        if new.status not in ('approved', 'returned')
          or (tg_op = 'UPDATE' and new.status is not distinct from old.status) then
          return new;
        end if;
        revision := new.id;
        decider := new.decided_by;
        if decider is null then
          raise exception 'revision % of design % needs the deciding person (decided_by) to be %',
            new.number, new.design_id, new.status using errcode = 'check_violation';
        end if;
        if decider in (new.created_by, new.last_edited_by) or decider is not distinct from new.submitted_by then
          raise exception 'four-eyes rule: the person deciding on revision % of design % created, saved or submitted it',
            new.number, new.design_id using errcode = 'check_violation';
        end if;
      else
        revision := new.revision_id;
        decider := new.actor_id;
      end if;
      if exists (select from revision_editors e where e.revision_id = revision and e.user_id = decider) then
        raise exception 'four-eyes rule: the person deciding on revision % created, saved or submitted it', revision
          using errcode = 'check_violation';
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger design_revisions_decided_by_independent
    before insert or update of status on design_revisions
    for each row execute function refuse_decision_by_editor()`.execute(db);
  await sql`
    create trigger revision_decisions_by_independent
    before insert on revision_decisions
    for each row execute function refuse_decision_by_editor()`.execute(db);

  await sql`
    insert into revision_editors (revision_id, user_id, first_at)
    select revision_id, user_id, min(at) from (
      select id as revision_id, created_by as user_id, created_at as at from design_revisions
      union all
      select id, last_edited_by, updated_at from design_revisions
      union all
      select id, submitted_by, submitted_at from design_revisions where submitted_by is not null
      union all
      select revision_id, actor_id, created_at from design_activity
      where revision_id is not null and kind in ('created', 'saved', 'submitted', 'new-revision')
    ) known
    group by revision_id, user_id
    on conflict do nothing`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists revision_decisions_by_independent on revision_decisions`.execute(db);
  await sql`drop trigger if exists design_revisions_decided_by_independent on design_revisions`.execute(db);
  await sql`drop function if exists refuse_decision_by_editor()`.execute(db);
  await sql`drop trigger if exists design_revisions_record_editors on design_revisions`.execute(db);
  await sql`drop function if exists record_revision_editors()`.execute(db);
  await db.schema.dropTable("revision_editors").ifExists().execute();
}
