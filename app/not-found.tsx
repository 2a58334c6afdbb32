import type { Metadata } from "next";
import Link from "next/link";
import { BrandMark } from "@/features/ui/brand-mark";
import { buttonStyles } from "@/features/ui/button-styles";

export const metadata: Metadata = { title: "Page not found" };

// Rendered for an address that matches no route, and by notFound() (a design, revision or
// Stockroom row that does not exist or is not in your organisation: both look the same).
export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-gutter py-20">
      <Link href="/" className="flex items-center gap-2 font-semibold text-ink-900">
        <BrandMark /> Sealpitch
      </Link>
      <p className="num mt-10 text-table text-brass-600">404</p>
      <h1 className="mt-1 text-heading font-semibold">Nothing at this address</h1>
      <p className="mt-3 text-ink-700">
        The page, design or revision you asked for does not exist, or it belongs to an organisation you are
        not signed in to. Check the link, or find the design in the Joint register.
      </p>
      <div className="mt-6 flex flex-wrap gap-3">
        <Link href="/desk" className={buttonStyles.secondary}>
          Back to your desk
        </Link>
        <Link href="/designs" className={buttonStyles.quiet}>
          Joint register
        </Link>
      </div>
    </main>
  );
}
