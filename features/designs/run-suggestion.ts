import "server-only";
import {
  checkSuggestionRequest,
  type StockedBoltingRow,
  type SuggestionRequest,
} from "@/features/analysis/core/suggest/request";
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

/** Reads the caller's own Stockroom bolting rows (composed in app/: designs does not import the library). */
export type StockedBoltingReader = () => Promise<StockedBoltingRow[]>;

const STOCKROOM_ID = "org:";
const BUILTIN_ID = "builtin:";

export async function runSuggestion(
  body: unknown,
  readStockedBolting: StockedBoltingReader,
): Promise<SuggestionOutcome> {
  const parsed = suggestionApiSchema.safeParse(body);
  if (!parsed.success)
    return {
      ok: false,
      status: 422,
      message: "The suggestion request is not valid.",
      fieldErrors: fieldErrorsOf(parsed.error, { nested: true }),
    };
  // Stockroom ids: "builtin:<id>" is the catalogue material <id>; "org:<uuid>" must be a row of the
  // caller's organisation (another organisation's row is unknown here, like a row that never was).
  const ids = (parsed.data.materialIds ?? []).map((id) =>
    id.startsWith(BUILTIN_ID) ? id.slice(BUILTIN_ID.length) : id,
  );
  const wanted = ids.filter((id) => id.startsWith(STOCKROOM_ID));
  const own = wanted.length > 0 ? await readStockedBolting() : [];
  const stockedBolting = own.filter((r) => wanted.includes(r.id));
  const unknown: Record<string, string[]> = {};
  ids.forEach((id, i) => {
    if (id.startsWith(STOCKROOM_ID) && !stockedBolting.some((r) => r.id === id))
      unknown[`materialIds[${i}]`] = [`no bolting row "${id}" in your organisation's Stockroom`];
  });
  if (Object.keys(unknown).length > 0)
    return {
      ok: false,
      status: 422,
      message: `Unknown Stockroom bolting row: ${Object.values(unknown)
        .map(([m]) => m.match(/"([^"]+)"/)![1])
        .join(", ")}.`,
      fieldErrors: unknown,
    };
  const request: SuggestionRequest = {
    ...parsed.data,
    ...(parsed.data.materialIds ? { materialIds: ids } : {}),
    ...(stockedBolting.length > 0 ? { stockedBolting } : {}),
  };
  const issues = checkSuggestionRequest(request);
  if (issues.length > 0) {
    const fieldErrors: Record<string, string[]> = {};
    for (const i of issues) (fieldErrors[i.path] ??= []).push(i.message);
    return { ok: false, status: 422, message: "The search cannot run on this request.", fieldErrors };
  }
  try {
    return { ok: true, json: await suggestInWorker(request) };
  } catch (error) {
    // The core refuses a layout it cannot model at all: a 422 with its reason.
    if (error instanceof SuggestionRefusedError) return { ok: false, status: 422, message: error.message };
    throw error;
  }
}
