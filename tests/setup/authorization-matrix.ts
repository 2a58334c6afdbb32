import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Role } from "@/db/tables/core";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "./fixtures";
import { getTestDb } from "./test-db";

// A table-driven authorisation matrix for route handlers. Each row calls one handler as every
// kind of viewer and states the status each must get. Add your routes as rows (in
// tests/features/accounts/authorization-matrix.test.ts, or call runAuthorizationMatrix from your
// own suite). `home` is the viewer's organisation, `foreign` another one whose ids must be 404.
export const VIEWER_ROLES = {
  designer: ["designer"],
  approver: ["approver"],
  admin: ["admin"],
  designerApprover: ["designer", "approver"],
  adminDesigner: ["admin", "designer"],
} as const satisfies Record<string, Role[]>;

export type MatrixViewer = keyof typeof VIEWER_ROLES | "signedOut";
export const MATRIX_VIEWERS: MatrixViewer[] = [
  "signedOut",
  ...(Object.keys(VIEWER_ROLES) as (keyof typeof VIEWER_ROLES)[]),
];

export interface MatrixContext {
  home: OrganizationFixture<keyof typeof VIEWER_ROLES>;
  foreign: OrganizationFixture<"foreignAdmin" | "foreignDesigner">;
  /** The Cookie header for that viewer in `home` (undefined when signed out). */
  cookie(who: MatrixViewer): Promise<string | undefined>;
  request: typeof appRequest;
}

export interface MatrixRow {
  name: string;
  /** Calls the handler (import its GET/POST/… and pass appRequest(...) with the cookie). */
  call(ctx: MatrixContext, cookie: string | undefined): Promise<Response>;
  /** Expected HTTP status per viewer; `member` fills any role not named. */
  expect: Partial<Record<MatrixViewer, number>> & { member?: number; signedOut: number };
}

export function expectedStatus(row: MatrixRow, who: MatrixViewer): number {
  const status = row.expect[who] ?? (who === "signedOut" ? row.expect.signedOut : row.expect.member);
  if (status === undefined) throw new Error(`${row.name}: no expected status for ${who}`);
  return status;
}

export function runAuthorizationMatrix(title: string, rows: MatrixRow[]): void {
  describe(title, () => {
    const db = getTestDb();
    let ctx: MatrixContext;
    beforeAll(async () => {
      const home = await createOrganizationWithMembers(
        db,
        VIEWER_ROLES as unknown as Record<keyof typeof VIEWER_ROLES, Role[]>,
      );
      const foreign = await createOrganizationWithMembers(db, {
        foreignAdmin: ["admin"],
        foreignDesigner: ["designer"],
      });
      ctx = {
        home,
        foreign,
        cookie: async (who) => (who === "signedOut" ? undefined : home.cookieFor(who)),
        request: appRequest,
      };
    });
    afterAll(async () => {
      await ctx?.home.cleanup();
      await ctx?.foreign.cleanup();
    });

    for (const row of rows) {
      for (const who of MATRIX_VIEWERS) {
        const status = expectedStatus(row, who);
        it(`${row.name} as ${who} → ${status}`, async () => {
          const response = await row.call(ctx, await ctx.cookie(who));
          expect(response.status, await response.clone().text()).toBe(status);
        });
      }
    }
  });
}
