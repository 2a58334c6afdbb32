"use client";

import { useActionState } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { useRememberedValues } from "@/features/ui/use-remembered-values";
import { CurrentPasswordField, DisplayNameField, EmailField, NewPasswordFields } from "./account-fields";

type FormAction<T = void> = (prev: ActionResult<T> | null, data: FormData) => Promise<ActionResult<T>>;

export function ForgotPasswordForm({
  requestPasswordResetAction,
}: {
  requestPasswordResetAction: FormAction<string>;
}) {
  const [state, formAction, pending] = useActionState(requestPasswordResetAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  const { values, remember } = useRememberedValues();
  return (
    <form action={remember(formAction)} className="flex flex-col gap-4" noValidate>
      <EmailField errors={errors} defaultValue={values.email} />
      <FormStatus state={state} success={state?.ok ? state.data : undefined} />
      <button type="submit" className={buttonStyles.primary} disabled={pending}>
        Send the reset link
      </button>
    </form>
  );
}

export function ResetPasswordForm({
  token,
  resetPasswordAction,
}: {
  token: string;
  resetPasswordAction: FormAction;
}) {
  const [state, formAction, pending] = useActionState(resetPasswordAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  return (
    <form action={formAction} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="token" value={token} />
      <NewPasswordFields errors={errors} label="New password" />
      <FormStatus state={state} />
      <button type="submit" className={buttonStyles.primary} disabled={pending}>
        Set the new password
      </button>
    </form>
  );
}

export function AcceptInvitationForm({
  token,
  hasAccount,
  acceptInvitationAction,
}: {
  token: string;
  hasAccount: boolean;
  acceptInvitationAction: FormAction;
}) {
  const [state, formAction, pending] = useActionState(acceptInvitationAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  const { values, remember } = useRememberedValues(["password", "confirmPassword"]);
  return (
    <form action={remember(formAction)} className="flex flex-col gap-4" noValidate>
      <input type="hidden" name="token" value={token} />
      {hasAccount ? (
        <CurrentPasswordField errors={errors} label="Your current password" />
      ) : (
        <>
          <DisplayNameField errors={errors} defaultValue={values.displayName} />
          <NewPasswordFields errors={errors} />
        </>
      )}
      <FormStatus state={state} />
      <button type="submit" className={buttonStyles.primary} disabled={pending}>
        Join the organisation
      </button>
    </form>
  );
}
