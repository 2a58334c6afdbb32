import "server-only";
import { cookies } from "next/headers";
import { getDb } from "@/db/index";
import { getLucia } from "./lucia";
import { hashSessionId } from "./session-id";

// Writing the session cookie: only in server actions and route handlers (Next forbids it in
// server components).

/** Creates a session in the given organisation and sets its cookie. */
export async function startSession(userId: string, organizationId: string | null): Promise<void> {
  const lucia = getLucia();
  const session = await lucia.createSession(userId, { active_organization_id: organizationId });
  const cookie = lucia.createSessionCookie(session.id);
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

async function clearCookie(): Promise<void> {
  const blank = getLucia().createBlankSessionCookie();
  (await cookies()).set(blank.name, blank.value, blank.attributes);
}

/** Sign out: ends this browser's session. */
export async function endSession(sessionId: string): Promise<void> {
  await getLucia().invalidateSession(sessionId);
  await clearCookie();
}

/** Sign out everywhere: ends every session of the user, this one included. */
export async function endAllSessions(userId: string): Promise<void> {
  await getLucia().invalidateUserSessions(userId);
  await clearCookie();
}

/** Moves a session to another organisation; refused (false) unless the user is a member there. */
export async function switchSessionOrganization(
  sessionId: string,
  userId: string,
  organizationId: string,
): Promise<boolean> {
  const db = getDb();
  const result = await db
    .updateTable("sessions")
    .set({ active_organization_id: organizationId })
    .where("id", "=", hashSessionId(sessionId))
    .where("user_id", "=", userId)
    .where((eb) =>
      eb.exists(
        eb
          .selectFrom("memberships")
          .select("user_id")
          .where("memberships.user_id", "=", userId)
          .where("memberships.organization_id", "=", organizationId),
      ),
    )
    .executeTakeFirst();
  return Number(result.numUpdatedRows) === 1;
}
