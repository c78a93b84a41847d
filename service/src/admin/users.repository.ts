import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import type { UserRow } from '../db/tables.js';
import type { AccountView } from '../../../contract/accounts.js';

const toView = (row: UserRow): AccountView => ({
  id: row.id,
  email: row.email,
  name: row.name,
  isAdmin: row.is_admin,
  disabled: row.disabled_at !== null,
  createdAt: row.created_at.toISOString(),
});

export async function listUsers(db: Database): Promise<AccountView[]> {
  const rows: UserRow[] = await db('users').orderByRaw('lower(name), lower(email)');
  return rows.map(toView);
}

export async function findUserForUpdate(trx: Knex.Transaction, id: string): Promise<UserRow | undefined> {
  return trx('users').where({ id }).forUpdate().first();
}

/** A new account with a password nobody knows: its owner chooses one through the link mailed to them. */
export async function createUser(trx: Knex.Transaction, user: { email: string; name: string; isAdmin: boolean }): Promise<UserRow> {
  const unusable = await bcrypt.hash(randomBytes(32).toString('base64url'), 10);
  const [row] = await trx('users')
    .insert({ email: user.email, name: user.name, is_admin: user.isAdmin, password_hash: unusable })
    .returning('*');
  return row as UserRow;
}

export async function emailTaken(trx: Knex.Transaction, email: string): Promise<boolean> {
  return (await trx('users').whereRaw('lower(email) = lower(?)', [email]).first('id')) !== undefined;
}

/** How many enabled administrators other than `exceptId` there are (one must always remain). */
export async function otherActiveAdmins(trx: Knex.Transaction, exceptId: string): Promise<number> {
  const [row] = await trx('users').where({ is_admin: true }).whereNull('disabled_at').whereNot({ id: exceptId }).count({ n: '*' });
  return Number((row as { n: string | number }).n);
}

/** Applies the change; disabling also ends every session of the account. */
export async function updateUser(trx: Knex.Transaction, id: string, change: { isAdmin?: boolean; disabled?: boolean }): Promise<UserRow> {
  const patch: Record<string, unknown> = {};
  if (change.isAdmin !== undefined) patch['is_admin'] = change.isAdmin;
  if (change.disabled !== undefined) patch['disabled_at'] = change.disabled ? trx.fn.now() : null;
  const [row] = await trx('users').where({ id }).update(patch).returning('*');
  if (change.disabled) await trx('sessions').where({ user_id: id }).whereNull('revoked_at').update({ revoked_at: trx.fn.now() });
  return row as UserRow;
}
