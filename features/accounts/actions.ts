"use server";

import { headers } from "next/headers";
import { redirect } from "next/navigation";
import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import type { ActionResult } from "@/features/forms/action-result";
import { getViewerContext } from "@/server/auth/guard";
import { getEnv } from "@/server/env";
import { clientAddressKey } from "@/server/auth/rate-limit";
import { endAllSessions, endSession, startSession, switchSessionOrganization } from "@/server/auth/session";
import { authenticate } from "./credentials";
import { createOrganizationWithFounder } from "./organizations";
import { formFields, invalidForm } from "@/features/forms/form-data";
import { safeNextPath, signInSchema, signUpSchema, switchOrganizationSchema } from "./schema";
import { loggedAction } from "@/server/log/with-logging";

// Session entry points. Each action parses its own input and never trusts the form for who
// the user is: that comes from the session cookie.

async function signInActionImpl(_previous: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const parsed = signInSchema.safeParse(formFields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  const addressKey = clientAddressKey(await headers());
  const outcome = await authenticate(getDb(), {
    email: parsed.data.email,
    password: parsed.data.password,
    addressKey,
  });
  if (!outcome.ok) return { ok: false, message: outcome.message };
  await startSession(outcome.userId, outcome.organizationId);
  redirect(safeNextPath(parsed.data.next, getEnv().APP_URL));
}

async function signUpActionImpl(_previous: ActionResult | null, formData: FormData): Promise<ActionResult> {
  const parsed = signUpSchema.safeParse(formFields(formData));
  if (!parsed.success) return invalidForm(parsed.error);
  const outcome = await createOrganizationWithFounder(getDb(), parsed.data);
  if (!outcome.ok)
    return { ok: false, message: outcome.message, fieldErrors: { [outcome.field]: [outcome.message] } };
  await startSession(outcome.userId, outcome.organizationId);
  redirect("/desk");
}

async function signOutActionImpl(): Promise<void> {
  const context = await getViewerContext();
  if (context) await endSession(context.sessionId);
  redirect("/sign-in?signed-out=1");
}

async function signOutEverywhereActionImpl(): Promise<void> {
  const context = await getViewerContext();
  if (context) await endAllSessions(context.viewer.userId);
  redirect("/sign-in?signed-out=everywhere");
}

async function switchOrganizationActionImpl(formData: FormData): Promise<void> {
  const context = await getViewerContext();
  if (!context) redirect("/sign-in");
  const parsed = switchOrganizationSchema.safeParse(formFields(formData));
  // Only organisations the user belongs to: the update itself checks the membership.
  if (parsed.success)
    await switchSessionOrganization(context.sessionId, context.viewer.userId, parsed.data.organizationId);
  revalidatePath("/", "layout");
  redirect("/desk");
}

export const signInAction = loggedAction("accounts.signIn", signInActionImpl);
export const signUpAction = loggedAction("accounts.signUp", signUpActionImpl);
export const signOutAction = loggedAction("accounts.signOut", signOutActionImpl);
export const signOutEverywhereAction = loggedAction(
  "accounts.signOutEverywhere",
  signOutEverywhereActionImpl,
);
export const switchOrganizationAction = loggedAction(
  "accounts.switchOrganization",
  switchOrganizationActionImpl,
);
