import { Router } from 'express';
import { editionIds, type EditionId } from '../compliance/edition-data.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { parse } from '../http/validate.js';
import { createProject, getProjectDetail, listProjectsFor, updateProjectSetup } from './projects.repository.js';
import { projectCreateSchema, projectSetupPatchSchema } from './projects.schema.js';

function assertEdition(edition: string | undefined): void {
  if (edition !== undefined && !editionIds.includes(edition as EditionId)) {
    throw AppError.badRequest('Unknown code edition.', [{ path: 'edition', message: `Choose one of ${editionIds.join(', ')}.` }]);
  }
}

export function projectsRouter(db: Database): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const { user } = currentSession(req);
    res.json(await listProjectsFor(db, user.id, user.isAdmin));
  });

  /** Anyone signed in may start a project; they become its engineer. */
  router.post('/', async (req, res) => {
    const input = parse(projectCreateSchema, req.body);
    assertEdition(input.edition);
    const { user } = currentSession(req);
    const id = await createProject(db, input, user.id);
    res.status(201).json(await getProjectDetail(db, id, 'engineer'));
  });

  router.get('/:projectId', requireProjectAction(db, 'read'), async (req, res) => {
    const access = req.projectAccess!;
    res.json(await getProjectDetail(db, access.projectId, access.role));
  });

  router.patch('/:projectId', requireProjectAction(db, 'edit-design'), async (req, res) => {
    const access = req.projectAccess!;
    const patch = parse(projectSetupPatchSchema, req.body);
    assertEdition(patch.edition);
    if (patch.units !== undefined) {
      const current = await getProjectDetail(db, access.projectId, access.role);
      const hasData = await db('spaces').where({ project_id: access.projectId }).first('id');
      if (patch.units !== current.units && hasData) {
        throw AppError.conflict('The units cannot change once spaces are entered: every stored length and area is in the units it was entered in.', [
          { path: 'units', message: `This project is in ${current.units.toUpperCase()} units.` },
        ]);
      }
    }
    await updateProjectSetup(db, access.projectId, patch, currentSession(req).user.id);
    res.json(await getProjectDetail(db, access.projectId, access.role));
  });

  return router;
}
