import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import type { UserRow } from '../db/tables.js';

/** The `sessions.user_agent` column's width; longer headers are cut rather than refused. */
export const userAgentLength = 512;

/** Reads touch `last_seen_at` at most this often, so a busy page costs one write a minute, not one a request. */
const lastSeenResolutionMs = 60_000;

/** Rows this long past their expiry are deleted when their user next signs in, so the table stays small. */
const keepExpiredDays = 30;

export interface NewSession {
  userId: string;
  expiresAt: Date;
  userAgent: string | null;
  address: string | null;
}

export interface ActiveSession {
  id: string;
  createdAt: Date;
  lastSeenAt: Date;
  expiresAt: Date;
  userAgent: string | null;
  address: string | null;
}

/** Stores a new session and audits the sign-in in one transaction; returns the session's id. */
export async function createSession(db: Database, session: NewSession): Promise<string> {
  return db.transaction(async (trx) => {
    await trx('sessions')
      .where({ user_id: session.userId })
      .andWhere('expires_at', '<', trx.raw(`now() - interval '${keepExpiredDays} days'`))
      .delete();
    const [row] = await trx('sessions')
      .insert({
        user_id: session.userId,
        expires_at: session.expiresAt,
        user_agent: session.userAgent?.slice(0, userAgentLength) ?? null,
        address: session.address,
      })
      .returning('id');
    const id = row!.id;
    await recordAudit(trx, {
      userId: session.userId,
      action: 'sign-in',
      entity: 'session',
      entityId: id,
      detail: { address: session.address },
    });
    return id;
  });
}

/** The user behind a session that is neither revoked nor expired; the session's last activity is brought up to date on the way. */
export async function findLiveSessionUser(db: Database, sessionId: string, userId: string): Promise<UserRow | undefined> {
  const row = await db('sessions')
    .join('users', 'users.id', 'sessions.user_id')
    .where('sessions.id', sessionId)
    .where('sessions.user_id', userId)
    .whereNull('sessions.revoked_at')
    .whereNull('users.disabled_at')
    .andWhere('sessions.expires_at', '>', db.fn.now())
    .first<(UserRow & { last_seen_at: Date }) | undefined>('users.*', 'sessions.last_seen_at');
  if (!row) return undefined;
  if (Date.now() - row.last_seen_at.getTime() >= lastSeenResolutionMs) {
    // The condition repeats in SQL so that parallel requests do not all write.
    await db('sessions')
      .where({ id: sessionId })
      .andWhere('last_seen_at', '<', db.raw(`now() - interval '${lastSeenResolutionMs / 1000} seconds'`))
      .update({ last_seen_at: db.fn.now() });
  }
  return row;
}

export async function listActiveSessions(db: Database, userId: string): Promise<ActiveSession[]> {
  const rows = await db('sessions')
    .where({ user_id: userId })
    .whereNull('revoked_at')
    .andWhere('expires_at', '>', db.fn.now())
    .orderBy([
      { column: 'last_seen_at', order: 'desc' },
      { column: 'created_at', order: 'desc' },
    ]);
  return rows.map((row) => ({
    id: row.id,
    createdAt: row.created_at,
    lastSeenAt: row.last_seen_at,
    expiresAt: row.expires_at,
    userAgent: row.user_agent,
    address: row.address,
  }));
}

export type SessionEnd = 'sign-out' | 'end-session';

/** Revokes one live session of the user and audits it; false when there is no such live session. */
export async function revokeSession(db: Database, userId: string, sessionId: string, action: SessionEnd): Promise<boolean> {
  return db.transaction(async (trx) => {
    const revoked = await trx('sessions')
      .where({ id: sessionId, user_id: userId })
      .whereNull('revoked_at')
      .andWhere('expires_at', '>', trx.fn.now())
      .update({ revoked_at: trx.fn.now() });
    if (revoked === 0) return false;
    await recordAudit(trx, { userId, action, entity: 'session', entityId: sessionId });
    return true;
  });
}

/** Revokes every live session of the user but the one named, audits it, and returns how many ended. */
export async function revokeOtherSessions(db: Database, userId: string, keepSessionId: string): Promise<number> {
  return db.transaction(async (trx) => {
    const ended = await trx('sessions')
      .where({ user_id: userId })
      .whereNot({ id: keepSessionId })
      .whereNull('revoked_at')
      .andWhere('expires_at', '>', trx.fn.now())
      .update({ revoked_at: trx.fn.now() }, ['id']);
    if (ended.length > 0) {
      await recordAudit(trx, {
        userId,
        action: 'end-other-sessions',
        entity: 'session',
        entityId: keepSessionId,
        detail: { ended: ended.map((row: { id: string }) => row.id) },
      });
    }
    return ended.length;
  });
}
