import { getDb } from "@/db/index";
import { fieldErrorsOf } from "@/features/forms/form-data";
import { revisionPath } from "@/features/reviews/cache-keys";
import { notifyReviewOutcome } from "@/features/reviews/notifications";
import { approveRevisionSchema } from "@/features/reviews/schema";
import { approveRevision } from "@/features/reviews/transitions";
import { readJsonBody } from "@/server/http/request-body";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

// POST: approve an In-review revision, as the sign-off sheet's Approve form does. Body:
// { comment?, justifications?: { [rule]: text }, acknowledgeUnverifiedValues?: boolean }. A result that
// uses unverified table values (GET …/revisions/<n> lists them as `unverifiedValues`) is refused
// with 422 unless `acknowledgeUnverifiedValues` is true; the list is stored with the decision.
async function handlePOST(
  request: Request,
  context: { params: Promise<{ designId: string; number: string }> },
): Promise<Response> {
  const auth = await authorizeApi(request, { role: "approver" });
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  if (typeof body.body !== "object" || body.body === null || Array.isArray(body.body))
    return jsonError(422, "Send a JSON object: { comment, justifications, acknowledgeUnverifiedValues }.");
  const params = await context.params;
  const parsed = approveRevisionSchema.safeParse({
    ...body.body,
    designId: params.designId,
    number: params.number,
  });
  if (!parsed.success)
    return jsonError(
      422,
      "Check the fields; nothing was approved.",
      fieldErrorsOf(parsed.error, { nested: true }),
    );
  const { viewer } = auth;
  const db = getDb();
  const result = await approveRevision(
    db,
    { userId: viewer.userId, organizationId: viewer.organizationId, roles: viewer.roles },
    parsed.data,
  );
  if (!result.ok) return jsonError(result.fieldErrors ? 422 : 409, result.message, result.fieldErrors);
  await notifyReviewOutcome(db, viewer.organizationId, result.data);
  return Response.json(
    {
      designId: result.data.designId,
      number: result.data.number,
      status: result.data.status,
      href: revisionPath(result.data.designId, result.data.number),
    },
    { headers: cacheControl("userData") },
  );
}

export const POST = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/approval", handlePOST);
