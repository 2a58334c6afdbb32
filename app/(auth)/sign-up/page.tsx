import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { signUpAction } from "@/features/accounts/actions";
import { SignUpForm } from "@/features/accounts/components/sign-up-form";
import { getViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Start an organisation" };

export default async function SignUpPage() {
  if (await getViewer()) redirect("/desk");
  return (
    <>
      <h1 className="text-heading font-semibold">Start an organisation</h1>
      <p className="mt-1 text-table text-ink-600">
        Joining a team that already uses Sealpitch? Ask its administrator for an invitation instead.{" "}
        <Link href="/sign-in" className="underline">
          Sign in
        </Link>
      </p>
      <div className="mt-5">
        <SignUpForm signUpAction={signUpAction} />
      </div>
    </>
  );
}
