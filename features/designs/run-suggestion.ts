import "server-only";
import { checkSuggestionRequest } from "@/features/analysis/core/suggest/request";
import { SuggestionRefusedError } from "@/features/analysis/core/suggest/search";
import { fieldErrorsOf } from "@/features/forms/form-data";
import { suggestInWorker } from "@/server/analysis/pool";
import { suggestionApiSchema } from "./schema";

// The pattern search for the API (POST /api/v1/suggestions): parse the body with the schema,
// check what depends on the design (sizes in the thread catalogue, fixed bolts that exist,
// keep-outs on the path, the combination cap) on the request thread, which is cheap, then run the
// search itself in the analysis pool. Nothing is stored. Refusals are values with their status.
export type SuggestionOutcome =
  | { ok: true; json: string }
  | { ok: false; status: 422; message: string; fieldErrors?: Record<string, string[]> };

export async function runSuggestion(body: unknown): Promise<SuggestionOutcome> {
  const parsed = suggestionApiSchema.safeParse(body);
  if (!parsed.success)
    return {
      ok: false,
      status: 422,
      message: "The suggestion request is not valid.",
      fieldErrors: fieldErrorsOf(parsed.error, { nested: true }),
    };
  const issues = checkSuggestionRequest(parsed.data);
  if (issues.length > 0) {
    const fieldErrors: Record<string, string[]> = {};
    for (const i of issues) (fieldErrors[i.path] ??= []).push(i.message);
    return { ok: false, status: 422, message: "The search cannot run on this request.", fieldErrors };
  }
  try {
    return { ok: true, json: await suggestInWorker(parsed.data) };
  } catch (error) {
    // The core refuses a layout it cannot model at all: a 422 with its reason.
    if (error instanceof SuggestionRefusedError) return { ok: false, status: 422, message: error.message };
    throw error;
  }
}
