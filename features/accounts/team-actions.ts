"use server";

import { revalidatePath } from "next/cache";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer } from "@/server/auth/guard";
import { formFields } from "@/features/forms/form-data";
import {
  changeMemberRolesCommand,
  inviteMemberCommand,
  removeMemberCommand,
  resendInvitationCommand,
  revokeInvitationCommand,
  type CommandResult,
} from "./team-commands";
import { loggedAction } from "@/server/log/with-logging";

// Crew screen forms. Admin only: requireViewer renders the 403 page for anybody else.
function toActionResult(result: CommandResult<unknown>, success: string): ActionResult<string> {
  if (result.ok) {
    revalidatePath("/team");
    return { ok: true, data: success };
  }
  return { ok: false, message: result.message, fieldErrors: result.fieldErrors };
}

async function inviteMemberActionImpl(
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

async function resendInvitationActionImpl(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(
    await resendInvitationCommand(viewer, formFields(formData)),
    "Sent again with a new link.",
  );
}

async function revokeInvitationActionImpl(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(await revokeInvitationCommand(viewer, formFields(formData)), "Invitation withdrawn.");
}

async function changeMemberRolesActionImpl(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(
    await changeMemberRolesCommand(viewer, formFields(formData, ["roles"])),
    "Roles saved.",
  );
}

async function removeMemberActionImpl(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const viewer = await requireViewer({ role: "admin" });
  return toActionResult(await removeMemberCommand(viewer, formFields(formData)), "Member removed.");
}

export const inviteMemberAction = loggedAction("accounts.inviteMember", inviteMemberActionImpl);
export const resendInvitationAction = loggedAction("accounts.resendInvitation", resendInvitationActionImpl);
export const revokeInvitationAction = loggedAction("accounts.revokeInvitation", revokeInvitationActionImpl);
export const changeMemberRolesAction = loggedAction(
  "accounts.changeMemberRoles",
  changeMemberRolesActionImpl,
);
export const removeMemberAction = loggedAction("accounts.removeMember", removeMemberActionImpl);
