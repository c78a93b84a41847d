import bcrypt from 'bcryptjs';
import { Router, type CookieOptions, type Request } from 'express';
import type { RateLimitRequestHandler } from 'express-rate-limit';
import type { Logger } from 'pino';
import { z } from 'zod';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { emailInBody, requestLimiter } from '../http/rate-limit.js';
import { csrfHeader, currentSession, requireSignIn, sessionCookie } from '../http/session.js';
import { parse, uuidPattern } from '../http/validate.js';
import { findUserByEmail } from './auth.repository.js';
import { listActiveSessions, revokeOtherSessions, revokeSession } from './session.repository.js';
import { clientAddress, sessionCookieOptions, startSession } from './start-session.js';

export interface AuthSettings {
  secret: string;
  sessionHours: number;
  cookieSecure: boolean;
  loginRateLimit: number;
  loginRateWindowMinutes: number;
  loginAccountRateLimit: number;
  loginAccountRateWindowMinutes: number;
  /** Where the rate limiter reports a misconfiguration (such as a proxy it was not told to trust). */
  logger: Logger;
}

const loginSchema = z.object({
  email: z.string().trim().email('Enter a valid e-mail address.').max(320),
  password: z.string().min(1, 'Enter your password.').max(200),
});

/** Compared against when the e-mail is unknown, so both failures take the same time. */
const unknownUserHash = bcrypt.hashSync('allowlight-unknown-user', 10);

const wrongCredentials = () => new AppError(401, 'invalid_credentials', 'The e-mail or password is not correct.');

/**
 * A sign-in limiter. Successful sign-ins are handed back, so people who sign in from many tabs or
 * one shared office address are not locked out; only failures use up the allowance.
 */
function signInLimiter(
  name: string,
  limit: number,
  windowMinutes: number,
  logger: Logger,
  keyedBy?: (req: Request) => string | null,
): RateLimitRequestHandler {
  return requestLimiter({
    name,
    limit,
    windowMinutes,
    logger,
    keyedBy,
    countFailuresOnly: true,
    message: 'Too many sign-in attempts. Wait a few minutes and try again.',
  });
}

export function authRouter(db: Database, settings: AuthSettings): Router {
  const router = Router();
  const cookieOptions: CookieOptions = sessionCookieOptions(settings);

  const addressLimiter = signInLimiter('sign-in-address', settings.loginRateLimit, settings.loginRateWindowMinutes, settings.logger);
  // Spreads over many addresses do not get more guesses at one account than a single address would.
  const accountLimiter = signInLimiter(
    'sign-in-account',
    settings.loginAccountRateLimit,
    settings.loginAccountRateWindowMinutes,
    settings.logger,
    emailInBody,
  );

  router.post('/login', addressLimiter, accountLimiter, async (req, res) => {
    const { email, password } = parse(loginSchema, req.body);
    const user = await findUserByEmail(db, email);
    const matches = await bcrypt.compare(password, user?.password_hash ?? unknownUserHash);
    const address = clientAddress(req);
    if (!user || !matches) {
      await recordAudit(db, {
        userId: user?.id ?? null,
        action: 'sign-in-failed',
        entity: 'user',
        entityId: user?.id ?? null,
        detail: { email, address, reason: user ? 'wrong-password' : 'unknown-email' },
      });
      throw wrongCredentials();
    }
    if (user.disabled_at) {
      // Told only to someone who knows the password, so it reveals nothing to a guesser.
      await recordAudit(db, {
        userId: user.id,
        action: 'sign-in-failed',
        entity: 'user',
        entityId: user.id,
        detail: { email, address, reason: 'disabled' },
      });
      throw new AppError(403, 'account_disabled', 'This account is disabled. Ask your administrator to enable it.');
    }
    res.json(await startSession(db, req, res, user, settings));
  });

  router.post('/logout', async (req, res) => {
    if (req.session) {
      if (req.get(csrfHeader) !== req.session.csrf) {
        throw new AppError(403, 'csrf_failed', 'The request is missing a valid X-CSRF-Token header.');
      }
      await revokeSession(db, req.session.user.id, req.session.id, 'sign-out');
    }
    res.clearCookie(sessionCookie, cookieOptions);
    res.status(204).end();
  });

  router.get('/me', requireSignIn, (req, res) => {
    const session = currentSession(req);
    res.json({ user: session.user, csrfToken: session.csrf });
  });

  router.get('/sessions', requireSignIn, async (req, res) => {
    const session = currentSession(req);
    const sessions = await listActiveSessions(db, session.user.id);
    res.json(sessions.map((entry) => ({ ...entry, current: entry.id === session.id })));
  });

  router.post('/sessions/end-others', requireSignIn, async (req, res) => {
    const session = currentSession(req);
    res.json({ ended: await revokeOtherSessions(db, session.user.id, session.id) });
  });

  router.delete('/sessions/:sessionId', requireSignIn, async (req, res) => {
    const session = currentSession(req);
    const sessionId = String(req.params['sessionId']);
    // Someone else's session answers exactly as a missing one does, so ids cannot be probed.
    if (!uuidPattern.test(sessionId) || !(await revokeSession(db, session.user.id, sessionId, 'end-session'))) {
      throw AppError.notFound('No such session.');
    }
    if (sessionId === session.id) {
      res.clearCookie(sessionCookie, cookieOptions);
    }
    res.status(204).end();
  });

  return router;
}
