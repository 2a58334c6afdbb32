"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer, type Viewer } from "@/server/auth/guard";
import { revisionPath } from "./cache-keys";
import { notifyReviewOutcome } from "./notifications";
import type { CommentDto } from "./review-dto";
import {
  addCommentSchema,
  approveRevisionSchema,
  returnRevisionSchema,
  startNewRevisionSchema,
  submitRevisionSchema,
} from "./schema";
import {
  addComment,
  approveRevision,
  returnRevision,
  startNewRevision,
  submitRevision,
  type TransitionActor,
  type TransitionOutcome,
} from "./transitions";
import { invalidForm } from "@/features/forms/form-data";
import { loggedAction } from "@/server/log/with-logging";

// Review entry points: authenticate, parse, delegate (the transition checks role and state
// inside its row-locked transaction), revalidate, then mail. Form-shaped: (previous, FormData).
export interface TransitionSummary {
  designId: string;
  number: number;
  status: TransitionOutcome["status"];
  href: string;
}

const JUSTIFICATION_PREFIX = "justification:";

function fields(formData: FormData): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const justifications: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (key.startsWith("$ACTION")) continue;
    if (key.startsWith(JUSTIFICATION_PREFIX))
      justifications[key.slice(JUSTIFICATION_PREFIX.length)] = String(value);
    else out[key] = String(value);
  }
  out.justifications = justifications;
  if (out.targetKind === "") out.targetKind = null;
  if (out.targetId === "") out.targetId = null;
  return out;
}

const actorOf = (viewer: Viewer): TransitionActor => ({
  userId: viewer.userId,
  organizationId: viewer.organizationId,
  roles: viewer.roles,
});

async function finish(
  viewer: Viewer,
  result: ActionResult<TransitionOutcome>,
): Promise<ActionResult<TransitionSummary>> {
  if (!result.ok) return result;
  const outcome = result.data;
  revalidatePath(`/designs/${outcome.designId}`, "layout");
  revalidatePath("/desk");
  await notifyReviewOutcome(getDb(), viewer.organizationId, outcome);
  return {
    ok: true,
    data: {
      designId: outcome.designId,
      number: outcome.number,
      status: outcome.status,
      href: revisionPath(outcome.designId, outcome.number),
    },
  };
}

async function submitRevisionActionImpl(
  _previous: ActionResult<TransitionSummary> | null,
  formData: FormData,
): Promise<ActionResult<TransitionSummary>> {
  const viewer = await requireViewer({ role: "designer" });
  const parsed = submitRevisionSchema.safeParse(fields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  return finish(viewer, await submitRevision(getDb(), actorOf(viewer), parsed.data));
}

async function approveRevisionActionImpl(
  _previous: ActionResult<TransitionSummary> | null,
  formData: FormData,
): Promise<ActionResult<TransitionSummary>> {
  const viewer = await requireViewer({ role: "approver" });
  const parsed = approveRevisionSchema.safeParse(fields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  return finish(viewer, await approveRevision(getDb(), actorOf(viewer), parsed.data));
}

async function returnRevisionActionImpl(
  _previous: ActionResult<TransitionSummary> | null,
  formData: FormData,
): Promise<ActionResult<TransitionSummary>> {
  const viewer = await requireViewer({ role: "approver" });
  const parsed = returnRevisionSchema.safeParse(fields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  return finish(viewer, await returnRevision(getDb(), actorOf(viewer), parsed.data));
}

async function startNewRevisionActionImpl(
  _previous: ActionResult<TransitionSummary> | null,
  formData: FormData,
): Promise<ActionResult<TransitionSummary>> {
  const viewer = await requireViewer({ role: "designer" });
  const parsed = startNewRevisionSchema.safeParse(fields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  return finish(viewer, await startNewRevision(getDb(), actorOf(viewer), parsed.data));
}

async function addCommentActionImpl(
  _previous: ActionResult<CommentDto> | null,
  formData: FormData,
): Promise<ActionResult<CommentDto>> {
  const viewer = await requireViewer();
  const parsed = addCommentSchema.safeParse(fields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  const result = await addComment(getDb(), actorOf(viewer), parsed.data);
  if (result.ok) revalidatePath(revisionPath(parsed.data.designId, parsed.data.number));
  return result;
}

export const submitRevisionAction = loggedAction("reviews.submitRevision", submitRevisionActionImpl);
export const approveRevisionAction = loggedAction("reviews.approveRevision", approveRevisionActionImpl);
export const returnRevisionAction = loggedAction("reviews.returnRevision", returnRevisionActionImpl);
export const startNewRevisionAction = loggedAction("reviews.startNewRevision", startNewRevisionActionImpl);
export const addCommentAction = loggedAction("reviews.addComment", addCommentActionImpl);
