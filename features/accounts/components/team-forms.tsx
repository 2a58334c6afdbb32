"use client";

import { useActionState, type ReactNode } from "react";
import type { Role } from "@/db/tables/core";
import type { ActionResult } from "@/features/forms/action-result";
import { buttonStyles } from "@/features/ui/button-styles";
import { TextField } from "@/features/ui/text-field";
import { useRememberedValues } from "@/features/ui/use-remembered-values";

type TeamAction = (prev: ActionResult<string> | null, data: FormData) => Promise<ActionResult<string>>;

const ROLE_LABELS: { role: Role; label: string }[] = [
  { role: "designer", label: "Designer" },
  { role: "approver", label: "Approver" },
  { role: "admin", label: "Administrator" },
];

function Status({ state }: { state: ActionResult<string> | null }) {
  return (
    <span
      role="status"
      aria-live="polite"
      className={state?.ok ? "text-table text-verdict-pass" : "text-table text-verdict-fail"}
    >
      {state ? (state.ok ? state.data : (state.fieldErrors?.roles?.[0] ?? state.message)) : ""}
    </span>
  );
}

function RoleChoices({ name, selected, legend }: { name: string; selected: Role[]; legend: string }) {
  return (
    <fieldset className="flex flex-wrap items-center gap-3">
      <legend className="sr-only">{legend}</legend>
      {ROLE_LABELS.map(({ role, label }) => (
        <label key={role} className="flex items-center gap-1 text-table">
          <input type="checkbox" name={name} value={role} defaultChecked={selected.includes(role)} /> {label}
        </label>
      ))}
    </fieldset>
  );
}

export function InviteMemberForm({ inviteMemberAction }: { inviteMemberAction: TeamAction }) {
  const [state, formAction, pending] = useActionState(inviteMemberAction, null);
  const errors = state && !state.ok ? state.fieldErrors : undefined;
  const { values, remember } = useRememberedValues();
  return (
    <form
      action={remember(formAction)}
      className="flex flex-col gap-3"
      noValidate
      aria-label="Invite a member"
    >
      <TextField
        label="E-mail"
        name="email"
        type="email"
        required
        errors={errors?.email}
        defaultValue={state?.ok ? "" : values.email}
      />
      <RoleChoices name="roles" selected={["designer"]} legend="Roles of the new member" />
      {errors?.roles ? <p className="text-table text-verdict-fail">{errors.roles[0]}</p> : null}
      <div className="flex items-center gap-3">
        <button type="submit" className={buttonStyles.primary} disabled={pending}>
          Send invitation
        </button>
        <Status state={state && !state.ok && (errors?.email || errors?.roles) ? null : state} />
      </div>
    </form>
  );
}

function RowForm({
  action,
  children,
  hidden,
}: {
  action: TeamAction;
  children: (pending: boolean) => ReactNode;
  hidden: Record<string, string>;
}) {
  const [state, formAction, pending] = useActionState(action, null);
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-3">
      {Object.entries(hidden).map(([name, value]) => (
        <input key={name} type="hidden" name={name} value={value} />
      ))}
      {children(pending)}
      <Status state={state} />
    </form>
  );
}

export function MemberRoleForm({
  userId,
  displayName,
  roles,
  changeMemberRolesAction,
}: {
  userId: string;
  displayName: string;
  roles: Role[];
  changeMemberRolesAction: TeamAction;
}) {
  return (
    <RowForm action={changeMemberRolesAction} hidden={{ userId }}>
      {(pending) => (
        <>
          <RoleChoices name="roles" selected={roles} legend={`Roles of ${displayName}`} />
          <button
            type="submit"
            className={buttonStyles.secondary}
            disabled={pending}
            aria-label={`Save roles of ${displayName}`}
          >
            Save roles
          </button>
        </>
      )}
    </RowForm>
  );
}

/** A row's one-button form (Remove, Resend, Revoke): the button is disabled while its action runs. */
function RowButtonForm({
  action,
  hidden,
  look,
  label,
  children,
}: {
  action: TeamAction;
  hidden: Record<string, string>;
  look: keyof typeof buttonStyles;
  label: string;
  children: ReactNode;
}) {
  return (
    <RowForm action={action} hidden={hidden}>
      {(pending) => (
        <button type="submit" className={buttonStyles[look]} disabled={pending} aria-label={label}>
          {children}
        </button>
      )}
    </RowForm>
  );
}

export function RemoveMemberForm({
  userId,
  displayName,
  removeMemberAction,
}: {
  userId: string;
  displayName: string;
  removeMemberAction: TeamAction;
}) {
  return (
    <RowButtonForm
      action={removeMemberAction}
      hidden={{ userId }}
      look="danger"
      label={`Remove ${displayName}`}
    >
      Remove
    </RowButtonForm>
  );
}

export function InvitationButtons({
  invitationId,
  email,
  resendInvitationAction,
  revokeInvitationAction,
}: {
  invitationId: string;
  email: string;
  resendInvitationAction: TeamAction;
  revokeInvitationAction: TeamAction;
}) {
  return (
    <div className="flex flex-wrap items-center gap-2">
      {(
        [
          { verb: "Resend", action: resendInvitationAction, look: "secondary" },
          { verb: "Revoke", action: revokeInvitationAction, look: "quiet" },
        ] as const
      ).map(({ verb, action, look }) => (
        <RowButtonForm
          key={verb}
          action={action}
          hidden={{ invitationId }}
          look={look}
          label={`${verb} the invitation to ${email}`}
        >
          {verb}
        </RowButtonForm>
      ))}
    </div>
  );
}
