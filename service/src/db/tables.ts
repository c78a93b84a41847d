/** Row shapes as the repositories read them. NUMERIC columns arrive as strings and stay strings. */

export type ProjectRole = 'engineer' | 'reviewer' | 'contractor';
export const projectRoles: readonly ProjectRole[] = ['engineer', 'reviewer', 'contractor'];

export interface UserRow {
  id: string;
  email: string;
  name: string;
  password_hash: string;
  is_admin: boolean;
  created_at: Date;
  /** Set while an administrator has the account disabled. */
  disabled_at: Date | null;
}

export interface SessionRow {
  id: string;
  user_id: string;
  created_at: Date;
  last_seen_at: Date;
  expires_at: Date;
  revoked_at: Date | null;
  user_agent: string | null;
  /** PostgreSQL `inet`, which pg returns as text. */
  address: string | null;
}

export interface ProjectRow {
  id: string;
  name: string;
  state: string;
  version: number;
  created_by: string | null;
  created_at: Date;
  updated_at: Date;
}

export interface ProjectMemberRow {
  project_id: string;
  user_id: string;
  role: ProjectRole;
}

export interface AuditLogRow {
  id: string;
  at: Date;
  user_id: string | null;
  project_id: string | null;
  action: string;
  entity: string;
  entity_id: string | null;
  detail: unknown;
}
