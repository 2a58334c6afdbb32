import Link from "next/link";
import type { ReactNode } from "react";
import { BrandMark } from "@/features/ui/brand-mark";

// Sign-in, sign-up, invitations and password reset: one narrow card under the brand.
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center bg-steel-50 px-gutter py-12">
      <Link href="/" className="mb-8 flex items-center gap-2 text-lead font-semibold text-ink-900">
        <BrandMark /> Sealpitch
      </Link>
      <main className="w-full max-w-md rounded-plate bg-white p-6 shadow-plate">{children}</main>
    </div>
  );
}
