import { Router } from 'express';
import type { Database } from '../db/database.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { idParam, parse } from '../http/validate.js';
import { bulkSchema, replySchema, verdictSchema } from './review.schema.js';
import { confirmInBulk, listReviewItems, recordVerdict, replyToItem, reviewDesk } from './review-items.repository.js';

/**
 * The reviewer's check items of a project, under /api/projects/:projectId: the members read them,
 * the reviewer records verdicts (only in review), and the engineer and reviewer reply in an item's
 * thread in any state once the design was submitted.
 */
export function reviewItemsRouter(db: Database): Router {
  const router = Router({ mergeParams: true });

  router.get('/review-items', requireProjectAction('read'), async (req, res) => {
    res.json(await listReviewItems(db, projectAccess(req).projectId));
  });

  router.post('/review-items/bulk', requireProjectAction('review'), async (req, res) => {
    const input = parse(bulkSchema, req.body);
    const { projectId, role } = projectAccess(req);
    res.json(await confirmInBulk(db, projectId, input.confirm, { userId: currentSession(req).user.id, role }));
  });

  router.patch('/review-items/:itemId', requireProjectAction('review'), async (req, res) => {
    const itemId = idParam(req.params['itemId'], 'That check item');
    const input = parse(verdictSchema, req.body);
    const { projectId, role } = projectAccess(req);
    const comment = input.comment ? input.comment : undefined;
    res.json(
      await recordVerdict(db, projectId, itemId, { verdict: input.verdict, comment }, { userId: currentSession(req).user.id, role }),
    );
  });

  router.post('/review-items/:itemId/replies', requireProjectAction('discuss-review'), async (req, res) => {
    const itemId = idParam(req.params['itemId'], 'That check item');
    const input = parse(replySchema, req.body);
    const { projectId, role } = projectAccess(req);
    res.status(201).json(await replyToItem(db, projectId, itemId, input.text, { userId: currentSession(req).user.id, role }));
  });

  return router;
}

/** `GET /api/review-desk`: the signed-in reviewer's projects with their open counts. */
export function reviewDeskRouter(db: Database): Router {
  const router = Router();
  router.get('/', async (req, res) => {
    const { user } = currentSession(req);
    res.json(await reviewDesk(db, user.id, user.isAdmin));
  });
  return router;
}
