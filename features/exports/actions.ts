"use server";

import { getDb } from "@/db/index";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer } from "@/server/auth/guard";
import { loggedAction } from "@/server/log/with-logging";
import { jobIdSchema } from "./schema";
import { retrySheetJob } from "./sheet-job";

// The Shop files panel's Retry sheet command: any member of the organisation may export, so any
// member may queue a failed sheet again (retrySheetJob scopes it to the viewer's organisation).
async function retrySheetActionImpl(jobId: unknown): Promise<ActionResult<{ jobId: string }>> {
  const viewer = await requireViewer();
  const parsed = jobIdSchema.safeParse(jobId);
  if (!parsed.success) return { ok: false, message: "This sheet does not exist." };
  return retrySheetJob(getDb(), viewer, parsed.data);
}

export const retrySheetAction = loggedAction("exports.retrySheet", retrySheetActionImpl);
