"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { getDb } from "@/db/index";
import type { ActionResult } from "@/features/forms/action-result";
import { clientAddressKey } from "@/server/auth/rate-limit";
import { startSession } from "@/server/auth/session";
import { INVALID_FORM_MESSAGE, formFields, invalidForm } from "@/features/forms/form-data";
import { acceptInvitation } from "./invitations";
import { requestPasswordReset, resetPassword } from "./password-reset";
import { acceptInvitationSchema, forgotPasswordSchema, resetPasswordSchema } from "./schema";
import { loggedAction } from "@/server/log/with-logging";

// Entry points reached from e-mailed links: accept an invitation, ask for and use a reset link.

async function acceptInvitationActionImpl(
  _previous: ActionResult | null,
  formData: FormData,
): Promise<ActionResult> {
  const parsed = acceptInvitationSchema.safeParse(formFields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  if (parsed.data.confirmPassword !== undefined && parsed.data.confirmPassword !== parsed.data.password) {
    return {
      ok: false,
      message: INVALID_FORM_MESSAGE,
      fieldErrors: { confirmPassword: ["The two passwords differ."] },
    };
  }
  const outcome = await acceptInvitation(getDb(), parsed.data);
  if (!outcome.ok) return { ok: false, message: outcome.message, fieldErrors: outcome.fieldErrors };
  await startSession(outcome.userId, outcome.organizationId);
  redirect("/desk");
}

async function requestPasswordResetActionImpl(
  _previous: ActionResult<string> | null,
  formData: FormData,
): Promise<ActionResult<string>> {
  const parsed = forgotPasswordSchema.safeParse(formFields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  const outcome = await requestPasswordReset(getDb(), {
    email: parsed.data.email,
    addressKey: clientAddressKey(await headers()),
  });
  return outcome.ok ? { ok: true, data: outcome.message } : { ok: false, message: outcome.message };
}

async function resetPasswordActionImpl(
  _previous: ActionResult | null,
  formData: FormData,
): Promise<ActionResult> {
  const parsed = resetPasswordSchema.safeParse(formFields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  const outcome = await resetPassword(getDb(), parsed.data);
  if (!outcome.ok) return { ok: false, message: outcome.message };
  redirect("/sign-in?reset=1");
}

export const acceptInvitationAction = loggedAction("accounts.acceptInvitation", acceptInvitationActionImpl);
export const requestPasswordResetAction = loggedAction(
  "accounts.requestPasswordReset",
  requestPasswordResetActionImpl,
);
export const resetPasswordAction = loggedAction("accounts.resetPassword", resetPasswordActionImpl);
