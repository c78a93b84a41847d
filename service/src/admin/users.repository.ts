import { randomBytes } from 'node:crypto';
import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import type { UserRow } from '../db/tables.js';
import type { AccountChange, AccountView } from '../../../contract/accounts.js';

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

interface AccountChangeRow {
  id: string;
  at: Date;
  action: AccountChange['action'];
  by_id: string | null;
  by_name: string | null;
  account_id: string | null;
  account_name: string | null;
  account_email: string | null;
  project_name: string | null;
  detail: { before?: AccountChange['before']; after?: AccountChange['after'] } | null;
}

/**
 * The changes to accounts, newest first: made by an administrator, administrator or disabled
 * changed, or made by accepting an invitation (whose record names the invitation, and its
 * account through `accepted_user_id`). Sign-ins and passwords are not account changes.
 */
export async function listAccountChanges(db: Database, page: { limit: number; before?: string }): Promise<AccountChange[]> {
  const query = db('audit_log as a')
    // `entity_id` is text, for every kind of entity.
    .leftJoin('invitations as i', (join) => join.on(db.raw(`i.id::text = a.entity_id and a.entity = 'invitation'`)))
    .leftJoin('users as target', (join) => join.on(db.raw('target.id::text = coalesce(i.accepted_user_id::text, a.entity_id)')))
    .leftJoin('users as actor', 'actor.id', 'a.user_id')
    .leftJoin('projects as p', 'p.id', 'a.project_id')
    .where((where) =>
      where
        .where({ 'a.entity': 'user' })
        .whereIn('a.action', ['create', 'update'])
        .orWhere({ 'a.entity': 'invitation', 'a.action': 'accept-invitation' }),
    )
    .orderBy('a.id', 'desc')
    .limit(page.limit)
    .select<AccountChangeRow[]>(
      'a.id',
      'a.at',
      'a.action',
      'actor.id as by_id',
      'actor.name as by_name',
      'target.id as account_id',
      'target.name as account_name',
      'target.email as account_email',
      'p.name as project_name',
      'a.detail',
    );
  if (page.before) query.where('a.id', '<', page.before);
  const rows = await query;
  return rows.map((row) => ({
    id: String(row.id),
    at: row.at.toISOString(),
    action: row.action,
    by: row.by_id ? { id: row.by_id, name: row.by_name ?? '' } : null,
    account: row.account_id ? { id: row.account_id, name: row.account_name ?? '', email: row.account_email ?? '' } : null,
    before: row.detail?.before ?? null,
    after: row.detail?.after ?? null,
    ...(row.action === 'accept-invitation' ? { projectName: row.project_name } : {}),
  }));
}
