import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { ResetPasswordForm } from "@/features/accounts/components/recovery-forms";
import { getResetTokenState, RESET_TOKEN_MESSAGES } from "@/features/accounts/password-reset";
import { resetPasswordAction } from "@/features/accounts/recovery-actions";

export const metadata: Metadata = { title: "Choose a new password", referrer: "no-referrer" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const state = token.length > 200 ? "unknown" : await getResetTokenState(getDb(), token);
  return (
    <>
      <h1 className="text-heading font-semibold">Choose a new password</h1>
      {state === "valid" ? (
        <div className="mt-5">
          <ResetPasswordForm token={token} resetPasswordAction={resetPasswordAction} />
        </div>
      ) : (
        <>
          <p role="alert" className="mt-3 text-verdict-fail">
            {RESET_TOKEN_MESSAGES[state]}
          </p>
          <p className="mt-4 text-table">
            <Link href="/forgot-password" className="underline">
              Ask for a new link
            </Link>
          </p>
        </>
      )}
    </>
  );
}
