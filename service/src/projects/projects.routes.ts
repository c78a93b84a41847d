import { Router } from 'express';
import { z } from 'zod';
import type { Knex } from 'knex';
import { loadEditionData } from '../code-tables/code-tables.repository.js';
import { editionIds, type EditionId } from '../compliance/edition-data.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { parse } from '../http/validate.js';
import { keepVerdict } from '../evaluation/evaluation.service.js';
import { refreshFieldTestSummary } from '../field-tests/field-tests.routes.js';
import {
  copyProject,
  createProject,
  getProjectDetail,
  listProjectsFor,
  setProjectArchived,
  updateProjectSetup,
} from './projects.repository.js';
import { projectCreateSchema, projectSetupPatchSchema } from './projects.schema.js';
import { convertProjectUnits } from './unit-conversion.repository.js';

function assertEdition(edition: string | undefined): void {
  if (edition !== undefined && !editionIds.includes(edition as EditionId)) {
    throw AppError.badRequest('Unknown code edition.', [{ path: 'edition', message: `Choose one of ${editionIds.join(', ')}.` }]);
  }
}

/** The amendments chosen must be the edition's own. */
async function assertAmendments(db: Database, edition: string | null | undefined, amendments: string[] | undefined): Promise<void> {
  if (!amendments?.length) return;
  const data = edition ? await loadEditionData(db, edition) : undefined;
  const known = new Set((data?.amendments ?? []).map((amendment) => amendment.key));
  const details = amendments.flatMap((key, index) =>
    known.has(key) ? [] : [{ path: `amendments.${index}`, message: 'Not an amendment of the project’s code edition.' }],
  );
  if (details.length) throw AppError.badRequest('Some amendments do not belong to the project’s code edition.', details);
}

const listQuerySchema = z.object({ archived: z.enum(['true', 'false']).optional() });
const copySchema = z.object({ name: projectCreateSchema.shape.name });

export function projectsRouter(db: Database): Router {
  const router = Router();

  router.get('/', async (req, res) => {
    const { user } = currentSession(req);
    const { archived } = parse(listQuerySchema, req.query);
    res.json(await listProjectsFor(db, user.id, user.isAdmin, archived === 'true'));
  });

  /** Anyone signed in may start a project; they become its engineer. */
  router.post('/', async (req, res) => {
    const input = parse(projectCreateSchema, req.body);
    assertEdition(input.edition);
    await assertAmendments(db, input.edition, input.amendments);
    const { user } = currentSession(req);
    const id = await createProject(db, input, user.id);
    await keepVerdict(db, id, req.log);
    res.status(201).json(await getProjectDetail(db, id, 'engineer'));
  });

  router.get('/:projectId', requireProjectAction('read'), async (req, res) => {
    const access = projectAccess(req);
    await refreshFieldTestSummary(db, access.projectId);
    res.json(await getProjectDetail(db, access.projectId, access.role));
  });

  router.patch('/:projectId', requireProjectAction('edit-design'), async (req, res) => {
    const access = projectAccess(req);
    const patch = parse(projectSetupPatchSchema, req.body);
    assertEdition(patch.edition);
    const current = await getProjectDetail(db, access.projectId, access.role);
    // A change of edition drops amendments of the old one unless new ones are chosen with it.
    if (patch.edition !== undefined && patch.edition !== current.edition && patch.amendments === undefined) patch.amendments = [];
    await assertAmendments(db, patch.edition ?? current.edition, patch.amendments);
    const to = patch.units;
    // A change of units converts every stored length and area with it, in the same transaction.
    let convert: ((trx: Knex.Transaction) => Promise<Record<string, unknown>>) | undefined;
    if (to !== undefined && to !== current.units) {
      const editionId = patch.edition ?? current.edition;
      const edition = editionId ? await loadEditionData(db, editionId) : undefined;
      const exteriorUnits = new Map((edition?.exteriorApplications ?? []).map((application) => [application.key, application.unit]));
      const userId = currentSession(req).user.id;
      convert = async (trx) => ({ ...(await convertProjectUnits(trx, access.projectId, current.units, to, exteriorUnits, userId)) });
    }
    await updateProjectSetup(db, access.projectId, patch, currentSession(req).user.id, convert);
    await keepVerdict(db, access.projectId, req.log);
    res.json(await getProjectDetail(db, access.projectId, access.role));
  });

  /** Anyone who may read a project may copy it; the copy is theirs, as its engineer. */
  router.post('/:projectId/copy', requireProjectAction('read'), async (req, res) => {
    const { name } = parse(copySchema, req.body);
    const id = await copyProject(db, projectAccess(req).projectId, name, currentSession(req).user.id);
    await keepVerdict(db, id, req.log);
    res.status(201).json(await getProjectDetail(db, id, 'engineer'));
  });

  /** Archiving keeps everything and makes the project read-only; unarchiving brings it back. */
  for (const [path, archived] of [
    ['archive', true],
    ['unarchive', false],
  ] as const) {
    router.post(`/:projectId/${path}`, requireProjectAction('archive'), async (req, res) => {
      const access = projectAccess(req);
      await setProjectArchived(db, access.projectId, archived, currentSession(req).user.id);
      res.json(await getProjectDetail(db, access.projectId, access.role));
    });
  }

  return router;
}
