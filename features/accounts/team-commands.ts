import "server-only";
import { getDb } from "@/db/index";
import type { Viewer } from "@/server/auth/viewer";
import { sendInvitationEmail } from "@/server/mail/messages";
import { createInvitation, renewInvitation, revokeInvitation, type IssuedInvitation } from "./invitations";
import { changeRolesSchema, invitationIdSchema, inviteMemberSchema, memberIdSchema } from "./schema";
import { changeMemberRoles, LAST_ADMIN_MESSAGE, removeMember, type MemberChange } from "./team";
import { INVALID_FORM_MESSAGE, fieldErrorsOf } from "@/features/forms/form-data";
import type { z } from "zod";

// The admin commands of the Crew screen, shared by the server actions (forms) and the
// /api/v1/team route handlers. The caller has already checked the admin role; these parse the
// input and scope every change to viewer.organizationId. Failures carry an HTTP status.
export type CommandResult<T = void> =
  | { ok: true; data: T }
  | { ok: false; status: 400 | 404 | 409; message: string; fieldErrors?: Record<string, string[]> };

function fromChange(change: MemberChange): CommandResult {
  if (change === "ok") return { ok: true, data: undefined };
  if (change === "not-found")
    return { ok: false, status: 404, message: "No such member in this organisation." };
  return { ok: false, status: 409, message: LAST_ADMIN_MESSAGE };
}

function badInput(error: z.ZodError): CommandResult<never> {
  const fieldErrors = fieldErrorsOf(error);
  // A malformed id is treated like a foreign one: not found.
  if (fieldErrors.userId || fieldErrors.invitationId)
    return { ok: false, status: 404, message: "Not found in this organisation." };
  return { ok: false, status: 400, message: INVALID_FORM_MESSAGE, fieldErrors };
}

async function mailInvitation(viewer: Viewer, invitation: IssuedInvitation): Promise<void> {
  await sendInvitationEmail({
    to: invitation.email,
    organizationName: viewer.organizationName,
    inviterName: viewer.displayName,
    roles: invitation.roles,
    token: invitation.token,
    expiresAt: invitation.expiresAt,
  });
}

export async function inviteMemberCommand(
  viewer: Viewer,
  input: unknown,
): Promise<CommandResult<{ invitationId: string }>> {
  const parsed = inviteMemberSchema.safeParse(input);
  if (!parsed.success) return badInput(parsed.error);
  const outcome = await createInvitation(getDb(), {
    organizationId: viewer.organizationId,
    invitedBy: viewer.userId,
    ...parsed.data,
  });
  if (!outcome.ok)
    return {
      ok: false,
      status: 409,
      message: outcome.message,
      fieldErrors: outcome.field ? { [outcome.field]: [outcome.message] } : undefined,
    };
  await mailInvitation(viewer, outcome.invitation);
  return { ok: true, data: { invitationId: outcome.invitation.invitationId } };
}

export async function resendInvitationCommand(viewer: Viewer, input: unknown): Promise<CommandResult> {
  const parsed = invitationIdSchema.safeParse(input);
  if (!parsed.success) return badInput(parsed.error);
  const invitation = await renewInvitation(getDb(), viewer.organizationId, parsed.data.invitationId);
  if (!invitation)
    return { ok: false, status: 404, message: "No such open invitation in this organisation." };
  await mailInvitation(viewer, invitation);
  return { ok: true, data: undefined };
}

export async function revokeInvitationCommand(viewer: Viewer, input: unknown): Promise<CommandResult> {
  const parsed = invitationIdSchema.safeParse(input);
  if (!parsed.success) return badInput(parsed.error);
  const revoked = await revokeInvitation(getDb(), viewer.organizationId, parsed.data.invitationId);
  return revoked
    ? { ok: true, data: undefined }
    : { ok: false, status: 404, message: "No such open invitation in this organisation." };
}

export async function changeMemberRolesCommand(viewer: Viewer, input: unknown): Promise<CommandResult> {
  const parsed = changeRolesSchema.safeParse(input);
  if (!parsed.success) return badInput(parsed.error);
  return fromChange(
    await changeMemberRoles(getDb(), viewer.organizationId, parsed.data.userId, parsed.data.roles),
  );
}

export async function removeMemberCommand(viewer: Viewer, input: unknown): Promise<CommandResult> {
  const parsed = memberIdSchema.safeParse(input);
  if (!parsed.success) return badInput(parsed.error);
  return fromChange(await removeMember(getDb(), viewer.organizationId, parsed.data.userId));
}
