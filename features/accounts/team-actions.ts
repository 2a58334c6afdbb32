"use server";

import { revalidatePath } from "next/cache";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer, type Viewer } from "@/server/auth/guard";
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
type FormInput = Record<string, unknown>;

/** A Crew form action: runs the command on the form's fields; its success note, or the refusal. */
function crewFormAction(
  name: string,
  command: (viewer: Viewer, input: FormInput) => Promise<CommandResult<unknown>>,
  success: string | ((input: FormInput) => string),
  arrays: readonly string[] = [],
) {
  return loggedAction(
    name,
    async (_previous: ActionResult<string> | null, formData: FormData): Promise<ActionResult<string>> => {
      const viewer = await requireViewer({ role: "admin" });
      const input = formFields(formData, arrays);
      const result = await command(viewer, input);
      if (!result.ok) return { ok: false, message: result.message, fieldErrors: result.fieldErrors };
      revalidatePath("/team");
      return { ok: true, data: typeof success === "string" ? success : success(input) };
    },
  );
}

export const inviteMemberAction = crewFormAction(
  "accounts.inviteMember",
  inviteMemberCommand,
  (input) =>
    `Invitation sent to ${String(input.email ?? "")
      .trim()
      .toLowerCase()}.`,
  ["roles"],
);
export const resendInvitationAction = crewFormAction(
  "accounts.resendInvitation",
  resendInvitationCommand,
  "Sent again with a new link.",
);
export const revokeInvitationAction = crewFormAction(
  "accounts.revokeInvitation",
  revokeInvitationCommand,
  "Invitation withdrawn.",
);
export const changeMemberRolesAction = crewFormAction(
  "accounts.changeMemberRoles",
  changeMemberRolesCommand,
  "Roles saved.",
  ["roles"],
);
export const removeMemberAction = crewFormAction(
  "accounts.removeMember",
  removeMemberCommand,
  "Member removed.",
);
