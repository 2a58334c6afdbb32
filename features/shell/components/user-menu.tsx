import type { Role } from "@/db/tables/core";

/** Name, roles and the two ways out. A <details> menu: works without client JavaScript. */
export function UserMenu({
  displayName,
  email,
  roles,
  signOutAction,
  signOutEverywhereAction,
}: {
  displayName: string;
  email: string;
  roles: Role[];
  signOutAction: () => Promise<void>;
  signOutEverywhereAction: () => Promise<void>;
}) {
  return (
    <details className="relative">
      <summary
        className="cursor-pointer list-none rounded-plate px-3 py-1.5 text-body text-ink-50 hover:bg-ink-700"
        aria-label="Account menu"
      >
        {displayName}
      </summary>
      <div className="absolute right-0 z-20 mt-2 w-64 rounded-plate bg-white p-3 text-ink-800 shadow-plate">
        <p className="font-medium">{displayName}</p>
        <p className="text-table text-ink-500">{email}</p>
        <p className="mt-1 text-micro uppercase tracking-wider text-brass-600">{roles.join(" · ")}</p>
        <form action={signOutAction} className="mt-3">
          <button type="submit" className="w-full rounded-plate px-2 py-1.5 text-left hover:bg-ink-50">
            Sign out
          </button>
        </form>
        <form action={signOutEverywhereAction}>
          <button type="submit" className="w-full rounded-plate px-2 py-1.5 text-left hover:bg-ink-50">
            Sign out everywhere
          </button>
        </form>
      </div>
    </details>
  );
}
