"use client";

import { useActionState } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { TextField } from "@/features/ui/text-field";
import { useRememberedValues } from "@/features/ui/use-remembered-values";
import { DisplayNameField, EmailField, NewPasswordFields } from "./account-fields";

export function SignUpForm({
  signUpAction,
}: {
  signUpAction: (prev: ActionResult | null, data: FormData) => Promise<ActionResult>;
}) {
  const [state, formAction, pending] = useActionState(signUpAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  const { values, remember } = useRememberedValues(["password", "confirmPassword"]);
  return (
    <form action={remember(formAction)} className="flex flex-col gap-4" noValidate>
      <DisplayNameField errors={errors} defaultValue={values.displayName} />
      <EmailField errors={errors} defaultValue={values.email} />
      <TextField
        label="Organisation"
        name="organizationName"
        autoComplete="organization"
        required
        errors={errors?.organizationName}
        defaultValue={values.organizationName}
        hint="Your company or team; you become its administrator."
      />
      <NewPasswordFields errors={errors} />
      <FormStatus state={state} />
      <button type="submit" className={buttonStyles.primary} disabled={pending}>
        Start the organisation
      </button>
    </form>
  );
}
