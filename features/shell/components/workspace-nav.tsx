import Link from "next/link";
import type { Role } from "@/db/tables/core";
import { NAV_ITEMS } from "@/features/shell/nav-items";

/** The workspace navigation, without the items the viewer's roles cannot use. */
export function WorkspaceNav({ roles }: { roles: Role[] }) {
  const items = NAV_ITEMS.filter((item) => !item.roles || item.roles.some((r) => roles.includes(r)));
  return (
    <nav
      aria-label="Workspace"
      className="order-last -mx-2 flex w-full items-center gap-1 overflow-x-auto sm:order-none sm:mx-0 sm:w-auto"
    >
      {items.map((item) => (
        <Link
          key={item.href}
          href={item.href}
          className="shrink-0 whitespace-nowrap rounded-plate px-3 py-1.5 text-body text-ink-100 hover:bg-ink-700 hover:text-white"
        >
          {item.label}
        </Link>
      ))}
    </nav>
  );
}
