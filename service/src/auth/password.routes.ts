import bcrypt from 'bcryptjs';
import { Router, type NextFunction, type Request, type Response } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Logger } from 'pino';
import { z } from 'zod';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import type { UserRow } from '../db/tables.js';
import { AppError } from '../http/app-error.js';
import { currentSession, requireSignIn } from '../http/session.js';
import { parse } from '../http/validate.js';
import { passwordChangedMail, passwordResetMail } from '../mail/messages.js';
import { queueMail } from '../mail/outbox.repository.js';
import { findUserByEmail, findUserById } from './auth.repository.js';
import { passwordProblem } from './password-rules.js';
import { consumePasswordReset, createPasswordReset, replacePassword } from './password.repository.js';

export interface PasswordSettings {
  appUrl: string;
  resetMinutes: number;
  /** Told when a message was queued, so it goes out at once rather than at the next poll. */
  mailQueued: () => void;
  logger: Logger;
}

const bcryptRounds = 12;
const email = z.string().trim().email('Enter a valid e-mail address.').max(320);
const newPassword = z.string().min(1, 'Enter the new password.').max(200, 'Use at most 64 characters.');
const resetRequestSchema = z.object({ email });
const resetCompleteSchema = z.object({ token: z.string().min(1, 'The link is incomplete.').max(200), password: newPassword });
const changeSchema = z.object({ currentPassword: z.string().min(1, 'Enter your current password.').max(200), newPassword });

const invalidToken = () =>
  new AppError(
    400,
    'invalid_token',
    'This link to choose a new password has expired or was already used. Ask for a new one from the sign-in page.',
  );

function refuseWeak(password: string, user: UserRow, field: string): void {
  const problem = passwordProblem(password, [user.email, user.name]);
  if (problem) throw AppError.badRequest(problem, [{ path: field, message: problem }]);
}

function limiter(name: string, limit: number, windowMinutes: number, logger: Logger, keyedBy?: (req: Request) => string | null) {
  return rateLimit({
    identifier: name,
    windowMs: windowMinutes * 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    logger,
    ...(keyedBy ? { keyGenerator: (req: Request) => keyedBy(req) ?? '', skip: (req: Request) => keyedBy(req) === null } : {}),
    // Answered by the error handler, so the refusal has the same shape as every other error.
    handler: (_req: Request, _res: Response, next: NextFunction) => {
      next(new AppError(429, 'rate_limited', 'Too many requests for a new password. Wait a while and try again.'));
    },
  });
}

const requestedEmail = (req: Request): string | null => {
  const value: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof value === 'string' && value.trim() ? value.trim().toLowerCase() : null;
};

/** Choosing a new password: by a link sent by mail when it is forgotten, or by the signed-in person. */
export function passwordRouter(db: Database, settings: PasswordSettings): Router {
  const router = Router();
  const byAddress = limiter('password-reset-address', 10, 15, settings.logger);
  const byAccount = limiter('password-reset-account', 3, 60, settings.logger, requestedEmail);

  // The same answer whether or not the address has an account, so it cannot be used to find them.
  router.post('/password-reset', byAddress, byAccount, async (req, res) => {
    const { email: address } = parse(resetRequestSchema, req.body);
    const user = await findUserByEmail(db, address);
    if (user && !user.disabled_at) {
      await db.transaction(async (trx) => {
        const token = await createPasswordReset(trx, user.id, settings.resetMinutes);
        await queueMail(
          trx,
          passwordResetMail(user.email, user.name, `${settings.appUrl}/reset-password?token=${token}`, settings.resetMinutes),
        );
        await recordAudit(trx, { userId: user.id, action: 'password-reset-requested', entity: 'user', entityId: user.id });
      });
      settings.mailQueued();
    }
    res.status(202).json({ message: 'If the address has an account, a link to choose a new password is on its way.' });
  });

  router.post('/password-reset/complete', async (req, res) => {
    const { token, password } = parse(resetCompleteSchema, req.body);
    await db.transaction(async (trx) => {
      const user = await consumePasswordReset(trx, token);
      if (!user) throw invalidToken();
      refuseWeak(password, user, 'password');
      const ended = await replacePassword(trx, user.id, await bcrypt.hash(password, bcryptRounds), null);
      await recordAudit(trx, {
        userId: user.id,
        action: 'password-reset',
        entity: 'user',
        entityId: user.id,
        detail: { endedSessions: ended.length },
      });
      await queueMail(trx, passwordChangedMail(user.email, user.name, `${settings.appUrl}/sign-in`));
    });
    settings.mailQueued();
    res.status(204).end();
  });

  router.post('/password', requireSignIn, async (req, res) => {
    const session = currentSession(req);
    const { currentPassword, newPassword: password } = parse(changeSchema, req.body);
    const user = await findUserById(db, session.user.id);
    if (!user) throw AppError.unauthorized();
    if (!(await bcrypt.compare(currentPassword, user.password_hash))) {
      const message = 'The current password is not correct.';
      throw AppError.badRequest(message, [{ path: 'currentPassword', message }]);
    }
    refuseWeak(password, user, 'newPassword');
    const hash = await bcrypt.hash(password, bcryptRounds);
    const ended = await db.transaction(async (trx) => {
      const ids = await replacePassword(trx, user.id, hash, session.id);
      await recordAudit(trx, {
        userId: user.id,
        action: 'password-change',
        entity: 'user',
        entityId: user.id,
        detail: { endedSessions: ids.length },
      });
      await queueMail(trx, passwordChangedMail(user.email, user.name, `${settings.appUrl}/sign-in`));
      return ids.length;
    });
    settings.mailQueued();
    res.json({ endedSessions: ended });
  });

  return router;
}
