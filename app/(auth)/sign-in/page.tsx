import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { signInAction } from "@/features/accounts/actions";
import { SignInForm } from "@/features/accounts/components/sign-in-form";
import { safeNextPath } from "@/features/accounts/schema";
import { getViewer } from "@/server/auth/guard";
import { getEnv } from "@/server/env";

export const metadata: Metadata = { title: "Sign in" };

const NOTES: Record<string, string> = {
  "signed-out": "You are signed out.",
  everywhere: "You are signed out on every device.",
  reset: "Password changed. Sign in with the new one.",
};

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const params = await searchParams;
  const next = typeof params.next === "string" ? safeNextPath(params.next, getEnv().APP_URL) : undefined;
  if (await getViewer()) redirect(next ?? "/desk");
  const note =
    params["signed-out"] === "everywhere"
      ? NOTES.everywhere
      : params["signed-out"]
        ? NOTES["signed-out"]
        : params.reset
          ? NOTES.reset
          : null;
  return (
    <>
      <h1 className="text-heading font-semibold">Sign in to Sealpitch</h1>
      {note ? (
        <p className="mt-2 rounded-plate bg-verdict-pass-bg px-3 py-2 text-table text-verdict-pass">{note}</p>
      ) : null}
      <div className="mt-5">
        <SignInForm signInAction={signInAction} next={next} />
      </div>
    </>
  );
}
