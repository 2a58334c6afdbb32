import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { AcceptInvitationForm } from "@/features/accounts/components/recovery-forms";
import { INVITATION_MESSAGES, viewInvitation } from "@/features/accounts/invitations";
import { acceptInvitationAction } from "@/features/accounts/recovery-actions";

export const metadata: Metadata = { title: "Join an organisation", referrer: "no-referrer" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation =
    token.length > 200 ? ({ state: "unknown" } as const) : await viewInvitation(getDb(), token);
  if (invitation.state !== "open") {
    return (
      <>
        <h1 className="text-heading font-semibold">Join an organisation</h1>
        <p role="alert" className="mt-3 text-verdict-fail">
          {INVITATION_MESSAGES[invitation.state]}
        </p>
        <p className="mt-4 text-table">
          <Link href="/sign-in" className="underline">
            Sign in
          </Link>
        </p>
      </>
    );
  }
  return (
    <>
      <h1 className="text-heading font-semibold">Join {invitation.organizationName}</h1>
      <p className="mt-1 text-table text-ink-600">
        Invited as {invitation.roles.join(" and ")} · <span className="num">{invitation.email}</span>
      </p>
      <p className="mt-2 text-table text-ink-600">
        {invitation.hasAccount
          ? "You already have a Sealpitch account: confirm its password to join."
          : "Choose your name and a password to join."}
      </p>
      <div className="mt-5">
        <AcceptInvitationForm
          token={token}
          hasAccount={invitation.hasAccount}
          acceptInvitationAction={acceptInvitationAction}
        />
      </div>
    </>
  );
}
