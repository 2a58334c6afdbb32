import "server-only";
import type { Kysely } from "kysely";
import { z } from "zod";
import type { Database } from "@/db/types";
import type { Viewer } from "@/server/auth/guard";
import type { UnitSystem } from "@/features/analysis/core/design";
import { INVALID_FORM_MESSAGE, fieldErrorsOf } from "@/features/forms/form-data";
import { findDesignState, type DesignStateDto } from "./queries";
import {
  createDesign,
  deleteDesign,
  duplicateDesign,
  saveWorkingRevision,
  setDesignArchived,
  setUserUnitSystem,
} from "./mutations";
import { formatUtcMinute } from "./model/labels";
import { buildDesignFromTemplate, type TemplateInput } from "./model/templates";
import {
  canArchiveDesign,
  canCreateDesign,
  canDeleteDesign,
  canEditDesign,
  isEditableStatus,
} from "./policies";
import { createDesignApiSchema, designIdSchema, saveWorkingRevisionSchema, unitSystemSchema } from "./schema";
import { newDesignFormSchema } from "./template-schema";
import type { JointAnalysis } from "./workspace-contract";

// Parse → authorise → delegate for every designs mutation, given the viewer. Server actions and
// route handlers are thin wrappers around these (and tests call them directly): one rule set.

export type CommandFailureReason = "invalid" | "not-found" | "forbidden" | "conflict" | "frozen";
export type CommandResult<T> =
  | { ok: true; data: T }
  | {
      ok: false;
      message: string;
      reason: CommandFailureReason;
      fieldErrors?: Record<string, string[]>;
      conflict?: true;
    };

const NOT_FOUND = "This design does not exist in your organisation.";

function invalid(error: z.ZodError, flat = false): CommandResult<never> {
  // A form keys errors by field name; a JSON body (the API, the editor's save) by full path.
  return {
    ok: false,
    reason: "invalid",
    message: INVALID_FORM_MESSAGE,
    fieldErrors: fieldErrorsOf(error, { nested: !flat }),
  };
}

function refuse(reason: CommandFailureReason, message: string): CommandResult<never> {
  return { ok: false, reason, message };
}

export function frozenMessage(status: string): string {
  return `This revision is ${status === "approved" ? "approved" : "in review"} and cannot be edited.`;
}

export function conflictMessage(savedByName: string, savedAtIso: string, version: number): string {
  return `This design was changed by ${savedByName} at ${formatUtcMinute(savedAtIso)} (version ${version}). Your edits are kept here; reload to see theirs, or copy your changes.`;
}

export async function createDesignFromForm(
  db: Kysely<Database>,
  viewer: Viewer,
  raw: Record<string, unknown>,
): Promise<CommandResult<{ designId: string }>> {
  if (!canCreateDesign(viewer)) return refuse("forbidden", "Only designers can create designs.");
  const parsed = newDesignFormSchema.safeParse(raw);
  if (!parsed.success) return invalid(parsed.error, true);
  const { name, equipmentTag, ...template } = parsed.data;
  const document = buildDesignFromTemplate(
    { name, equipmentTag, units: viewer.unitSystem },
    template as TemplateInput,
  );
  const { designId } = await createDesign(db, {
    organizationId: viewer.organizationId,
    ownerId: viewer.userId,
    name,
    equipmentTag,
    document,
  });
  return { ok: true, data: { designId } };
}

export async function createDesignFromApi(
  db: Kysely<Database>,
  viewer: Viewer,
  body: unknown,
): Promise<CommandResult<{ designId: string; version: number }>> {
  if (!canCreateDesign(viewer)) return refuse("forbidden", "Only designers can create designs.");
  const parsed = createDesignApiSchema.safeParse(body);
  if (!parsed.success) return invalid(parsed.error);
  const { name, equipmentTag, template, document } = parsed.data;
  const built =
    document ??
    buildDesignFromTemplate({ name, equipmentTag, units: viewer.unitSystem }, template as TemplateInput);
  const created = await createDesign(db, {
    organizationId: viewer.organizationId,
    ownerId: viewer.userId,
    name,
    equipmentTag,
    document: built,
  });
  return { ok: true, data: created };
}

