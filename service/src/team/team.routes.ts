import { Router } from 'express';
import { z } from 'zod';
import type { Database } from '../db/database.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { isUuid, parse } from '../http/validate.js';
import { AppError } from '../http/app-error.js';
import { textField, textLimits } from '../compliance/bounds.js';
import { listMembers, removeMember, setMember } from './team.repository.js';

const memberSchema = z.object({
  email: textField(textLimits.email, { required: true }).pipe(z.string().email('Enter a valid e-mail address.')),
  role: z.enum(['engineer', 'reviewer', 'contractor']),
});

/** A project's team, under /api/projects/:projectId/members. Members read; engineers and administrators change it. */
export function teamRouter(db: Database): Router {
  const router = Router({ mergeParams: true });
  const read = requireProjectAction('read');
  const manage = requireProjectAction('manage-team');

  router.get('/members', read, async (req, res) => {
    res.json(await listMembers(db, projectAccess(req).projectId));
  });
  router.post('/members', manage, async (req, res) => {
    const { email, role } = parse(memberSchema, req.body);
    res.json(await setMember(db, projectAccess(req).projectId, email, role, currentSession(req).user.id));
  });
  router.delete('/members/:userId', manage, async (req, res) => {
    const memberId = req.params['userId'];
    if (!isUuid(memberId)) throw AppError.notFound('That person is not on this project.');
    res.json(await removeMember(db, projectAccess(req).projectId, memberId, currentSession(req).user.id));
  });
  return router;
}
