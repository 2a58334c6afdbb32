import type { Metadata } from "next";
import Link from "next/link";
import { DeskLists } from "./_components/desk-lists";
import { buttonStyles } from "@/features/ui/button-styles";
import { PageTitle } from "@/features/ui/page-title";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Desk" };

const ROLE_NAMES = { designer: "Designer", approver: "Approver", admin: "Administrator" } as const;

export default async function DeskPage() {
  const viewer = await requireViewer();
  return (
    <div className="flex flex-col gap-6">
      <section>
        <PageTitle eyebrow="Desk" title={`Good to see you, ${viewer.displayName.split(" ")[0]}.`} />
        <p className="mt-2 text-lead text-ink-700">
          {viewer.organizationName} ·{" "}
          <span data-testid="desk-roles">{viewer.roles.map((r) => ROLE_NAMES[r]).join(", ")}</span>
        </p>
        <div className="mt-4 flex flex-wrap gap-3">
          <Link href="/designs" className={buttonStyles.primary}>
            Open the Joint register
          </Link>
          {viewer.roles.includes("designer") ? (
            <Link href="/designs/new" className={buttonStyles.secondary}>
              Start a joint design
            </Link>
          ) : null}
          {viewer.roles.includes("admin") ? (
            <Link href="/team" className={buttonStyles.quiet}>
              Manage the crew
            </Link>
          ) : null}
        </div>
      </section>
      <DeskLists viewer={viewer} />
    </div>
  );
}
