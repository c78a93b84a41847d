import { createHash, randomBytes } from 'node:crypto';
import type { Knex } from 'knex';
import type { UserRow } from '../db/tables.js';

/** Only the SHA-256 of a reset token is stored: a copy of the table cannot be used to reset anyone. */
export const hashToken = (token: string): string => createHash('sha256').update(token).digest('hex');

/** A new single-use token for the user, good for `minutes`; returns the token itself, for the link (a new account's first password uses the same). */
export async function createPasswordReset(trx: Knex.Transaction, userId: string, minutes: number): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await trx('password_resets').insert({
    user_id: userId,
    token_hash: hashToken(token),
    expires_at: new Date(Date.now() + minutes * 60_000),
  });
  return token;
}

/**
 * Uses up a live token and every other open token of its user, and returns the user; null when the
 * token is unknown, used or out of date (the three are not told apart, so tokens cannot be probed).
 */
export async function consumePasswordReset(trx: Knex.Transaction, token: string): Promise<UserRow | null> {
  const reset: { user_id: string } | undefined = await trx('password_resets')
    .where({ token_hash: hashToken(token) })
    .whereNull('used_at')
    .andWhere('expires_at', '>', trx.fn.now())
    .forUpdate()
    .first('user_id');
  if (!reset) return null;
  await trx('password_resets').where({ user_id: reset.user_id }).whereNull('used_at').update({ used_at: trx.fn.now() });
  const user: UserRow | undefined = await trx('users').where({ id: reset.user_id }).first();
  return user ?? null;
}

/** Sets the password hash and ends the user's sessions but `keepSessionId`; returns the ended ids. */
export async function replacePassword(
  trx: Knex.Transaction,
  userId: string,
  passwordHash: string,
  keepSessionId: string | null,
): Promise<string[]> {
  await trx('users').where({ id: userId }).update({ password_hash: passwordHash });
  const live = trx('sessions').where({ user_id: userId }).whereNull('revoked_at');
  if (keepSessionId) live.whereNot({ id: keepSessionId });
  const ended: { id: string }[] = await live.update({ revoked_at: trx.fn.now() }, ['id']);
  return ended.map((row) => row.id);
}
