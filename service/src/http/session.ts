import type { RequestHandler } from 'express';
import { findUserById, toPublicUser, type PublicUser } from '../auth/auth.repository.js';
import { verifySession, type TokenSettings } from '../auth/tokens.js';
import type { Database } from '../db/database.js';
import { AppError } from './app-error.js';

export const sessionCookie = 'allowlight_session';
export const csrfHeader = 'x-csrf-token';

export interface Session {
  user: PublicUser;
  csrf: string;
}

declare module 'express-serve-static-core' {
  interface Request {
    session?: Session;
  }
}

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Reads the session cookie; a valid token for an existing user sets `req.session`. */
export function readSession(db: Database, settings: TokenSettings): RequestHandler {
  return async (req, _res, next) => {
    const token: unknown = req.cookies?.[sessionCookie];
    if (typeof token === 'string' && token.length > 0) {
      const claims = verifySession(settings, token);
      if (claims) {
        const user = await findUserById(db, claims.sub);
        if (user) {
          req.session = { user: await toPublicUser(db, user), csrf: claims.csrf };
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

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!req.session?.user.isAdmin) {
    throw AppError.forbidden('Only an administrator can do this.');
  }
  next();
};

export function currentSession(req: { session?: Session }): Session {
  if (!req.session) {
    throw AppError.unauthorized();
  }
  return req.session;
}
