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
import { Panel, PanelTable } from "@/features/ui/panel";
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

      <Panel id="members" title="Members" className="p-5">
        <PanelTable headers={["Name", "E-mail", "Roles"]} commandsHeader="Remove">
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
        </PanelTable>
      </Panel>

      <Panel id="pending" title="Pending invitations" className="p-5">
        {team.invitations.length === 0 ? (
          <p className="mt-2 text-ink-600">No invitations are waiting.</p>
        ) : (
          <PanelTable headers={["E-mail", "Roles", "Link valid until"]} commandsHeader="Actions">
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
          </PanelTable>
        )}
      </Panel>

      <Panel id="invite" title="Invite a member" className="max-w-lg p-5">
        <p className="mt-1 text-table text-ink-600">They get an e-mail with a link that works for 7 days.</p>
        <div className="mt-4">
          <InviteMemberForm inviteMemberAction={inviteMemberAction} />
        </div>
      </Panel>
    </div>
  );
}
