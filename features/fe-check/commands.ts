import "server-only";
import type { Kysely } from "kysely";
import { z } from "zod";
import type { Database } from "@/db/types";
import type { Viewer } from "@/server/auth/guard";
import { formatIssue, validateJointDesign } from "@/features/analysis/core/validate";
import type { JointDesign } from "@/features/analysis/core/design";
import { enqueueFeCheck } from "./fe-job";
import { canRunFeCheck } from "./policies";
import {
  activeFeCheckId,
  findFeCheck,
  findRevisionForFe,
  latestFeCheck,
  requestFeCancel,
  type FeCheckDto,
} from "./store";

// Parse → authorise → delegate for the FE cross-check, given the viewer: the API routes and the
// server actions are thin wrappers around these. Designers and approvers may run and cancel.

export type FeCommandResult<T> =
  { ok: true; data: T } | { ok: false; status: 403 | 404 | 409 | 422; message: string };

const target = z.object({
  designId: z.uuid({ error: "This design does not exist in your organisation." }),
  number: z.coerce.number().int().min(1).max(100_000),
});
const feCheckIdSchema = z.uuid();

const NOT_FOUND = "This design or revision does not exist in your organisation.";

type FeRevision = NonNullable<Awaited<ReturnType<typeof findRevisionForFe>>>;

/** Parses the address and finds the revision in the viewer's organisation; 404 otherwise. */
async function targetRevision(
  db: Kysely<Database>,
  viewer: Viewer,
  input: { designId: string; number: string | number },
): Promise<{ ok: true; revision: FeRevision } | { ok: false; status: 404; message: string }> {
  const parsed = target.safeParse(input);
  if (!parsed.success) return { ok: false, status: 404, message: NOT_FOUND };
  const revision = await findRevisionForFe(
    db,
    viewer.organizationId,
    parsed.data.designId,
    parsed.data.number,
  );
  return revision ? { ok: true, revision } : { ok: false, status: 404, message: NOT_FOUND };
}

export async function readLatestFeCheck(
  db: Kysely<Database>,
  viewer: Viewer,
  input: { designId: string; number: string | number },
): Promise<FeCommandResult<FeCheckDto | null>> {
  const found = await targetRevision(db, viewer, input);
  if (!found.ok) return found;
  return { ok: true, data: await latestFeCheck(db, viewer.organizationId, found.revision.revisionId) };
}

export async function startFeCheck(
  db: Kysely<Database>,
  viewer: Viewer,
  input: { designId: string; number: string | number },
): Promise<FeCommandResult<FeCheckDto>> {
  if (!canRunFeCheck(viewer))
    return { ok: false, status: 403, message: "Designers and approvers run FE cross-checks." };
  const found = await targetRevision(db, viewer, input);
  if (!found.ok) return found;
  const { revision } = found;
  if (revision.status === "approved")
    return {
      ok: false,
      status: 409,
      message:
        "This revision is approved: its FE cross-check is frozen with the approval. Start a new revision to run another.",
    };
  const issues = validateJointDesign(revision.document as JointDesign);
  if (issues.length > 0)
    return {
      ok: false,
      status: 422,
      message: `Fix the design before solving it: ${issues.slice(0, 3).map(formatIssue).join("; ")}.`,
    };
  const active = await activeFeCheckId(db, revision.revisionId);
  if (active)
    return {
      ok: false,
      status: 409,
      message: "An FE cross-check of this revision is already queued or running; wait for it or cancel it.",
    };
  const id = await enqueueFeCheck(db, {
    organizationId: viewer.organizationId,
    designId: revision.designId,
    revisionId: revision.revisionId,
    document: revision.document,
    requestedBy: viewer.userId,
  });
  const dto = await findFeCheck(db, viewer.organizationId, id);
  return { ok: true, data: dto! };
}

export async function cancelFeCheck(
  db: Kysely<Database>,
  viewer: Viewer,
  feCheckId: string,
): Promise<FeCommandResult<FeCheckDto>> {
  if (!canRunFeCheck(viewer))
    return { ok: false, status: 403, message: "Designers and approvers cancel FE cross-checks." };
  const parsed = feCheckIdSchema.safeParse(feCheckId);
  if (!parsed.success) return { ok: false, status: 404, message: "This FE cross-check does not exist." };
  const existing = await findFeCheck(db, viewer.organizationId, parsed.data);
  if (!existing) return { ok: false, status: 404, message: "This FE cross-check does not exist." };
  if (!(await requestFeCancel(db, viewer.organizationId, parsed.data)))
    return { ok: false, status: 409, message: `This FE cross-check has already ended (${existing.status}).` };
  return { ok: true, data: (await findFeCheck(db, viewer.organizationId, parsed.data))! };
}
