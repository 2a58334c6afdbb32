import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/features/accounts/components/recovery-forms";
import { requestPasswordResetAction } from "@/features/accounts/recovery-actions";

export const metadata: Metadata = { title: "Forgot your password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="text-heading font-semibold">Forgot your password?</h1>
      <p className="mt-1 text-table text-ink-600">
        We e-mail you a link that lets you choose a new one. It works once, for an hour.
      </p>
      <div className="mt-5">
        <ForgotPasswordForm requestPasswordResetAction={requestPasswordResetAction} />
      </div>
      <p className="mt-4 text-table">
        <Link href="/sign-in" className="underline">
          Back to sign-in
        </Link>
      </p>
    </>
  );
}
