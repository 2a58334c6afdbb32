import type { Metadata } from "next";
import { ImportWizard } from "@/features/imports/components/import-wizard";
import { PageTitle } from "@/features/ui/page-title";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Drawing intake" };

export default async function DrawingIntakePage() {
  const viewer = await requireViewer({ role: "designer" });
  return (
    <div className="flex flex-col gap-6">
      <header>
        <PageTitle eyebrow="Joint register" title="Drawing intake" />
        <p className="mt-2 max-w-3xl text-body text-ink-700">
          Start a design from a DXF drawing: the largest closed shape is the flange outline, the most common
          circle size inside it are the bolt holes, and a large centred circle is the bore. Check the preview
          before you create the design.
        </p>
      </header>
      <ImportWizard units={viewer.unitSystem} />
    </div>
  );
}
