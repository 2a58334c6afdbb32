import { z } from "zod";
import { plainText } from "@/features/forms/plain-text";

// Inputs of the account forms. Shared by the forms (first message per field) and the actions
// (the authority). Every text field is bounded so a 1 KB paste gets a message, not a query.
const ROLES = ["designer", "approver", "admin"] as const;
const EMAIL_PATTERN = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

export const emailField = plainText({ error: "Enter your e-mail address." })
  .trim()
  .toLowerCase()
  .min(1, "Enter your e-mail address.")
  .max(254, "An e-mail address has at most 254 characters.")
  .regex(EMAIL_PATTERN, "Enter a valid e-mail address, like name@example.com.");

const currentPassword = plainText({ error: "Enter your password." })
  .min(1, "Enter your password.")
  .max(1024, "Passwords are limited to 1024 characters.");

export const newPasswordField = plainText({ error: "Choose a password." })
  .min(10, "Use at least 10 characters.")
  .max(1024, "Passwords are limited to 1024 characters.");

const displayName = plainText({ error: "Enter your name." })
  .trim()
  .min(1, "Enter your name.")
  .max(120, "Names are limited to 120 characters.");

export const roleSchema = z.enum(ROLES, { error: "Unknown role." });
export const rolesField = z
  .array(roleSchema, { error: "Choose at least one role." })
  .min(1, "Choose at least one role.")
  .max(3);

export const signInSchema = z.object({
  email: emailField,
  password: currentPassword,
  // A bad `next` is dropped (safeNextPath falls back to the desk), never a reason to refuse the sign-in.
  next: plainText().max(1024).optional().catch(undefined),
});
export type SignInInput = z.infer<typeof signInSchema>;

export const signUpSchema = z
  .object({
    displayName,
    email: emailField,
    organizationName: plainText({ error: "Name your organisation." })
      .trim()
      .min(2, "Name your organisation (at least 2 characters).")
      .max(120, "Organisation names are limited to 120 characters."),
    password: newPasswordField,
    confirmPassword: plainText().max(1024, "Passwords are limited to 1024 characters."),
  })
  .refine((v) => v.password === v.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two passwords differ.",
  });
export type SignUpInput = z.infer<typeof signUpSchema>;

export const forgotPasswordSchema = z.object({ email: emailField });

const tokenField = plainText().min(10).max(200);

export const resetPasswordSchema = z
  .object({
    token: tokenField,
    password: newPasswordField,
    confirmPassword: plainText().max(1024, "Passwords are limited to 1024 characters."),
  })
  .refine((v) => v.password === v.confirmPassword, {
    path: ["confirmPassword"],
    message: "The two passwords differ.",
  });

/** New invitees choose a name and password; people who already have an account confirm theirs. */
export const acceptInvitationSchema = z.object({
  token: tokenField,
  displayName: displayName.optional(),
  password: plainText({ error: "Enter a password." })
    .min(1, "Enter a password.")
    .max(1024, "Passwords are limited to 1024 characters."),
  confirmPassword: plainText().max(1024).optional(),
});

export const inviteMemberSchema = z.object({ email: emailField, roles: rolesField });
export type InviteMemberInput = z.infer<typeof inviteMemberSchema>;

export const changeRolesSchema = z.object({ userId: z.uuid("Unknown member."), roles: rolesField });
export const memberIdSchema = z.object({ userId: z.uuid("Unknown member.") });
export const invitationIdSchema = z.object({ invitationId: z.uuid("Unknown invitation.") });
export const switchOrganizationSchema = z.object({ organizationId: z.uuid("Unknown organisation.") });

/**
 * Only our own pages are followed after sign-in (no open redirect to another site). `next` is
 * resolved as a URL against the app's public origin, the way a browser resolves a Location header
 * (tabs and newlines dropped, backslashes read as slashes, `//host` taken as another host), and is
 * kept only when the result has the app's own origin. What is returned is the resolved path, query
 * and fragment, never the raw text, so a value the browser would read differently cannot pass.
 */
export function safeNextPath(next: string | null | undefined, appUrl: string): string {
  const fallback = "/desk";
  if (!next) return fallback;
  let resolved: URL;
  try {
    resolved = new URL(next, appUrl);
  } catch {
    return fallback;
  }
  if (resolved.origin !== new URL(appUrl).origin) return fallback;
  return `${resolved.pathname}${resolved.search}${resolved.hash}`;
}
