import Link from "next/link";
import type { ReactNode } from "react";
import { getDb } from "@/db/index";
import {
  signOutAction,
  signOutEverywhereAction,
  switchOrganizationAction,
} from "@/features/accounts/actions";
import { listUserOrganizations } from "@/features/accounts/queries";
import { OrganizationSwitcher } from "@/features/shell/components/organization-switcher";
import { UserMenu } from "@/features/shell/components/user-menu";
import { WorkspaceNav } from "@/features/shell/components/workspace-nav";
import { BrandMark } from "@/features/ui/brand-mark";
import { requireViewer } from "@/server/auth/guard";

// The app shell of every signed-in screen. Layouts do not re-run on client navigation, so each
// page still calls requireViewer() itself where it reads data; this check only picks the chrome.
export default async function WorkspaceLayout({ children }: { children: ReactNode }) {
  const viewer = await requireViewer();
  const organizations = await listUserOrganizations(getDb(), viewer.userId);
  return (
    <div className="min-h-screen">
      <header className="bg-ink-900 text-ink-50">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 gap-y-1 px-gutter py-2">
          <Link href="/desk" className="flex items-center gap-2 font-semibold text-white">
            <BrandMark size={24} /> Sealpitch
          </Link>
          <WorkspaceNav roles={viewer.roles} />
          <div className="ml-auto flex min-w-0 flex-wrap items-center justify-end gap-x-3 gap-y-1">
            <OrganizationSwitcher
              organizations={organizations}
              activeId={viewer.organizationId}
              switchOrganizationAction={switchOrganizationAction}
            />
            <UserMenu
              displayName={viewer.displayName}
              email={viewer.email}
              roles={viewer.roles}
              signOutAction={signOutAction}
              signOutEverywhereAction={signOutEverywhereAction}
            />
          </div>
        </div>
      </header>
      <div className="mx-auto max-w-7xl px-gutter py-8">{children}</div>
    </div>
  );
}
