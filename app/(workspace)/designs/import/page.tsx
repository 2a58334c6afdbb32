import type { Metadata } from "next";
import { ImportWizard } from "@/features/imports/components/import-wizard";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Drawing intake" };

export default async function DrawingIntakePage() {
  const viewer = await requireViewer({ role: "designer" });
  return (
    <div className="flex flex-col gap-6">
      <header>
        <p className="text-table uppercase tracking-wider text-brass-600">Joint register</p>
        <h1 className="mt-1 text-display font-semibold">Drawing intake</h1>
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
