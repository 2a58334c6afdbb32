import type { z } from "zod";

// Zod issues as `{ "path": [messages] }` with the path written the way an engineer reads it
// (`document.bolts[3].position`, `widthMm`). For a flat form this is exactly what
// `z.flattenError(err).fieldErrors` gives; nested API bodies keep their full path.
export function formatIssuePath(path: readonly PropertyKey[]): string {
  let out = "";
  for (const segment of path) {
    if (typeof segment === "number") out += `[${segment}]`;
    else out += out === "" ? String(segment) : `.${String(segment)}`;
  }
  return out || "form";
}

export function issuesToFieldErrors(error: z.ZodError): Record<string, string[]> {
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = formatIssuePath(issue.path);
    const list = (fieldErrors[key] ??= []);
    if (!list.includes(issue.message)) list.push(issue.message);
  }
  return fieldErrors;
}

/** FormData → plain object of strings (drops Next's internal `$ACTION…` keys). */
export function formDataToObject(formData: FormData): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (key.startsWith("$ACTION") || typeof value !== "string") continue;
    out[key] = value;
  }
  return out;
}
