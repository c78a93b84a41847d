import { Router } from 'express';
import type { Database } from '../db/database.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import type { ProjectChanges } from './project-changes.js';

/**
 * `GET /api/projects/:projectId/events`: a server-sent event stream that says `change` whenever
 * the project's design, set-up or team is written, by anyone, from anywhere. The workspace reads
 * the project again on it; the stream itself carries no design data.
 */
export function liveRouter(db: Database, changes: ProjectChanges): Router {
  const router = Router({ mergeParams: true });
  router.get('/events', requireProjectAction('read'), async (req, res) => {
    await changes.watch(projectAccess(req).projectId, res);
  });
  return router;
}
