import Link from "next/link";
import { getDb } from "@/db/index";
import { getEnv } from "@/server/env";
import { DeskReviewLists } from "@/features/reviews/components/desk-review-lists";
import { getDeskLists } from "@/features/reviews/queries";
import type { Viewer } from "@/server/auth/guard";

/**
 * The desk's work lists: the review lists are server-rendered first (fallback) and then kept
 * fresh by SWR from /api/v1/desk every DESK_REFRESH_MS, so a submission or return shows up without a reload.
 */
export async function DeskLists({ viewer }: { viewer: Viewer }) {
  const lists = await getDeskLists(getDb(), viewer);
  return (
    <section aria-label="Your work" className="flex flex-col gap-3">
      <DeskReviewLists fallback={lists} refreshMs={getEnv().DESK_REFRESH_MS} />
      <p className="text-table text-ink-600">
        All designs of {viewer.organizationName} are in the{" "}
        <Link href="/designs" className="underline">
          Joint register
        </Link>
        .
      </p>
    </section>
  );
}
