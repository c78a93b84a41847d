import bcrypt from 'bcryptjs';
import { Router } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { z } from 'zod';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import type { UserRow } from '../db/tables.js';
import { AppError } from '../http/app-error.js';
import { emailInBody, requestLimiter } from '../http/rate-limit.js';
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

/** Choosing a new password: by a link sent by mail when it is forgotten, or by the signed-in person. */
export function passwordRouter(db: Database, settings: PasswordSettings): Router {
  const router = Router();
  const message = 'Too many requests for a new password. Wait a while and try again.';
  const byAddress = requestLimiter({ name: 'password-reset-address', limit: 10, windowMinutes: 15, message, logger: settings.logger });
  const byAccount = requestLimiter({
    name: 'password-reset-account',
    limit: 3,
    windowMinutes: 60,
    message,
    logger: settings.logger,
    keyedBy: emailInBody,
  });

  /** Stores the new password, ends the sessions but `keepSessionId`, audits it and tells the owner by mail; returns how many sessions ended. */
  async function setNewPassword(
    trx: Knex.Transaction,
    user: UserRow,
    password: string,
    keepSessionId: string | null,
    action: 'password-reset' | 'password-change',
  ): Promise<number> {
    const ended = await replacePassword(trx, user.id, await bcrypt.hash(password, bcryptRounds), keepSessionId);
    await recordAudit(trx, { userId: user.id, action, entity: 'user', entityId: user.id, detail: { endedSessions: ended.length } });
    await queueMail(trx, passwordChangedMail(user.email, user.name, `${settings.appUrl}/sign-in`));
    return ended.length;
  }

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
      await setNewPassword(trx, user, password, null, 'password-reset');
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
    const ended = await db.transaction((trx) => setNewPassword(trx, user, password, session.id, 'password-change'));
    settings.mailQueued();
    res.json({ endedSessions: ended });
  });

  return router;
}
