"use client";
import dynamic from "next/dynamic";

// The FE cross-check and the Drawing drawer sit below the editor and read their data with SWR
// after the page shows anyway, so their code is fetched then too: it stays out of the Layout
// desk's first-load JavaScript. Until it arrives each box shows its heading, so nothing jumps.
function Waiting({ title }: { title: string }) {
  return (
    <section aria-label={title} className="rounded-plate bg-white p-4 shadow-plate" aria-busy="true">
      <h2 className="text-lead font-semibold">{title}</h2>
      <p className="mt-1 text-table text-ink-500">Loading…</p>
    </section>
  );
}

export const LazyFeCheckPanel = dynamic(
  () => import("@/features/fe-check/components/fe-check-panel").then((m) => m.FeCheckPanel),
  { ssr: false, loading: () => <Waiting title="FE cross-check" /> },
);

export const LazyAttachmentPanel = dynamic(
  () => import("@/features/attachments/components/attachment-panel").then((m) => m.AttachmentPanel),
  { ssr: false, loading: () => <Waiting title="Drawing drawer" /> },
);
