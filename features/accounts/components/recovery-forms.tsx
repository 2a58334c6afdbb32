"use client";

import { useActionState } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import { useRememberedValues } from "@/features/ui/use-remembered-values";

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
      <TextField
        label="E-mail"
        name="email"
        type="email"
        autoComplete="email"
        required
        errors={errors?.email}
        defaultValue={values.email}
      />
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
      <TextField
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        errors={errors?.password}
        hint="At least 10 characters."
      />
      <TextField
        label="Repeat the password"
        name="confirmPassword"
        type="password"
        autoComplete="new-password"
        required
        errors={errors?.confirmPassword}
      />
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
        <TextField
          label="Your current password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          errors={errors?.password}
        />
      ) : (
        <>
          <TextField
            label="Your name"
            name="displayName"
            autoComplete="name"
            required
            errors={errors?.displayName}
            defaultValue={values.displayName}
          />
          <TextField
            label="Password"
            name="password"
            type="password"
            autoComplete="new-password"
            required
            errors={errors?.password}
            hint="At least 10 characters."
          />
          <TextField
            label="Repeat the password"
            name="confirmPassword"
            type="password"
            autoComplete="new-password"
            required
            errors={errors?.confirmPassword}
          />
        </>
      )}
      <FormStatus state={state} />
      <button type="submit" className={buttonStyles.primary} disabled={pending}>
        Join the organisation
      </button>
    </form>
  );
}
