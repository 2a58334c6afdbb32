import { getDb } from "@/db";
import { runSuggestion } from "@/features/designs/run-suggestion";
import { listOwnBolting } from "@/features/library/queries";
import { searchMaterialsOf } from "@/features/library/model/stocked-bolting";
import { cacheControl } from "@/server/http/cache-control";
import { readJsonBody } from "@/server/http/request-body";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

// Stateless pattern search ("Suggest pattern"): a SuggestionRequest in (the design and the allowed
// sizes, materials, offsets and constraints; Stockroom bolting rows by their "org:<uuid>" id, read
// from the caller's organisation), the search's ranked candidates out, or, when
// nothing qualifies, `message` naming the rule that blocks the request. Nothing is stored. Bad
// input is a 422 naming each field path; the search runs in the analysis pool under its time
// limit (503 with Retry-After past it, answered by withRequestLog).
async function handlePOST(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const organizationId = auth.viewer.organizationId;
  const outcome = await runSuggestion(
    body.body,
    async () => searchMaterialsOf(await listOwnBolting(getDb(), organizationId)).stockedBolting,
  );
  if (!outcome.ok) return jsonError(outcome.status, outcome.message, outcome.fieldErrors);
  return new Response(outcome.json, {
    headers: { ...cacheControl("userData"), "content-type": "application/json" },
  });
}

export const POST = withRequestLog("/api/v1/suggestions", handlePOST);
