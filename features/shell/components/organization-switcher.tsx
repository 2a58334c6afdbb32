import type { OrganizationChoice } from "@/features/accounts/queries";

/** Choosing another organisation moves this session there (the action checks the membership). */
export function OrganizationSwitcher({
  organizations,
  activeId,
  switchOrganizationAction,
}: {
  organizations: OrganizationChoice[];
  activeId: string;
  switchOrganizationAction: (formData: FormData) => Promise<void>;
}) {
  const active = organizations.find((o) => o.id === activeId);
  if (organizations.length < 2) {
    return (
      <span className="text-table text-ink-200" data-testid="active-organization">
        {active?.name}
      </span>
    );
  }
  return (
    <form action={switchOrganizationAction} className="flex items-center gap-1">
      <label htmlFor="organization-switch" className="sr-only">
        Organisation
      </label>
      <select
        id="organization-switch"
        name="organizationId"
        defaultValue={activeId}
        className="rounded-plate border border-ink-600 bg-ink-800 px-2 py-1 text-table text-ink-50"
      >
        {organizations.map((o) => (
          <option key={o.id} value={o.id}>
            {o.name}
          </option>
        ))}
      </select>
      <button type="submit" className="rounded-plate px-2 py-1 text-table text-brass-300 hover:bg-ink-700">
        Switch
      </button>
    </form>
  );
}
