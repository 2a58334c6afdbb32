import type { Metadata } from "next";
import { getDb } from "@/db/index";
import {
  InvitationButtons,
  InviteMemberForm,
  MemberRoleForm,
  RemoveMemberForm,
} from "@/features/accounts/components/team-forms";
import { getTeam } from "@/features/accounts/team";
import {
  changeMemberRolesAction,
  inviteMemberAction,
  removeMemberAction,
  resendInvitationAction,
  revokeInvitationAction,
} from "@/features/accounts/team-actions";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Crew" };

export default async function TeamPage() {
  const viewer = await requireViewer({ role: "admin" });
  const team = await getTeam(getDb(), viewer.organizationId);
  return (
    <div className="flex flex-col gap-8">
      <header>
        <p className="text-table uppercase tracking-wider text-brass-600">Crew</p>
        <h1 className="mt-1 text-heading font-semibold">Who works in {viewer.organizationName}</h1>
      </header>

      <section aria-labelledby="members" className="rounded-plate bg-white p-5 shadow-plate">
        <h2 id="members" className="text-lead font-semibold">
          Members
        </h2>
        <div className="max-w-full overflow-x-auto">
          <table className="mt-3 w-full">
            <thead className="text-left text-ink-500">
              <tr>
                <th className="py-2">Name</th>
                <th>E-mail</th>
                <th>Roles</th>
                <th>
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {team.members.map((m) => (
                <tr key={m.userId} className="border-t border-ink-100 align-middle">
                  <td className="py-2 font-medium">
                    {m.displayName}
                    {m.userId === viewer.userId ? " (you)" : ""}
                  </td>
                  <td className="num">{m.email}</td>
                  <td>
                    <MemberRoleForm
                      userId={m.userId}
                      displayName={m.displayName}
                      roles={m.roles}
                      changeMemberRolesAction={changeMemberRolesAction}
                    />
                  </td>
                  <td>
                    <RemoveMemberForm
                      userId={m.userId}
                      displayName={m.displayName}
                      removeMemberAction={removeMemberAction}
                    />
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <section aria-labelledby="pending" className="rounded-plate bg-white p-5 shadow-plate">
        <h2 id="pending" className="text-lead font-semibold">
          Pending invitations
        </h2>
        {team.invitations.length === 0 ? (
          <p className="mt-2 text-ink-600">No invitations are waiting.</p>
        ) : (
          <div className="max-w-full overflow-x-auto">
            <table className="mt-3 w-full">
              <thead className="text-left text-ink-500">
                <tr>
                  <th className="py-2">E-mail</th>
                  <th>Roles</th>
                  <th>Link valid until</th>
                  <th>
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {team.invitations.map((i) => (
                  <tr key={i.invitationId} className="border-t border-ink-100">
                    <td className="num py-2">{i.email}</td>
                    <td>{i.roles.join(", ")}</td>
                    <td className="num">{i.expired ? "expired" : i.expiresAt.slice(0, 10)}</td>
                    <td>
                      <InvitationButtons
                        invitationId={i.invitationId}
                        email={i.email}
                        resendInvitationAction={resendInvitationAction}
                        revokeInvitationAction={revokeInvitationAction}
                      />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section aria-labelledby="invite" className="max-w-lg rounded-plate bg-white p-5 shadow-plate">
        <h2 id="invite" className="text-lead font-semibold">
          Invite a member
        </h2>
        <p className="mt-1 text-table text-ink-600">They get an e-mail with a link that works for 7 days.</p>
        <div className="mt-4">
          <InviteMemberForm inviteMemberAction={inviteMemberAction} />
        </div>
      </section>
    </div>
  );
}
