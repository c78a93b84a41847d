import { randomBytes } from 'node:crypto';
import jwt from 'jsonwebtoken';

export interface SessionClaims {
  sub: string;
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

export function signSession(settings: TokenSettings, userId: string, csrf = newCsrfToken()): { token: string; csrf: string } {
  const token = jwt.sign({ csrf }, settings.secret, {
    algorithm: 'HS256',
    subject: userId,
    issuer,
    expiresIn: Math.round(settings.sessionHours * 3600),
  });
  return { token, csrf };
}

/** Returns the claims of a valid, unexpired session token, or null. */
export function verifySession(settings: TokenSettings, token: string): SessionClaims | null {
  try {
    const payload = jwt.verify(token, settings.secret, { algorithms: ['HS256'], issuer });
    if (typeof payload === 'string' || typeof payload.sub !== 'string' || typeof payload['csrf'] !== 'string') {
      return null;
    }
    return { sub: payload.sub, csrf: payload['csrf'] };
  } catch {
    return null;
  }
}
