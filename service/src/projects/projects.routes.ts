import { Router } from 'express';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { getProjectSummary, listProjectsFor } from './projects.repository.js';

export function projectsRouter(db: Database): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const { user } = currentSession(req);
    res.json(await listProjectsFor(db, user.id, user.isAdmin));
  });

  router.get('/:projectId', requireProjectAction(db, 'read'), async (req, res) => {
    const access = req.projectAccess!;
    const project = await getProjectSummary(db, access.projectId, access.role);
    if (!project) throw AppError.notFound('No such project.');
    res.json(project);
  });

  return router;
}
