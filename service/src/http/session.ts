import type { RequestHandler } from 'express';
import { toPublicUser, type PublicUser } from '../auth/auth.repository.js';
import { findLiveSessionUser } from '../auth/session.repository.js';
import { verifySession } from '../auth/tokens.js';
import type { Database } from '../db/database.js';
import { AppError } from './app-error.js';

export const sessionCookie = 'allowlight_session';
export const csrfHeader = 'x-csrf-token';

export interface Session {
  /** The id of the stored session the cookie's token names. */
  id: string;
  user: PublicUser;
  csrf: string;
}

declare module 'express-serve-static-core' {
  interface Request {
    session?: Session;
  }
}

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Reads the session cookie. `req.session` is set only for a well-signed token whose stored session
 * is still live: a signature alone does not outlast a sign-out.
 */
export function readSession(db: Database, secret: string): RequestHandler {
  return async (req, _res, next) => {
    const token: unknown = req.cookies?.[sessionCookie];
    if (typeof token === 'string' && token.length > 0) {
      const claims = verifySession(secret, token);
      if (claims) {
        const user = await findLiveSessionUser(db, claims.sessionId, claims.sub);
        if (user) {
          req.session = { id: claims.sessionId, user: await toPublicUser(db, user), csrf: claims.csrf };
        }
      }
    }
    next();
  };
}

/** Refuses requests without a session; for unsafe methods also requires the CSRF header. */
export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.session) {
    throw AppError.unauthorized();
  }
  if (!safeMethods.has(req.method) && req.get(csrfHeader) !== req.session.csrf) {
    throw new AppError(403, 'csrf_failed', 'The request is missing a valid X-CSRF-Token header.');
  }
  next();
};

export function currentSession(req: { session?: Session }): Session {
  if (!req.session) {
    throw AppError.unauthorized();
  }
  return req.session;
}
