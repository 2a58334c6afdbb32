"use client";

import Link from "next/link";
import useSWR from "swr";
import { DESK_LISTS_KEY } from "../cache-keys";
import type { DeskItemDto, DeskListsDto } from "../review-dto";
import { formatUtcMinute } from "@/features/ui/format-when";

async function fetchDesk(url: string): Promise<DeskListsDto> {
  const response = await fetch(url, { headers: { accept: "application/json" }, cache: "no-store" });
  if (!response.ok) throw new Error(`The desk lists could not be loaded (${response.status}).`);
  return (await response.json()) as DeskListsDto;
}

function DeskList({
  id,
  title,
  empty,
  items,
  kind,
}: {
  id: string;
  title: string;
  empty: string;
  items: DeskItemDto[];
  kind: "waiting" | "returned";
}) {
  return (
    <section
      aria-labelledby={id}
      className="rounded-plate bg-white p-5 shadow-plate"
      data-testid={`desk-${kind}`}
    >
      <h2 id={id} className="text-lead font-semibold">
        {title} <span className="num text-ink-500">({items.length})</span>
      </h2>
      {items.length === 0 ? (
        <p className="mt-2 text-body text-ink-500">{empty}</p>
      ) : (
        <ul className="mt-2 flex flex-col divide-y divide-ink-100">
          {items.map((item) => (
            <li key={`${item.designId}-${item.number}`} className="py-2">
              <Link href={item.href} className="font-medium text-ink-900 underline">
                {item.designName} · revision {item.number}
              </Link>
              <p className="text-table text-ink-600">
                {item.equipmentTag ? `${item.equipmentTag} · ` : ""}
                {kind === "waiting" ? `submitted by ${item.personName}` : `returned by ${item.personName}`}
                {item.at ? ` · ${formatUtcMinute(item.at)}` : ""}
              </p>
              {kind === "returned" && item.comment ? (
                <p className="text-table text-ink-800">“{item.comment}”</p>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/**
 * "Waiting for my review" and "Returned to me", polled with SWR every `refreshMs` (the server's
 * DESK_REFRESH_MS setting) so they change without a reload.
 */
export function DeskReviewLists({ fallback, refreshMs }: { fallback: DeskListsDto; refreshMs: number }) {
  const { data, error } = useSWR(DESK_LISTS_KEY, fetchDesk, {
    fallbackData: fallback,
    refreshInterval: refreshMs,
    revalidateOnFocus: true,
  });
  const lists = data ?? fallback;
  return (
    <div className="grid gap-4 md:grid-cols-2">
      {lists.isApprover ? (
        <DeskList
          id="desk-waiting"
          kind="waiting"
          title="Waiting for my review"
          empty="Nothing is waiting for your review."
          items={lists.waitingForMyReview}
        />
      ) : null}
      <DeskList
        id="desk-returned"
        kind="returned"
        title="Returned to me"
        empty="Nothing has been returned to you."
        items={lists.returnedToMe}
      />
      {error ? (
        <p role="status" className="text-table text-verdict-fail">
          {error instanceof Error ? error.message : "The desk lists could not be refreshed."}
        </p>
      ) : null}
    </div>
  );
}
