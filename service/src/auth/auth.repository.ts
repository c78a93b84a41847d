import { recordAudit } from '../audit/audit.repository.js';
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

/** Which optional mail the person chose. */
export async function findMailSettings(db: Database, userId: string): Promise<{ reviewDigest: boolean } | null> {
  const row = await db('users').where({ id: userId }).first('review_digest');
  return row ? { reviewDigest: row.review_digest } : null;
}

/** Stores the person's choice, audited when it changes; false when the account is gone. */
export async function saveMailSettings(db: Database, userId: string, reviewDigest: boolean): Promise<boolean> {
  return db.transaction(async (trx) => {
    const row = await trx('users').where({ id: userId }).forUpdate().first('review_digest');
    if (!row) return false;
    if (row.review_digest === reviewDigest) return true;
    await trx('users').where({ id: userId }).update({ review_digest: reviewDigest });
    await recordAudit(trx, {
      userId,
      action: 'mail-settings',
      entity: 'user',
      entityId: userId,
      detail: { before: { reviewDigest: row.review_digest }, after: { reviewDigest } },
    });
    return true;
  });
}
