import type { z } from "zod";
import type { ActionResult } from "./action-result";

// The server-action form plumbing every feature shares: FormData in, field errors out, with one
// message for a refused form.

/** The message of every refused form; the fields carry the details. */
export const INVALID_FORM_MESSAGE = "Check the highlighted fields; nothing was saved.";

/**
 * FormData → plain object for a zod schema: each field as a string (files dropped), the names in
 * `arrays` as string lists (empty when absent); Next's internal `$ACTION…` fields are left out.
 */
export function formFields(formData: FormData, arrays: readonly string[] = []): Record<string, unknown> {
  const out: Record<string, unknown> = formStrings(formData);
  for (const key of arrays) out[key] = formData.getAll(key).filter((v) => typeof v === "string");
  return out;
}

/** formFields without lists: every text field once (the last value of a repeated name). */
export function formStrings(formData: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (key.startsWith("$ACTION") || typeof value !== "string") continue;
    out[key] = value;
  }
  return out;
}

/** `document.bolts[3].position`, `widthMm`: a zod issue path the way an engineer reads it. */
export function formatIssuePath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const segment of path) {
    if (typeof segment === "number") out += `[${segment}]`;
    else out += out === "" ? String(segment) : `.${String(segment)}`;
  }
  return out || "form";
}

/**
 * Zod issues as `{ field: [messages] }`. A form keys each issue by its top-level field (what the
 * inputs are named); `{ nested: true }` keeps the full path, for JSON bodies. Issues without a
 * path go under "form".
 */
export function fieldErrorsOf(
  error: z.ZodError,
  options: { nested?: boolean } = {},
): Record<string, string[]> {
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = options.nested
      ? formatIssuePath(issue.path)
      : issue.path.length
        ? String(issue.path[0])
        : "form";
    const list = (fieldErrors[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return fieldErrors;
}

/** The refusal of a form whose input failed its schema. */
export function invalidForm<T = never>(
  error: z.ZodError,
  options: { nested?: boolean } = {},
): ActionResult<T> {
  return { ok: false, message: INVALID_FORM_MESSAGE, fieldErrors: fieldErrorsOf(error, options) };
}
