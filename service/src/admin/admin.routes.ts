import { Router, type RequestHandler } from 'express';
import { z } from 'zod';
import { recordAudit } from '../audit/audit.repository.js';
import { createPasswordReset } from '../auth/password.repository.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { currentSession } from '../http/session.js';
import { parse, uuidPattern } from '../http/validate.js';
import { accountCreatedMail } from '../mail/messages.js';
import { findOutboxMessage, listOutbox, queueMail } from '../mail/outbox.repository.js';
import {
  createUser,
  emailTaken,
  findUserForUpdate,
  listAccountChanges,
  listUsers,
  otherActiveAdmins,
  updateUser,
} from './users.repository.js';

export interface AdminSettings {
  appUrl: string;
  mailQueued: () => void;
}

const adminsOnly: RequestHandler = (req, _res, next) => {
  if (!currentSession(req).user.isAdmin) throw AppError.forbidden('Only an administrator can see this.');
  next();
};

const outboxListLimit = 200;
/** How long a new account's link to choose its first password works. */
const newAccountLinkDays = 7;

const newUserSchema = z.object({
  email: z.string().trim().email('Enter a valid e-mail address.').max(320),
  name: z.string().trim().min(1, 'Enter the name.').max(200),
  isAdmin: z.boolean().default(false),
});
const userChangeSchema = z
  .object({ isAdmin: z.boolean().optional(), disabled: z.boolean().optional() })
  .strict()
  .refine((change) => change.isAdmin !== undefined || change.disabled !== undefined, 'Say what changes: administrator, disabled, or both.');

const auditQuerySchema = z
  .object({
    limit: z.coerce.number().int().min(1).max(500).default(100),
    // Audit ids are a bigint sequence.
    before: z
      .string()
      .regex(/^\d{1,18}$/, 'Send the id of the last change listed.')
      .optional(),
  })
  .strict();

/**
 * A link that acts for its recipient (a password reset) is not for the administrator's eyes: it
 * would let whoever reads the outbox take over the account. The rest of the message is shown.
 */
function withoutTokens(text: string): string {
  return text.replace(/([?&]token=)[\w-]+/g, '$1(hidden)');
}

function userId(raw: unknown): string {
  const id = String(raw);
  if (!uuidPattern.test(id)) throw AppError.notFound('No such person.');
  return id;
}

/** The administrator's views: the people with accounts, and the outbox of the app's mail. */
export function adminRouter(db: Database, settings: AdminSettings): Router {
  const router = Router();
  router.use(adminsOnly);

  router.get('/users', async (_req, res) => {
    res.json(await listUsers(db));
  });

  router.post('/users', async (req, res) => {
    const admin = currentSession(req).user;
    const input = parse(newUserSchema, req.body);
    const created = await db.transaction(async (trx) => {
      if (await emailTaken(trx, input.email)) {
        throw new AppError(409, 'email_taken', 'Someone already has an account with this e-mail address.', [
          { path: 'email', message: 'Already has an account.' },
        ]);
      }
      const user = await createUser(trx, input);
      const token = await createPasswordReset(trx, user.id, newAccountLinkDays * 24 * 60);
      await queueMail(
        trx,
        accountCreatedMail(user.email, user.name, `${settings.appUrl}/reset-password?token=${token}`, newAccountLinkDays),
      );
      await recordAudit(trx, {
        userId: admin.id,
        action: 'create',
        entity: 'user',
        entityId: user.id,
        detail: { name: user.name, after: { email: user.email, isAdmin: user.is_admin } },
      });
      return user;
    });
    settings.mailQueued();
    res.status(201).json({
      id: created.id,
      email: created.email,
      name: created.name,
      isAdmin: created.is_admin,
      disabled: false,
      createdAt: created.created_at.toISOString(),
    });
  });

  router.patch('/users/:userId', async (req, res) => {
    const admin = currentSession(req).user;
    const id = userId(req.params['userId']);
    const change = parse(userChangeSchema, req.body);
    const updated = await db.transaction(async (trx) => {
      const before = await findUserForUpdate(trx, id);
      if (!before) throw AppError.notFound('No such person.');
      const losesAdmin = (change.isAdmin === false && before.is_admin) || (change.disabled === true && before.is_admin);
      if (id === admin.id && (change.disabled === true || change.isAdmin === false)) {
        throw AppError.conflict('You cannot disable your own account or give up your own administrator role: ask another administrator.');
      }
      if (losesAdmin && (await otherActiveAdmins(trx, id)) === 0) {
        throw AppError.conflict('At least one enabled administrator must remain.');
      }
      const after = await updateUser(trx, id, change);
      await recordAudit(trx, {
        userId: admin.id,
        action: 'update',
        entity: 'user',
        entityId: id,
        detail: {
          name: after.name,
          before: { isAdmin: before.is_admin, disabled: before.disabled_at !== null },
          after: { isAdmin: after.is_admin, disabled: after.disabled_at !== null },
        },
      });
      return after;
    });
    res.json({
      id: updated.id,
      email: updated.email,
      name: updated.name,
      isAdmin: updated.is_admin,
      disabled: updated.disabled_at !== null,
      createdAt: updated.created_at.toISOString(),
    });
  });

  router.get('/audit', async (req, res) => {
    const page = parse(auditQuerySchema, req.query);
    res.json(await listAccountChanges(db, page));
  });

  router.get('/outbox', async (_req, res) => {
    res.json(await listOutbox(db, outboxListLimit));
  });

  router.get('/outbox/:messageId', async (req, res) => {
    const id = String(req.params['messageId']);
    const message = uuidPattern.test(id) ? await findOutboxMessage(db, id) : null;
    if (!message) throw AppError.notFound('No such message.');
    res.json({ ...message, text: withoutTokens(message.text), html: withoutTokens(message.html) });
  });

  return router;
}
