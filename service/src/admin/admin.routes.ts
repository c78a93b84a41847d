import { Router, type RequestHandler } from 'express';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { currentSession } from '../http/session.js';
import { uuidPattern } from '../http/validate.js';
import { findOutboxMessage, listOutbox } from '../mail/outbox.repository.js';

const adminsOnly: RequestHandler = (req, _res, next) => {
  if (!currentSession(req).user.isAdmin) throw AppError.forbidden('Only an administrator can see this.');
  next();
};

const outboxListLimit = 200;

/**
 * A link that acts for its recipient (a password reset) is not for the administrator's eyes: it
 * would let whoever reads the outbox take over the account. The rest of the message is shown.
 */
function withoutTokens(text: string): string {
  return text.replace(/([?&]token=)[\w-]+/g, '$1(hidden)');
}

/** The administrator's views. The outbox: every message the app queued, its state and its text. */
export function adminRouter(db: Database): Router {
  const router = Router();
  router.use(adminsOnly);

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
