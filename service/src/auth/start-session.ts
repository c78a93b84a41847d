import type { CookieOptions, Request, Response } from 'express';
import type { Database } from '../db/database.js';
import type { UserRow } from '../db/tables.js';
import { sessionCookie } from '../http/session.js';
import { toPublicUser, type PublicUser } from './auth.repository.js';
import { createSession } from './session.repository.js';
import { signSession } from './tokens.js';

export interface SessionSettings {
  secret: string;
  sessionHours: number;
  cookieSecure: boolean;
}

export function sessionCookieOptions(settings: Pick<SessionSettings, 'cookieSecure'>): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure: settings.cookieSecure, path: '/' };
}

/** The client's address as Express resolved it, with IPv4 written plainly rather than IPv6-mapped. */
export function clientAddress(req: Request): string | null {
  const address = req.ip;
  if (!address) return null;
  return address.startsWith('::ffff:') && address.includes('.') ? address.slice('::ffff:'.length) : address;
}

/**
 * Signs the person in as the sign-in route does: a stored session, its token in the cookie, and the
 * answer's user and CSRF token. Used by the sign-in and by an accepted invitation.
 */
export async function startSession(
  db: Database,
  req: Request,
  res: Response,
  user: UserRow,
  settings: SessionSettings,
): Promise<{ user: PublicUser; csrfToken: string }> {
  const expiresAt = new Date(Date.now() + settings.sessionHours * 3_600_000);
  const sessionId = await createSession(db, {
    userId: user.id,
    expiresAt,
    userAgent: req.get('user-agent') ?? null,
    address: clientAddress(req),
  });
  const { token, csrf } = signSession(settings.secret, { id: sessionId, userId: user.id, expiresAt });
  res.cookie(sessionCookie, token, { ...sessionCookieOptions(settings), expires: expiresAt });
  return { user: await toPublicUser(db, user), csrfToken: csrf };
}
