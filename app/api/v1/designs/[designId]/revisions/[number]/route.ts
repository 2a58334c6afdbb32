import { z } from "zod";
import { getDb } from "@/db/index";
import { getRevisionReview } from "@/features/reviews/queries";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

const paramsSchema = z.object({ designId: z.uuid(), number: z.coerce.number().int().min(1).max(100_000) });

// One revision as the review screen sees it: document, stored result, checks, comments,
// justifications, and `integrity` — the content hash recomputed on this read (a mismatch is
// reported as { state: "mismatch", storedHash, recomputedHash }, never hidden).
async function handleGET(
  request: Request,
  context: { params: Promise<{ designId: string; number: string }> },
): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const parsed = paramsSchema.safeParse(await context.params);
  if (!parsed.success) return jsonError(404, "No such revision.");
  const review = await getRevisionReview(getDb(), auth.viewer, parsed.data.designId, parsed.data.number);
  if (!review) return jsonError(404, "No such revision.");
  return Response.json(review, { headers: cacheControl("userData") });
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]", handleGET);
