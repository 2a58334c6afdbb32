import "server-only";
import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { UnitSystem } from "@/db/tables/core";
import type { JointDesign } from "@/features/analysis/core/design";
import { recordActivity } from "@/features/activity/queries";
import { sha256OfJson } from "@/features/analysis/content-hash";
import { isoString } from "@/db/dates";
import { parseAnalysis, runAnalysis } from "./run-analysis";
import type { JointAnalysis, SaveWorkingRevisionInput, WorkingRevisionStatus } from "./workspace-contract";

// Writes of the designs feature. Callers have validated the document and checked the policy;
// these still scope every statement by organisation, and a refused save writes nothing.

/** SHA-256 of the document's canonical JSON, so equal designs hash equally whatever the key order. */
export function hashDocument(document: JointDesign): string {
  return sha256OfJson(document);
}

function workingRevisionId(db: Kysely<Database>, designId: string) {
  return db
    .selectFrom("design_revisions")
    .select("id")
    .where("design_id", "=", designId)
    .orderBy("number", "desc")
    .limit(1);
}

export interface CreateDesignInput {
  organizationId: string;
  ownerId: string;
  name: string;
  equipmentTag: string;
  document: JointDesign;
}

/** A new design with revision 1 as a draft, its result computed by the core and stored. */
export async function createDesign(
  db: Kysely<Database>,
  input: CreateDesignInput,
): Promise<{ designId: string; version: number }> {
  const document: JointDesign = { ...input.document, name: input.name };
  const { json: result, coreVersion } = await runAnalysis(document);
  return db.transaction().execute(async (trx) => {
    const design = await trx
      .insertInto("designs")
      .values({
        organization_id: input.organizationId,
        name: input.name,
        equipment_tag: input.equipmentTag,
        outline_kind: document.outline.kind,
        owner_id: input.ownerId,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    const revision = await trx
      .insertInto("design_revisions")
      .values({
        design_id: design.id,
        organization_id: input.organizationId,
        number: 1,
        status: "draft",
        document: JSON.stringify(document),
        result,
        core_version: coreVersion,
        content_hash: hashDocument(document),
        created_by: input.ownerId,
        last_edited_by: input.ownerId,
      })
      .returning(["id", "version"])
      .executeTakeFirstOrThrow();
    await recordActivity(trx, {
      organizationId: input.organizationId,
      designId: design.id,
      revisionId: revision.id,
      actorId: input.ownerId,
      kind: "created",
      detail: input.name,
    });
    return { designId: design.id, version: revision.version };
  });
}

/** A save as the editor sends it (the workspace contract), and who saves it in which organisation. */
export interface SaveWorkingRevisionCommand extends SaveWorkingRevisionInput {
  organizationId: string;
  userId: string;
}

export type SaveOutcome =
  | { kind: "saved"; version: number; savedAt: string; result: JointAnalysis }
  | { kind: "not-found" }
  | { kind: "stale"; version: number; savedByName: string; savedAt: string }
  | { kind: "frozen"; status: WorkingRevisionStatus };

/**
 * Optimistic lock in one UPDATE: it matches only the working revision at `baseVersion` while it is
 * draft or returned. Zero rows means someone saved first, the revision is frozen, or the design is
 * not ours; the follow-up read only explains which, and nothing was written.
 */
export async function saveWorkingRevision(
  db: Kysely<Database>,
  command: SaveWorkingRevisionCommand,
): Promise<SaveOutcome> {
  const name = command.name ?? undefined;
  const document: JointDesign = name ? { ...command.document, name } : command.document;
  const analysis = await runAnalysis(document);
  return db.transaction().execute(async (trx) => {
    const updated = await trx
      .updateTable("design_revisions")
      .set({
        document: JSON.stringify(document),
        result: analysis.json,
        core_version: analysis.coreVersion,
        content_hash: hashDocument(document),
        version: sql`version + 1`,
        last_edited_by: command.userId,
        updated_at: sql`now()`,
      })
      .where("id", "=", workingRevisionId(trx, command.designId))
      .where("organization_id", "=", command.organizationId)
      .where("version", "=", command.baseVersion)
      .where("status", "in", ["draft", "returned"])
      .returning(["id", "version", "updated_at"])
      .executeTakeFirst();
    if (updated) {
      await recordSave(trx, command, updated.id, updated.version);
      await trx
        .updateTable("designs")
        .set({
          outline_kind: document.outline.kind,
          updated_at: sql`now()`,
          ...(name ? { name } : {}),
          ...(command.equipmentTag !== undefined ? { equipment_tag: command.equipmentTag } : {}),
        })
        .where("id", "=", command.designId)
        .where("organization_id", "=", command.organizationId)
        .execute();
      return {
        kind: "saved",
        version: updated.version,
        savedAt: isoString(updated.updated_at),
        result: parseAnalysis(analysis),
      };
    }
    const current = await trx
      .selectFrom("design_revisions")
      .innerJoin("users", "users.id", "design_revisions.last_edited_by")
      .select([
        "design_revisions.status",
        "design_revisions.version",
        "design_revisions.updated_at",
        "users.display_name",
      ])
      .where("design_revisions.id", "=", workingRevisionId(trx, command.designId))
      .where("design_revisions.organization_id", "=", command.organizationId)
      .executeTakeFirst();
    if (!current) return { kind: "not-found" };
    if (current.status !== "draft" && current.status !== "returned")
      return { kind: "frozen", status: current.status };
    return {
      kind: "stale",
      version: current.version,
      savedByName: current.display_name,
      savedAt: isoString(current.updated_at),
    };
  });
}

/** A burst of saves by one person (autosave every pause) is one "saved" entry in the activity log. */
export const SAVE_ENTRY_QUIET_MINUTES = 15;

async function recordSave(
  trx: Kysely<Database>,
  command: SaveWorkingRevisionCommand,
  revisionId: string,
  version: number,
): Promise<void> {
  // A pattern applied from the Pattern finder is always its own entry, never folded into a burst.
  const origin = command.patternOrigin;
  const record = (detail: string) =>
    recordActivity(trx, {
      organizationId: command.organizationId,
      designId: command.designId,
      revisionId,
      actorId: command.userId,
      kind: "saved",
      detail,
    });
  if (origin)
    return record(
      `version ${version} · pattern applied from suggestion ${origin.suggestion} of ${origin.of}`,
    );
  const last = await trx
    .selectFrom("design_activity")
    .select(["kind", "actor_id", "revision_id"])
    .select(
      sql<boolean>`created_at > now() - make_interval(mins => ${SAVE_ENTRY_QUIET_MINUTES})`.as("recent"),
    )
    .where("design_id", "=", command.designId)
    .where("organization_id", "=", command.organizationId)
    .orderBy("created_at", "desc")
    .limit(1)
    .executeTakeFirst();
  if (
    last &&
    last.kind === "saved" &&
    last.actor_id === command.userId &&
    last.revision_id === revisionId &&
    last.recent
  )
    return;
  await record(`version ${version}`);
}

/** A new design (revision 1, draft) holding a copy of the working document of another. */
export async function duplicateDesign(
  db: Kysely<Database>,
  input: { organizationId: string; ownerId: string; designId: string },
): Promise<{ designId: string } | null> {
  const source = await db
    .selectFrom("designs")
    .innerJoin("design_revisions", "design_revisions.design_id", "designs.id")
    .select(["designs.name", "designs.equipment_tag", "design_revisions.document"])
    .where("designs.id", "=", input.designId)
    .where("designs.organization_id", "=", input.organizationId)
    .where("design_revisions.id", "=", workingRevisionId(db, input.designId))
    .executeTakeFirst();
  if (!source) return null;
  const name = `${source.name} (copy)`.slice(0, 120);
  const { designId } = await createDesign(db, {
    organizationId: input.organizationId,
    ownerId: input.ownerId,
    name,
    equipmentTag: source.equipment_tag,
    document: source.document,
  });
  return { designId };
}

/** Archives (hides from the register) or restores a design; false when it is not ours. */
export async function setDesignArchived(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  archived: boolean,
): Promise<boolean> {
  const result = await db
    .updateTable("designs")
    .set({ archived_at: archived ? sql`now()` : null })
    .where("id", "=", designId)
    .where("organization_id", "=", organizationId)
    .executeTakeFirst();
  return Number(result.numUpdatedRows) === 1;
}

export type DeleteOutcome =
  { kind: "deleted" } | { kind: "not-found" } | { kind: "refused"; message: string };

export const DELETE_REFUSED_MESSAGE =
  "Only a draft that was never submitted can be deleted; archive this design instead.";

/** Deletes a design whose only revision is a never-submitted draft (checked under a row lock). */
export async function deleteDesign(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
): Promise<DeleteOutcome> {
  return db.transaction().execute(async (trx) => {
    const design = await trx
      .selectFrom("designs")
      .select("id")
      .where("id", "=", designId)
      .where("organization_id", "=", organizationId)
      .forUpdate()
      .executeTakeFirst();
    if (!design) return { kind: "not-found" };
    const revisions = await trx
      .selectFrom("design_revisions")
      .select(["status", "submitted_at"])
      .where("design_id", "=", designId)
      .forUpdate()
      .execute();
    const deletable =
      revisions.length === 1 && revisions[0].status === "draft" && revisions[0].submitted_at === null;
    if (!deletable) return { kind: "refused", message: DELETE_REFUSED_MESSAGE };
    await trx.deleteFrom("designs").where("id", "=", designId).execute();
    return { kind: "deleted" };
  });
}

export async function setUserUnitSystem(
  db: Kysely<Database>,
  userId: string,
  unitSystem: UnitSystem,
): Promise<void> {
  await db.updateTable("users").set({ unit_system: unitSystem }).where("id", "=", userId).execute();
}
