import type { ReactNode } from "react";

/** A workspace page's title: the small brass line naming where it belongs, then the h1. */
export function PageTitle({ eyebrow, title }: { eyebrow: ReactNode; title: ReactNode }) {
  return (
    <>
      <p className="text-table uppercase tracking-wider text-brass-600">{eyebrow}</p>
      <h1 className="mt-1 text-display font-semibold">{title}</h1>
    </>
  );
}
