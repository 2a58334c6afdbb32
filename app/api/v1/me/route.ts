import { toViewerDto } from "@/features/accounts/viewer-dto";
import { authorizeApi } from "@/server/auth/guard";

// The signed-in viewer (no secrets): for client components that refresh with SWR.
export async function GET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  return Response.json(toViewerDto(auth.viewer), { headers: { "cache-control": "private, no-store" } });
}
