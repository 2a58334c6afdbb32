"use server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { getDb } from "@/db/index";
import { requireViewer } from "@/server/auth/guard";
import type { ActionResult } from "@/features/forms/action-result";
import type { UnitSystem } from "@/features/analysis/core/design";
import {
  createDesignFromForm,
  duplicateDesignForViewer,
  saveWorkingRevisionForViewer,
  setDesignArchivedForViewer,
  setUnitSystemForViewer,
  type CommandResult,
} from "./commands";
import { formStrings } from "@/features/forms/form-data";
import type { SaveWorkingRevisionInput, SaveWorkingRevisionResult } from "./workspace-contract";
import type { CreateDesignState } from "./components/new-design-form";
import { loggedAction } from "@/server/log/with-logging";

// Server actions of the designs feature: authenticate, then hand over to commands.ts, which
// parses, authorises and delegates; then revalidate. `reason` stays server-side.

function toActionResult<T>(result: CommandResult<T>): ActionResult<T> {
  if (result.ok) return result;
  return result.fieldErrors
    ? { ok: false, message: result.message, fieldErrors: result.fieldErrors }
    : { ok: false, message: result.message };
}

/** New-design form (useActionState); on success goes straight to the editor. */
async function createDesignActionImpl(
  _previous: CreateDesignState,
  formData: FormData,
): Promise<CreateDesignState> {
  const viewer = await requireViewer();
  const values = formStrings(formData);
  const result = await createDesignFromForm(getDb(), viewer, values);
  // Typed values go back so the form can show them again (React resets it after an action).
  if (!result.ok) return { ...toActionResult(result), values };
  revalidatePath("/designs");
  redirect(`/designs/${result.data.designId}`);
}

async function saveWorkingRevisionActionImpl(
  input: SaveWorkingRevisionInput,
): Promise<SaveWorkingRevisionResult> {
  const viewer = await requireViewer();
  const result = await saveWorkingRevisionForViewer(getDb(), viewer, input);
  if (!result.ok) {
    const failure = toActionResult(result) as Extract<SaveWorkingRevisionResult, { ok: false }>;
    return result.conflict ? { ...failure, conflict: true } : failure;
  }
  revalidatePath("/designs");
  return result;
}

async function duplicateDesignActionImpl(
  _previous: ActionResult<{ designId: string }> | null,
  formData: FormData,
): Promise<ActionResult<{ designId: string }>> {
  const viewer = await requireViewer();
  const result = await duplicateDesignForViewer(getDb(), viewer, formData.get("designId"));
  if (result.ok) revalidatePath("/designs");
  return toActionResult(result);
}

async function setDesignArchivedActionImpl(
  _previous: ActionResult<{ archived: boolean }> | null,
  formData: FormData,
): Promise<ActionResult<{ archived: boolean }>> {
  const viewer = await requireViewer();
  const result = await setDesignArchivedForViewer(
    getDb(),
    viewer,
    formData.get("designId"),
    formData.get("archived") === "true",
  );
  if (result.ok) revalidatePath("/designs");
  return toActionResult(result);
}

/** Remembers the viewer's unit system (users.unit_system) for every screen. */
async function setUnitSystemActionImpl(
  unitSystem: UnitSystem,
): Promise<ActionResult<{ unitSystem: UnitSystem }>> {
  const viewer = await requireViewer();
  const result = await setUnitSystemForViewer(getDb(), viewer, unitSystem);
  if (result.ok) revalidatePath("/", "layout");
  return toActionResult(result);
}

export const createDesignAction = loggedAction("designs.createDesign", createDesignActionImpl);
export const saveWorkingRevisionAction = loggedAction(
  "designs.saveWorkingRevision",
  saveWorkingRevisionActionImpl,
);
export const duplicateDesignAction = loggedAction("designs.duplicateDesign", duplicateDesignActionImpl);
export const setDesignArchivedAction = loggedAction("designs.setDesignArchived", setDesignArchivedActionImpl);
export const setUnitSystemAction = loggedAction("designs.setUnitSystem", setUnitSystemActionImpl);
