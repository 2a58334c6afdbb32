import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { getDb } from "@/db/index";
import { RevisionInputChanges } from "@/features/editor/components/revision-input-changes";
import { RevisionOverlay } from "@/features/editor/components/revision-overlay";
import { RevisionComparison } from "@/features/reviews/components/revision-comparison";
import { compareRevisions, listRevisionSummaries } from "@/features/reviews/queries";
import { CautionPanel } from "@/features/ui/caution-panel";
import { PageTitle } from "@/features/ui/page-title";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Revision comparison" };

const optionalNumber = z.coerce.number().int().min(1).max(100_000).optional().catch(undefined);

export default async function CompareRevisionsPage(props: {
  params: Promise<{ designId: string }>;
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const viewer = await requireViewer();
  const { designId } = await props.params;
  if (!z.uuid().safeParse(designId).success) notFound();
  const search = await props.searchParams;
  const db = getDb();
  const numbers = (await listRevisionSummaries(db, viewer.organizationId, designId)).map((r) => r.number);
  if (numbers.length === 0) notFound();
  // Without a choice: the working revision against the one before it.
  const to = optionalNumber.parse(search.to) ?? numbers.at(-1)!;
  const from = optionalNumber.parse(search.from) ?? numbers.filter((n) => n < to).at(-1) ?? to;
  const comparison = await compareRevisions(db, viewer.organizationId, designId, from, to);
  if (!comparison) notFound();
  return (
    <div className="flex flex-col gap-6">
      <header>
        <PageTitle eyebrow="Revision comparison" title={comparison.designName} />
      </header>
      <RevisionComparison
        comparison={comparison}
        drawing={
          <RevisionOverlay
            before={comparison.from.document}
            after={comparison.to.document}
            labels={{
              before: `Revision ${comparison.from.number}`,
              after: `Revision ${comparison.to.number}`,
            }}
          />
        }
        inputs={<RevisionInputChanges before={comparison.from.document} after={comparison.to.document} />}
      />
      <CautionPanel compact />
    </div>
  );
}
