import type { Database } from '../db/database.js';
import { projectRoles, type ProjectRole, type UserRow } from '../db/tables.js';

export interface PublicUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  /** The distinct roles the user holds across their projects, for the top bar. */
  roles: ProjectRole[];
}

export async function findUserByEmail(db: Database, email: string): Promise<UserRow | undefined> {
  return db('users').whereRaw('lower(email) = lower(?)', [email]).first();
}

export async function findUserById(db: Database, id: string): Promise<UserRow | undefined> {
  return db<UserRow>('users').where({ id }).first();
}

export async function toPublicUser(db: Database, row: UserRow): Promise<PublicUser> {
  const held = await db('project_members').where({ user_id: row.id }).distinct<{ role: ProjectRole }[]>('role');
  const roles = projectRoles.filter((role) => held.some((entry) => entry.role === role));
  return { id: row.id, email: row.email, name: row.name, isAdmin: row.is_admin, roles };
}
