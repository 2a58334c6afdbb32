import { getDesignJsonSchema } from "@/features/analysis/json-schema";
import { authorizeApi } from "@/server/auth/guard";

// The JSON Schema of the design document (draft 2020-12). Geometric rules (bolt holes inside the
// outline, …) cannot be written in JSON Schema; the server still enforces them on every save.
export async function GET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  return Response.json(getDesignJsonSchema(), { headers: { "cache-control": "private, max-age=300" } });
}
