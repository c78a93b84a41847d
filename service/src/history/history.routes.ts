import { Router } from 'express';
import { z } from 'zod';
import type { Database } from '../db/database.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { isUuid, parse } from '../http/validate.js';
import { historyPeople, listHistory } from './history.repository.js';

const uuid = z.string().refine(isUuid, 'Not an id.');

const historyQuerySchema = z.object({
  spaceId: uuid.optional(),
  userId: uuid.optional(),
  since: z
    .union([z.iso.datetime({ offset: true }), z.iso.date()], { message: 'Give a date (2026-12-01) or a date and time with its offset.' })
    .optional(),
  before: z
    .string()
    .regex(/^\d{1,18}$/, 'Not a history entry.')
    .optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});

/** `GET /api/projects/:projectId/history`: who changed what and when, newest first. Members read. */
export function historyRouter(db: Database): Router {
  const router = Router({ mergeParams: true });
  router.get('/history', requireProjectAction('read'), async (req, res) => {
    const projectId = projectAccess(req).projectId;
    const filter = parse(historyQuerySchema, req.query);
    const [page, people] = await Promise.all([listHistory(db, projectId, filter), historyPeople(db, projectId)]);
    res.json({ ...page, people });
  });
  return router;
}
