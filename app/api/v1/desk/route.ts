import { getDb } from "@/db/index";
import { getDeskLists } from "@/features/reviews/queries";
import { authorizeApi } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

// The desk's review lists for SWR (features/reviews/cache-keys.ts DESK_LISTS_KEY): the same DTO as
// getDeskLists, polled every few seconds so new submissions and returns appear without a reload.
async function handleGET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const lists = await getDeskLists(getDb(), auth.viewer);
  return Response.json(lists, { headers: cacheControl("userData") });
}

export const GET = withRequestLog("/api/v1/desk", handleGET);
