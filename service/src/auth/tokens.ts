import { randomBytes } from 'node:crypto';
import jwt from 'jsonwebtoken';
import { uuidPattern } from '../http/validate.js';

export interface SessionClaims {
  sub: string;
  /** The `jti`: the id of the session row that must still be live for the token to count. */
  sessionId: string;
  csrf: string;
}

export interface TokenSettings {
  secret: string;
  sessionHours: number;
}

const issuer = 'allowlight';

export function newCsrfToken(): string {
  return randomBytes(24).toString('base64url');
}

/** Signs a token for a stored session; its expiry is the row's, so token and row end together. */
export function signSession(
  secret: string,
  session: { id: string; userId: string; expiresAt: Date },
  csrf = newCsrfToken(),
): { token: string; csrf: string } {
  const token = jwt.sign({ csrf, exp: Math.floor(session.expiresAt.getTime() / 1000) }, secret, {
    algorithm: 'HS256',
    subject: session.userId,
    jwtid: session.id,
    issuer,
  });
  return { token, csrf };
}

/**
 * Returns the claims of a valid, unexpired session token, or null. A token without an expiry or a
 * session id is refused even when its signature is good, and ids must be UUIDs so that no lookup
 * can fail inside PostgreSQL.
 */
export function verifySession(secret: string, token: string): SessionClaims | null {
  try {
    const payload = jwt.verify(token, secret, { algorithms: ['HS256'], issuer });
    if (typeof payload === 'string' || typeof payload.exp !== 'number') return null;
    const { sub, jti } = payload;
    const csrf: unknown = payload['csrf'];
    if (
      typeof sub !== 'string' ||
      !uuidPattern.test(sub) ||
      typeof jti !== 'string' ||
      !uuidPattern.test(jti) ||
      typeof csrf !== 'string'
    ) {
      return null;
    }
    return { sub, sessionId: jti, csrf };
  } catch {
    return null;
  }
}
