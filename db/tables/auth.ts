import type { ColumnType, Generated } from "kysely";
import type { Role } from "./core";
import type { Timestamp } from "./columns";

// Tables of migrations/2026_12_01_000300_create_invitations_and_tokens.ts.

export interface InvitationsTable {
  id: Generated<string>;
  organization_id: string;
  email: string;
  roles: ColumnType<Role[], Role[], Role[]>;
  /** sha-256 hex of the token in the e-mailed link; the token itself is never stored. */
  token_hash: string;
  invited_by: string | null;
  expires_at: Timestamp;
  accepted_at: Timestamp | null;
  revoked_at: Timestamp | null;
  created_at: Timestamp; // defaults to now()
}

export interface PasswordResetTokensTable {
  id: Generated<string>;
  user_id: string;
  token_hash: string;
  expires_at: Timestamp;
  used_at: Timestamp | null;
  created_at: Timestamp; // defaults to now()
}

export interface AuthAttemptsTable {
  id: Generated<number>;
  kind: string;
  key: string;
  created_at: Timestamp; // defaults to now()
}

export interface AuthTables {
  invitations: InvitationsTable;
  password_reset_tokens: PasswordResetTokensTable;
  auth_attempts: AuthAttemptsTable;
}
