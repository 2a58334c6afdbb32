import Link from "next/link";
import { buttonStyles } from "@/features/ui/button-styles";

// Rendered by forbidden() (server/auth/guard.ts): signed in, but the role does not allow this page.
export default function Forbidden() {
  return (
    <main className="mx-auto max-w-xl px-gutter py-20">
      <p className="num text-table text-brass-600">403</p>
      <h1 className="mt-1 text-heading font-semibold">Your role does not open this page</h1>
      <p className="mt-3 text-ink-700">
        Ask an administrator of your organisation for the role you need, or switch to another organisation
        from the header.
      </p>
      <Link href="/desk" className={`${buttonStyles.secondary} mt-6`}>
        Back to your desk
      </Link>
    </main>
  );
}
