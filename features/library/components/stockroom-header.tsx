import Link from "next/link";

// Title and tabs of the Stockroom screens (gaskets, bolting, flange templates).
const TABS = [
  { href: "/library/gaskets", label: "Gaskets" },
  { href: "/library/bolting", label: "Bolting" },
  { href: "/library/flanges", label: "Flange templates" },
] as const;

export function StockroomHeader({
  current,
  canEdit,
}: {
  current: (typeof TABS)[number]["href"];
  canEdit: boolean;
}) {
  return (
    <header className="flex flex-col gap-3">
      <p className="text-table uppercase tracking-wider text-brass-600">Stockroom</p>
      <h1 className="text-display font-semibold">{TABS.find((t) => t.href === current)?.label}</h1>
      <p className="max-w-3xl text-body text-ink-700">
        Built-in rows are generic catalogue values with their source and confidence; they are read-only.
        {canEdit
          ? " Add your organisation's own rows, or hide built-in rows nobody should pick."
          : " Your admins add your organisation's own rows."}{" "}
        A design keeps a copy of the values it used, so changes here never alter a saved revision.
      </p>
      <nav aria-label="Stockroom sections" className="flex gap-1 border-b border-ink-100">
        {TABS.map((t) => (
          <Link
            key={t.href}
            href={t.href}
            aria-current={t.href === current ? "page" : undefined}
            className={`-mb-px border-b-2 px-3 py-2 text-body ${t.href === current ? "border-brass-500 font-medium text-ink-900" : "border-transparent text-ink-600 hover:text-ink-900"}`}
          >
            {t.label}
          </Link>
        ))}
      </nav>
    </header>
  );
}
