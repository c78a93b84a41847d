import { Router } from 'express';
import type { Database } from '../db/database.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { compareProject, evaluateDocument, projectResults } from './evaluation.service.js';
import { openApiDocument } from './openapi.js';

/** `POST /api/evaluate`: stateless, stores nothing. */
export function evaluateRouter(db: Database): Router {
  const router = Router();
  router.post('/', async (req, res) => {
    res.json(await evaluateDocument(db, req.body));
  });
  return router;
}

/** `GET /api/projects/:projectId/results`: the same engine on the stored project. */
export function projectResultsRouter(db: Database): Router {
  const router = Router({ mergeParams: true });
  router.get('/results', requireProjectAction('read'), async (req, res) => {
    res.json(await projectResults(db, projectAccess(req).projectId));
  });
  /** The same design under every other edition the tables hold, side by side with its own. */
  router.get('/comparison', requireProjectAction('read'), async (req, res) => {
    res.json(await compareProject(db, projectAccess(req).projectId));
  });
  return router;
}

/** `GET /api/openapi.json`: the description of the evaluation API. */
export function openApiRouter(): Router {
  const router = Router();
  const description = openApiDocument();
  router.get('/', (_req, res) => {
    res.json(description);
  });
  return router;
}
