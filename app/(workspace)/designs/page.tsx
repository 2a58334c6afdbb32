import type { Metadata } from "next";
import Link from "next/link";
import { getDb } from "@/db/index";
import { duplicateDesignAction, setDesignArchivedAction } from "@/features/designs/actions";
import { DesignRegisterTable } from "@/features/designs/components/design-register-table";
import { RegisterFilters } from "@/features/designs/components/register-filters";
import { canCreateDesign } from "@/features/designs/policies";
import { listDesignOwners, listDesigns } from "@/features/designs/queries";
import { registerHref } from "@/features/designs/register-href";
import { listDesignsQuerySchema, searchParamsToObject } from "@/features/designs/schema";
import { buttonStyles } from "@/features/ui/button-styles";
import { PageTitle } from "@/features/ui/page-title";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Joint register" };

export default async function DesignsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const viewer = await requireViewer();
  const query = listDesignsQuerySchema.parse(searchParamsToObject(await searchParams));
  const db = getDb();
  const [page, owners] = await Promise.all([
    listDesigns(db, viewer.organizationId, query),
    listDesignOwners(db, viewer.organizationId),
  ]);
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <PageTitle
            eyebrow={viewer.organizationName}
            title={query.archived === "only" ? "Joint register: archived" : "Joint register"}
          />
        </div>
        <div className="flex flex-wrap gap-3">
          <Link
            href={registerHref(query, { archived: query.archived === "only" ? "hide" : "only", page: 1 })}
            className={buttonStyles.quiet}
          >
            {query.archived === "only" ? "Show current joints" : "Show archived"}
          </Link>
          {canCreateDesign(viewer) ? (
            <>
              <Link href="/designs/import" className={buttonStyles.secondary}>
                From a DXF drawing
              </Link>
              <Link href="/designs/new" className={buttonStyles.primary}>
                New design
              </Link>
            </>
          ) : null}
        </div>
      </header>
      <RegisterFilters query={query} owners={owners} />
      <DesignRegisterTable
        page={page}
        query={query}
        viewer={viewer}
        duplicateDesignAction={duplicateDesignAction}
        setDesignArchivedAction={setDesignArchivedAction}
      />
    </div>
  );
}
