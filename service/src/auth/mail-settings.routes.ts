import { Router } from 'express';
import { z } from 'zod';
import type { MailSettingsView } from '../../../contract/accounts.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { currentSession } from '../http/session.js';
import { parse } from '../http/validate.js';
import { findMailSettings, saveMailSettings } from './auth.repository.js';

const settingsSchema = z.object({ reviewDigest: z.boolean({ message: 'Say yes or no: true or false.' }) }).strict();

/** The signed-in person's own choice of optional mail: `GET` and `PATCH /api/auth/mail-settings`. */
export function mailSettingsRouter(db: Database): Router {
  const router = Router();

  router.get('/mail-settings', async (req, res) => {
    const settings = await findMailSettings(db, currentSession(req).user.id);
    if (!settings) throw AppError.unauthorized();
    res.json(settings satisfies MailSettingsView);
  });

  router.patch('/mail-settings', async (req, res) => {
    const { reviewDigest } = parse(settingsSchema, req.body);
    const { user } = currentSession(req);
    if (!(await saveMailSettings(db, user.id, reviewDigest))) throw AppError.unauthorized();
    res.json({ reviewDigest } satisfies MailSettingsView);
  });

  return router;
}
