import { toViewerDto } from "@/features/accounts/viewer-dto";
import { authorizeApi } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

// The signed-in viewer (no secrets): for client components that refresh with SWR.
async function handleGET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  return Response.json(toViewerDto(auth.viewer), { headers: cacheControl("userData") });
}

export const GET = withRequestLog("/api/v1/me", handleGET);
