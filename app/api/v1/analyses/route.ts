import { fieldErrorsOf } from "@/features/forms/form-data";
import { NO_STORE } from "@/features/designs/http";
import { runAnalysis } from "@/features/designs/run-analysis";
import { analysisRequestSchema } from "@/features/designs/schema";
import { DesignRefusedError } from "@/features/analysis/core/validate";
import { readJsonBody } from "@/server/http/request-body";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

// Stateless analysis: a design document in (bare, or as `{ document }`), the core's JointAnalysis
// out. Nothing is stored. Bad input is a 422 naming each field path.
async function handlePOST(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const raw = body.body as Record<string, unknown> | null;
  const wrapped =
    raw && typeof raw === "object" && !Array.isArray(raw) && "document" in raw && !("schemaVersion" in raw)
      ? raw
      : { document: raw };
  const parsed = analysisRequestSchema.safeParse(wrapped);
  if (!parsed.success)
    return jsonError(422, "The design document is not valid.", fieldErrorsOf(parsed.error, { nested: true }));
  // The worker's JSON text goes out as it is: the request thread neither builds nor serialises it.
  let json: string;
  try {
    ({ json } = await runAnalysis(parsed.data.document, "stateless"));
  } catch (error) {
    // A design the core itself refuses (its force balance): a 422 with the core's reason.
    if (error instanceof DesignRefusedError) return jsonError(422, error.message);
    throw error;
  }
  return new Response(json, { headers: { ...NO_STORE, "content-type": "application/json" } });
}

export const POST = withRequestLog("/api/v1/analyses", handlePOST);
