"use server";

import { revalidatePath } from "next/cache";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer } from "@/server/auth/guard";
import { formFields } from "./form-data";
import {
  changeMemberRolesCommand,
  inviteMemberCommand,
  removeMemberCommand,
  resendInvitationCommand,
  revokeInvitationCommand,
  type CommandResult,
} from "./team-commands";

// Crew screen forms. Admin only: requireViewer renders the 403 page for anybody else.
function toActionResult(result: CommandResult<unknown>, success: string): ActionResult<string> {
  if (result.ok) {
    revalidatePath("/team");
    return { ok: true, data: success };
  }
  return { ok: false, message: result.message, fieldErrors: result.fieldErrors };
}

export async function inviteMemberAction(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  const input = formFields(formData, ["roles"]);
  return toActionResult(
    await inviteMemberCommand(viewer, input),
    `Invitation sent to ${String(input.email ?? "")
      .trim()
      .toLowerCase()}.`,
  );
}

export async function resendInvitationAction(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(
    await resendInvitationCommand(viewer, formFields(formData)),
    "Sent again with a new link.",
  );
}

export async function revokeInvitationAction(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(await revokeInvitationCommand(viewer, formFields(formData)), "Invitation withdrawn.");
}

export async function changeMemberRolesAction(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(
    await changeMemberRolesCommand(viewer, formFields(formData, ["roles"])),
    "Roles saved.",
  );
}

export async function removeMemberAction(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(await removeMemberCommand(viewer, formFields(formData)), "Member removed.");
}
