import { ACTIVITY_LABELS, type ActivityEntryDto } from "../activity-kinds";
import { formatUtcMinute } from "@/features/ui/format-when";

// Server-renderable list of a design's activity (who did what when). Pass the entries from
// listActivity(db, organizationId, designId) — the component does no data access itself.
export function ActivityList({
  entries,
  title = "Activity",
}: {
  entries: ActivityEntryDto[];
  title?: string;
}) {
  return (
    <section aria-labelledby="activity-heading" className="rounded-plate bg-steel-50 p-panel shadow-plate">
      <h2 id="activity-heading" className="text-lead font-semibold text-ink-900">
        {title}
      </h2>
      {entries.length === 0 ? (
        <p className="mt-2 text-body text-ink-500">Nothing recorded yet.</p>
      ) : (
        <ol className="mt-2 space-y-1" aria-label="Activity entries">
          {entries.map((entry) => (
            <li key={entry.id} className="text-table text-ink-700">
              <time dateTime={entry.at} className="num mr-2 text-ink-500">
                {formatUtcMinute(entry.at)}
              </time>
              <span className="font-medium text-ink-900">{entry.actorName}</span>{" "}
              {ACTIVITY_LABELS[entry.kind]}
              {entry.revisionNumber !== null ? ` revision ${entry.revisionNumber}` : ""}
              {entry.detail ? <span className="text-ink-500"> — {entry.detail}</span> : null}
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
