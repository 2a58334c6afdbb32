import Link from "next/link";
import { comparePath, revisionPath } from "../cache-keys";
import type { RevisionReviewDto } from "../review-dto";
import { ExportLinks } from "./export-links";
import { IntegrityNotice } from "./integrity-notice";
import { StatusBadge } from "./status-badge";
import { UnverifiedValueList } from "./unverified-value-list";
import { formatUtcMinute } from "@/features/ui/format-when";

const when = (iso: string | null) => (iso ? formatUtcMinute(iso) : "");

/** Title block of the review screen: who did what, the snapshot's integrity, shop documents. */
export function RevisionHeader({ review }: { review: RevisionReviewDto }) {
  const previous = review.revisionNumbers.filter((n) => n < review.number).at(-1);
  return (
    <header className="flex flex-col gap-3">
      <p className="text-table uppercase tracking-wider text-brass-600">Sign-off sheet</p>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-display font-semibold text-ink-900">
          {review.designName} <span className="text-ink-500">· revision {review.number}</span>
        </h1>
        <StatusBadge status={review.status} />
      </div>
      <p className="text-body text-ink-700">
        {review.equipmentTag ? <>{review.equipmentTag} · </> : null}
        Created by {review.createdByName} · last edited by {review.lastEditedByName}
        {review.submittedByName ? (
          <>
            {" "}
            · submitted by {review.submittedByName} {when(review.submittedAt)}
          </>
        ) : null}
        {review.decidedByName ? (
          <>
            {" "}
            · decided by {review.decidedByName} {when(review.decidedAt)}
          </>
        ) : null}
        {review.coreVersion ? <> · core {review.coreVersion}</> : null}
      </p>
      <IntegrityNotice integrity={review.integrity} />
      <div className="flex flex-wrap items-center gap-3 text-table">
        <Link className="underline text-ink-700" href={`/designs/${review.designId}`}>
          Open the design
        </Link>
        {previous ? (
          <Link
            className="underline text-ink-700"
            href={comparePath(review.designId, previous, review.number)}
          >
            Compare with revision {previous}
          </Link>
        ) : null}
        {review.revisionNumbers.length > 1 ? (
          <span className="text-ink-500">
            Revisions:{" "}
            {review.revisionNumbers.map((n) => (
              <Link
                key={n}
                href={revisionPath(review.designId, n)}
                aria-current={n === review.number ? "page" : undefined}
                className={`ml-1 underline ${n === review.number ? "font-semibold text-ink-900" : ""}`}
              >
                {n}
              </Link>
            ))}
          </span>
        ) : null}
      </div>
      <ExportLinks designId={review.designId} number={review.number} />
      {review.decisions.length > 0 ? (
        <ol aria-label="Decisions" className="flex flex-col gap-1 text-table text-ink-700">
          {review.decisions.map((d, i) => (
            <li key={i}>
              <span className="font-medium">{d.actorName}</span>{" "}
              {d.kind === "approved" ? "approved" : "returned"} it {when(d.at)}
              {d.comment ? <>: “{d.comment}”</> : null}
              {d.acknowledgedUnverified.length > 0 ? (
                <details className="mt-1">
                  <summary className="cursor-pointer text-ink-600">
                    acknowledging {d.acknowledgedUnverified.length} unverified table value
                    {d.acknowledgedUnverified.length === 1 ? "" : "s"}
                  </summary>
                  <UnverifiedValueList
                    values={d.acknowledgedUnverified}
                    label="Acknowledged unverified table values"
                  />
                </details>
              ) : null}
            </li>
          ))}
        </ol>
      ) : null}
    </header>
  );
}
