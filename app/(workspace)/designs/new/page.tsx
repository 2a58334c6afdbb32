import type { Metadata } from "next";
import Link from "next/link";
import { createDesignAction } from "@/features/designs/actions";
import { NewDesignForm } from "@/features/designs/components/new-design-form";
import { PageTitle } from "@/features/ui/page-title";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "New design" };

export default async function NewDesignPage() {
  await requireViewer({ role: "designer" });
  return (
    <div className="flex flex-col gap-6">
      <header>
        <PageTitle eyebrow="Joint register" title="New design" />
        <p className="mt-2 text-body text-ink-700">
          Pick a starting shape and its main dimensions in millimetres; everything else is set in the editor.
        </p>
        <p className="mt-1 text-body text-ink-700">
          Have a DXF of the flange outline and holes?{" "}
          <Link href="/designs/import" className="font-medium text-brass-700 underline">
            Start from the drawing (Drawing intake)
          </Link>
          .
        </p>
      </header>
      <NewDesignForm createDesignAction={createDesignAction} />
    </div>
  );
}
