"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getDb } from "@/db/index";
import type { LibraryKind } from "@/db/tables/library";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer } from "@/server/auth/guard";
import {
  createBolting,
  createFlangeTemplate,
  createGasket,
  deleteLibraryRow,
  setBuiltinHidden,
  updateGasket,
} from "./mutations";
import { canEditLibrary } from "./policies";
import {
  boltingInputSchema,
  deleteRowSchema,
  flangeInputSchema,
  gasketInputSchema,
  hideBuiltinSchema,
} from "./schema";
import { INVALID_FORM_MESSAGE, fieldErrorsOf, formStrings, invalidForm } from "@/features/forms/form-data";
import type { Viewer } from "@/server/auth/viewer";
import { loggedAction } from "@/server/log/with-logging";

// Stockroom entry points: authenticate, parse, authorise (admin), delegate, revalidate.
const PATHS: Record<LibraryKind, string> = {
  gasket: "/library/gaskets",
  bolting: "/library/bolting",
  flange: "/library/flanges",
};
const NOT_ADMIN = "Only an admin of this organisation can change the Stockroom.";

async function editor() {
  const viewer = await requireViewer();
  return canEditLibrary(viewer) ? viewer : null;
}

type SaveResult = ActionResult<{ id: string }>;

/** A Stockroom form's action: only an admin; `save` parses and writes; the section is revalidated on success. */
function stockroomSave(
  kind: LibraryKind,
  save: (viewer: Viewer, raw: Record<string, string>) => Promise<SaveResult>,
): (prev: SaveResult | null, formData: FormData) => Promise<SaveResult> {
  return async (_prev, formData) => {
    const viewer = await editor();
    if (!viewer) return { ok: false, message: NOT_ADMIN };
    const result = await save(viewer, formStrings(formData));
    if (result.ok) revalidatePath(PATHS[kind]);
    return result;
  };
}

const saveGasketActionImpl = stockroomSave("gasket", async (viewer, raw) => {
  const parsed = gasketInputSchema.safeParse(raw);
  if (!parsed.success) return invalidForm(parsed.error);
  const rowId = z.uuid().safeParse(raw.rowId);
  const db = getDb();
  const result = rowId.success
    ? await updateGasket(db, viewer.organizationId, rowId.data, parsed.data)
    : await createGasket(db, viewer.organizationId, viewer.userId, parsed.data);
  if (!result.ok) return result;
  if (!result.data) return { ok: false, message: "That row no longer exists." };
  return { ok: true, data: { id: result.data.id } };
});

/** One material with up to three size ranges: fields `<name>_1`, `<name>_2`, `<name>_3`; empty ranges are skipped. */
const createBoltingActionImpl = stockroomSave("bolting", async (viewer, raw) => {
  const common = { name: raw.name, modulus_mpa: raw.modulus_mpa, source: raw.source, edition: raw.edition };
  const rangeKeys = ["max_diameter_mm", "proof_mpa", "yield_mpa", "tensile_mpa", "allowable_mpa"] as const;
  const inputs = [];
  const fieldErrors: Record<string, string[]> = {};
  for (const i of [1, 2, 3]) {
    const range = Object.fromEntries(rangeKeys.map((k) => [k, raw[`${k}_${i}`] ?? ""]));
    if (i > 1 && Object.values(range).every((v) => v.trim() === "")) continue;
    const parsed = boltingInputSchema.safeParse({ ...common, ...range });
    if (parsed.success) inputs.push(parsed.data);
    else {
      for (const [k, msgs] of Object.entries(fieldErrorsOf(parsed.error))) {
        fieldErrors[(rangeKeys as readonly string[]).includes(k) ? `${k}_${i}` : k] = msgs;
      }
    }
  }
  if (Object.keys(fieldErrors).length > 0) return { ok: false, message: INVALID_FORM_MESSAGE, fieldErrors };
  const result = await createBolting(getDb(), viewer.organizationId, viewer.userId, inputs);
  return result.ok ? { ok: true, data: { id: result.data.id } } : result;
});

const createFlangeTemplateActionImpl = stockroomSave("flange", async (viewer, raw) => {
  const parsed = flangeInputSchema.safeParse(raw);
  if (!parsed.success) return invalidForm(parsed.error);
  const result = await createFlangeTemplate(getDb(), viewer.organizationId, viewer.userId, parsed.data);
  return result.ok ? { ok: true, data: { id: result.data.id } } : result;
});

async function deleteLibraryRowActionImpl(formData: FormData): Promise<void> {
  const viewer = await editor();
  const parsed = deleteRowSchema.safeParse(formStrings(formData));
  if (!viewer || !parsed.success) return;
  await deleteLibraryRow(getDb(), viewer.organizationId, parsed.data.kind, parsed.data.id);
  revalidatePath(PATHS[parsed.data.kind]);
}

async function setBuiltinHiddenActionImpl(formData: FormData): Promise<void> {
  const viewer = await editor();
  const parsed = hideBuiltinSchema.safeParse(formStrings(formData));
  if (!viewer || !parsed.success) return;
  await setBuiltinHidden(
    getDb(),
    viewer.organizationId,
    viewer.userId,
    parsed.data.kind,
    parsed.data.builtinId,
    parsed.data.hidden,
  );
  revalidatePath(PATHS[parsed.data.kind]);
}

export const saveGasketAction = loggedAction("library.saveGasket", saveGasketActionImpl);
export const createBoltingAction = loggedAction("library.createBolting", createBoltingActionImpl);
export const createFlangeTemplateAction = loggedAction(
  "library.createFlangeTemplate",
  createFlangeTemplateActionImpl,
);
export const deleteLibraryRowAction = loggedAction("library.deleteLibraryRow", deleteLibraryRowActionImpl);
export const setBuiltinHiddenAction = loggedAction("library.setBuiltinHidden", setBuiltinHiddenActionImpl);