export async function saveWorkingRevisionForViewer(
  db: Kysely<Database>,
  viewer: Viewer,
  raw: unknown,
): Promise<CommandResult<{ version: number; result: JointAnalysis; savedAt: string }>> {
  const parsed = saveWorkingRevisionSchema.safeParse(raw);
  if (!parsed.success) return invalid(parsed.error);
  const input = parsed.data;
  const design = await findDesignState(db, viewer.organizationId, input.designId);
  if (!design) return refuse("not-found", NOT_FOUND);
  if (!isEditableStatus(design.status)) return refuse("frozen", frozenMessage(design.status));
  if (!canEditDesign(viewer, design)) return refuse("forbidden", "Only designers can edit designs.");
  const outcome = await saveWorkingRevision(db, {
    ...input,
    organizationId: viewer.organizationId,
    userId: viewer.userId,
  });
  switch (outcome.kind) {
    case "saved":
      return {
        ok: true,
        data: { version: outcome.version, result: outcome.result, savedAt: outcome.savedAt },
      };
    case "not-found":
      return refuse("not-found", NOT_FOUND);
    case "frozen":
      return refuse("frozen", frozenMessage(outcome.status));
    case "stale":
      return {
        ok: false,
        reason: "conflict",
        conflict: true,
        message: conflictMessage(outcome.savedByName, outcome.savedAt, outcome.version),
      };
  }
}

export async function duplicateDesignForViewer(
  db: Kysely<Database>,
  viewer: Viewer,
  rawId: unknown,
): Promise<CommandResult<{ designId: string }>> {
  const id = designIdSchema.safeParse(rawId);
  if (!id.success) return refuse("not-found", NOT_FOUND);
  if (!canCreateDesign(viewer)) return refuse("forbidden", "Only designers can duplicate designs.");
  const copy = await duplicateDesign(db, {
    organizationId: viewer.organizationId,
    ownerId: viewer.userId,
    designId: id.data,
  });
  return copy ? { ok: true, data: copy } : refuse("not-found", NOT_FOUND);
}

/** The design `rawId` names in the viewer's organisation, if the viewer may archive or delete it (owner or admin). */
async function designTheViewerMayArchive(
  db: Kysely<Database>,
  viewer: Viewer,
  rawId: unknown,
  verb: "archive" | "delete",
): Promise<DesignStateDto | { refusal: CommandResult<never> }> {
  const id = designIdSchema.safeParse(rawId);
  const design = id.success ? await findDesignState(db, viewer.organizationId, id.data) : null;
  if (!design) return { refusal: refuse("not-found", NOT_FOUND) };
  if (!canArchiveDesign(viewer, design))
    return { refusal: refuse("forbidden", `Only the owner or an admin can ${verb} a design.`) };
  return design;
}

export async function setDesignArchivedForViewer(
  db: Kysely<Database>,
  viewer: Viewer,
  rawId: unknown,
  archived: boolean,
): Promise<CommandResult<{ archived: boolean }>> {
  const design = await designTheViewerMayArchive(db, viewer, rawId, "archive");
  if ("refusal" in design) return design.refusal;
  await setDesignArchived(db, viewer.organizationId, design.designId, archived);
  return { ok: true, data: { archived } };
}

export async function deleteDesignForViewer(
  db: Kysely<Database>,
  viewer: Viewer,
  rawId: unknown,
): Promise<CommandResult<{ deleted: true }>> {
  const design = await designTheViewerMayArchive(db, viewer, rawId, "delete");
  if ("refusal" in design) return design.refusal;
  if (!canDeleteDesign(viewer, design))
    return refuse(
      "conflict",
      "Only a draft that was never submitted can be deleted; archive this design instead.",
    );
  const outcome = await deleteDesign(db, viewer.organizationId, design.designId);
  if (outcome.kind === "deleted") return { ok: true, data: { deleted: true } };
  return outcome.kind === "not-found" ? refuse("not-found", NOT_FOUND) : refuse("conflict", outcome.message);
}

export async function setUnitSystemForViewer(
  db: Kysely<Database>,
  viewer: Viewer,
  raw: unknown,
): Promise<CommandResult<{ unitSystem: UnitSystem }>> {
  const parsed = unitSystemSchema.safeParse(raw);
  if (!parsed.success)
    return {
      ok: false,
      reason: "invalid",
      message: "Unit system must be SI or US.",
      fieldErrors: { unitSystem: ["Unit system must be SI or US"] },
    };
  await setUserUnitSystem(db, viewer.userId, parsed.data);
  return { ok: true, data: { unitSystem: parsed.data } };
}
