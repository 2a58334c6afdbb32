import type { ColumnType, Generated } from "kysely";
import type { Timestamp } from "./columns";

// Tables of the foundation: schema bookkeeping, accounts, organisations, sessions.
// Nullable columns are `T | null`; columns with database defaults are Generated<T>. Timestamp
// already allows leaving the value out on insert (database default now()), so it is not wrapped.

export type Role = "designer" | "approver" | "admin";
export type UnitSystem = "SI" | "US";

export interface AppMetaTable {
  id: Generated<number>;
  schema_version: string;
  updated_at: Timestamp;
}

export interface UsersTable {
  id: Generated<string>;
  email: string;
  display_name: string;
  password_hash: string | null;
  unit_system: Generated<UnitSystem>;
  created_at: Timestamp;
  disabled_at: Timestamp | null;
}

export interface OrganizationsTable {
  id: Generated<string>;
  name: string;
  slug: string;
  created_at: Timestamp;
}

export interface MembershipsTable {
  organization_id: string;
  user_id: string;
  roles: ColumnType<Role[], Role[] | undefined, Role[]>;
  created_at: Timestamp;
}

export interface SessionsTable {
  id: string;
  user_id: string;
  expires_at: Timestamp;
  active_organization_id: string | null;
  created_at: Timestamp;
}

export interface CoreTables {
  app_meta: AppMetaTable;
  users: UsersTable;
  organizations: OrganizationsTable;
  memberships: MembershipsTable;
  sessions: SessionsTable;
}
