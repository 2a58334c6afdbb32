import Link from "next/link";
import type { Viewer } from "@/server/auth/guard";

/**
 * The desk's work lists. Placeholder owned by the review engineer, who replaces this file with
 * the real lists (awaiting my review, returned to me, recently approved); keep the props.
 */
export async function DeskLists({ viewer }: { viewer: Viewer }) {
  return (
    <section aria-labelledby="desk-lists" className="rounded-plate bg-white p-5 shadow-plate">
      <h2 id="desk-lists" className="text-lead font-semibold">Your work</h2>
      <p className="mt-2 text-ink-700">
        Nothing waits for you in {viewer.organizationName} yet. Open the <Link href="/designs" className="underline">Joint register</Link> to
        start a design.
      </p>
    </section>
  );
}
