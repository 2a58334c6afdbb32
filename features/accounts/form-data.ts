import type { z } from "zod";
import type { ActionResult } from "@/features/forms/action-result";

// Parsing FormData into a schema the same way in every account action.
export function formFields(formData: FormData, arrays: string[] = []): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const key of new Set(formData.keys())) {
    if (key.startsWith("$ACTION")) continue;
    out[key] = arrays.includes(key) ? formData.getAll(key).map(String) : String(formData.get(key) ?? "");
  }
  for (const key of arrays) out[key] ??= [];
  return out;
}

export function invalid<T>(error: z.ZodError, message = "Check the highlighted fields."): ActionResult<T> {
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? "form");
    (fieldErrors[key] ??= []).push(issue.message);
  }
  return { ok: false, message, fieldErrors };
}
