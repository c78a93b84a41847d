import { Router } from 'express';
import type { Database } from '../db/database.js';
import { projectDocument } from '../design/project-document.js';
import { requireProjectAction } from '../http/project-access.js';
import { evaluateDocument } from './evaluation.service.js';
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
  router.get('/results', requireProjectAction(db, 'read'), async (req, res) => {
    const document = await projectDocument(db, req.projectAccess!.projectId);
    res.json(await evaluateDocument(db, document));
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
