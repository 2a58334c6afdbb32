import { getDesignJsonSchema } from "@/features/analysis/json-schema";
import { authorizeApi } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

// The JSON Schema of the design document (draft 2020-12). Geometric rules (bolt holes inside the
// outline, …) cannot be written in JSON Schema; the server still enforces them on every save.
async function handleGET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  return Response.json(getDesignJsonSchema(), { headers: cacheControl("releaseStatic") });
}

export const GET = withRequestLog("/api/v1/schema/design", handleGET);
