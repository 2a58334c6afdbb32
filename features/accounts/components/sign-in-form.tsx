"use client";

import Link from "next/link";
import { useActionState } from "react";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { FormStatus } from "@/features/ui/form-status";
import { useRememberedValues } from "@/features/ui/use-remembered-values";
import { CurrentPasswordField, EmailField } from "./account-fields";

export function SignInForm({
  signInAction,
  next,
}: {
  signInAction: (prev: ActionResult | null, data: FormData) => Promise<ActionResult>;
  next?: string;
}) {
  const [state, formAction, pending] = useActionState(signInAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  const { values, remember } = useRememberedValues(["password"]);
  return (
    <form action={remember(formAction)} className="flex flex-col gap-4" noValidate>
      {next ? <input type="hidden" name="next" value={next} /> : null}
      <EmailField errors={errors} defaultValue={values.email} autoComplete="username" />
      <CurrentPasswordField errors={errors} />
      <FormStatus state={state} />
      <button type="submit" className={buttonStyles.primary} disabled={pending}>
        Sign in
      </button>
      <p className="text-table text-ink-600">
        <Link href="/forgot-password" className="underline">
          Forgot your password?
        </Link>
        {" · "}
        <Link href="/sign-up" className="underline">
          Start an organisation
        </Link>
      </p>
    </form>
  );
}
