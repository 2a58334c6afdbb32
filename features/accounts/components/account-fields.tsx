import { TextField } from "@/features/ui/text-field";

type FieldErrors = Record<string, string[]> | undefined;

/** The e-mail field of the sign-up, sign-in and reset-request forms. */
export function EmailField({
  errors,
  defaultValue,
  autoComplete = "email",
}: {
  errors: FieldErrors;
  defaultValue?: string;
  autoComplete?: string;
}) {
  return (
    <TextField
      label="E-mail"
      name="email"
      type="email"
      autoComplete={autoComplete}
      required
      errors={errors?.email}
      defaultValue={defaultValue}
    />
  );
}

/** The person's name, asked when an account is made (sign-up, joining by invitation). */
export function DisplayNameField({ errors, defaultValue }: { errors: FieldErrors; defaultValue?: string }) {
  return (
    <TextField
      label="Your name"
      name="displayName"
      autoComplete="name"
      required
      errors={errors?.displayName}
      defaultValue={defaultValue}
    />
  );
}

/** A new password and its repeat (sign-up, reset, joining by invitation); never remembered after a refusal. */
export function NewPasswordFields({ errors, label = "Password" }: { errors: FieldErrors; label?: string }) {
  return (
    <>
      <TextField
        label={label}
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
  );
}

/** The password of an existing account (sign-in, joining another organisation). */
export function CurrentPasswordField({
  errors,
  label = "Password",
}: {
  errors: FieldErrors;
  label?: string;
}) {
  return (
    <TextField
      label={label}
      name="password"
      type="password"
      autoComplete="current-password"
      required
      errors={errors?.password}
    />
  );
}
