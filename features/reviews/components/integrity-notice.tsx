import { describeIntegrity, type SnapshotIntegrity } from "@/features/analysis/content-hash";

// A mismatch is an alert in the page's main column, never folded away: someone changed the
// stored snapshot outside the review flow, and a reader must not trust it.
export function IntegrityNotice({ integrity }: { integrity: SnapshotIntegrity }) {
  const text = describeIntegrity(integrity);
  if (integrity.state === "mismatch") {
    return (
      <p
        role="alert"
        data-testid="snapshot-integrity"
        className="rounded-plate border-2 border-verdict-fail bg-verdict-fail-bg p-3 text-body font-semibold text-verdict-fail break-all"
      >
        {text}
      </p>
    );
  }
  return (
    <p data-testid="snapshot-integrity" className="text-micro text-ink-500 break-all">
      {text}
    </p>
  );
}
