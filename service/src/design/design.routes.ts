import { Router, type Request } from 'express';
import { AppError } from '../http/app-error.js';
import type { Database } from '../db/database.js';
import type { FileStorage } from '../package/storage.js';
import { projectAccess, requireProjectAction } from '../http/project-access.js';
import { currentSession } from '../http/session.js';
import { idParam, parse } from '../http/validate.js';
import {
  createExteriorApplication,
  createLuminaireType,
  createSpaces,
  deleteExteriorApplication,
  deleteLuminaireType,
  deleteSpace,
  getSpace,
  listExteriorApplications,
  listLuminaireTypes,
  listSpaces,
  replaceExteriorApplication,
  replaceLuminaireType,
  replaceSpace,
  requestDigest,
  restoreDeleted,
  setControlOnSpaces,
  type ImportKey,
} from './design.repository.js';
import {
  bulkSpacesSchema,
  exteriorApplicationInputSchema,
  allowanceClaimInputSchema,
  allowanceClaimWriteSchema,
  exteriorApplicationWriteSchema,
  importAliasesSchema,
  spaceControlsSchema,
  luminaireTypeInputSchema,
  luminaireTypeWriteSchema,
  spaceInputSchema,
  spacePatchSchema,
  spaceWriteSchema,
  versionQuerySchema,
} from './design.schema.js';
import {
  createAllowanceClaim,
  deleteAllowanceClaim,
  listAllowanceClaims,
  replaceAllowanceClaim,
  restoreAllowanceClaim,
} from './allowance-claims.repository.js';
import { listImportAliases, saveImportAliases } from './import-aliases.repository.js';
import { keepVerdict } from '../evaluation/evaluation.service.js';
import { projectDocument } from './project-document.js';
import {
  assertAliasesFitEdition,
  assertAllowanceFitsEdition,
  assertControlFitsEdition,
  assertExteriorApplicationFitsEdition,
  assertSpacesFitEdition,
  exteriorUnitsOf,
} from './edition-checks.js';

/** The design data of one project, mounted under /api/projects/:projectId. Engineers write; members read. */
export function designRouter(db: Database, storage: FileStorage): Router {
  const router = Router({ mergeParams: true });
  const read = requireProjectAction('read');
  const edit = requireProjectAction('edit-design');
  const projectId = (req: Request) => projectAccess(req).projectId;
  const userId = (req: Parameters<typeof currentSession>[0]) => currentSession(req).user.id;
  /** After a write to the design, once committed: the project list's verdict for the design as it now is. */
  const changed = async <Written>(req: Request, written: Written): Promise<Written> => {
    await keepVerdict(db, projectId(req), req.log);
    return written;
  };

  router.get('/document', read, async (req, res) => {
    res.json(await projectDocument(db, projectId(req)));
  });

  router.get('/luminaire-types', read, async (req, res) => {
    res.json(await listLuminaireTypes(db, projectId(req)));
  });
  router.post('/luminaire-types', edit, async (req, res) => {
    res
      .status(201)
      .json(await changed(req, await createLuminaireType(db, projectId(req), parse(luminaireTypeInputSchema, req.body), userId(req))));
  });
  router.put('/luminaire-types/:typeId', edit, async (req, res) => {
    const { version, ...input } = parse(luminaireTypeWriteSchema, req.body);
    res.json(
      await changed(
        req,
        await replaceLuminaireType(db, projectId(req), idParam(req.params['typeId'], 'This luminaire type'), version, input, userId(req)),
      ),
    );
  });
  router.delete('/luminaire-types/:typeId', edit, async (req, res) => {
    const { version } = parse(versionQuerySchema, req.query);
    const { cutSheetKey } = await changed(
      req,
      await deleteLuminaireType(db, projectId(req), idParam(req.params['typeId'], 'This luminaire type'), version, userId(req)),
    );
    // No row names the cut sheet's file any longer: it goes, as far as the store lets it.
    if (cutSheetKey) await storage.remove(cutSheetKey).catch(() => undefined);
    res.status(204).end();
  });

  router.get('/spaces', read, async (req, res) => {
    res.json(await listSpaces(db, projectId(req)));
  });
  router.post('/spaces', edit, async (req, res) => {
    const input = parse(spaceInputSchema, req.body);
    await assertSpacesFitEdition(db, projectId(req), [input], true);
    const [space] = await changed(req, await createSpaces(db, projectId(req), [input], userId(req)));
    res.status(201).json(space);
  });
  router.post('/spaces/bulk', edit, async (req, res) => {
    const { spaces, luminaireTypes } = parse(bulkSpacesSchema, req.body);
    await assertSpacesFitEdition(db, projectId(req), spaces, false, luminaireTypes);
    res.status(201).json(await changed(req, await createSpaces(db, projectId(req), spaces, userId(req), importKey(req), luminaireTypes)));
  });
  router.post('/spaces/controls', edit, async (req, res) => {
    const { spaces, control } = parse(spaceControlsSchema, req.body);
    await assertControlFitsEdition(db, projectId(req), control);
    res.json(await changed(req, await setControlOnSpaces(db, projectId(req), spaces, control, userId(req))));
  });
  router.get('/import-aliases', read, async (req, res) => {
    res.json(await listImportAliases(db, projectId(req)));
  });
  router.put('/import-aliases', edit, async (req, res) => {
    const { aliases } = parse(importAliasesSchema, req.body);
    await assertAliasesFitEdition(db, projectId(req), aliases);
    res.json(await saveImportAliases(db, projectId(req), aliases, userId(req)));
  });
  router.get('/spaces/:spaceId', read, async (req, res) => {
    res.json(await getSpace(db, projectId(req), idParam(req.params['spaceId'], 'This space')));
  });
  router.put('/spaces/:spaceId', edit, async (req, res) => {
    const { version, ...input } = parse(spaceWriteSchema, req.body);
    await assertSpacesFitEdition(db, projectId(req), [input], true);
    res.json(
      await changed(req, await replaceSpace(db, projectId(req), idParam(req.params['spaceId'], 'This space'), version, input, userId(req))),
    );
  });
  router.patch('/spaces/:spaceId', edit, async (req, res) => {
    // Only the fields the body names change; the rest (children included) stay as stored.
    const { version } = parse(spacePatchSchema, req.body);
    const current = await getSpace(db, projectId(req), idParam(req.params['spaceId'], 'This space'));
    const { id: _id, position: _position, version: _version, updatedAt: _at, updatedBy: _by, ...stored } = current;
    const named = Object.fromEntries(
      Object.entries(req.body as Record<string, unknown>).filter(([field]) => field in spaceInputSchema.shape),
    );
    const merged = parse(spaceInputSchema, {
      ...stored,
      luminaires: stored.luminaires.map(({ luminaireTypeId: _type, ...group }) => group),
      ...named,
    });
    await assertSpacesFitEdition(db, projectId(req), [merged], true);
    res.json(await changed(req, await replaceSpace(db, projectId(req), current.id, version, merged, userId(req))));
  });
  router.delete('/spaces/:spaceId', edit, async (req, res) => {
    const { version } = parse(versionQuerySchema, req.query);
    await changed(req, await deleteSpace(db, projectId(req), idParam(req.params['spaceId'], 'This space'), version, userId(req)));
    res.status(204).end();
  });

  router.get('/exterior-applications', read, async (req, res) => {
    res.json(await listExteriorApplications(db, projectId(req)));
  });
  router.post('/exterior-applications', edit, async (req, res) => {
    const input = parse(exteriorApplicationInputSchema, req.body);
    await assertExteriorApplicationFitsEdition(db, projectId(req), input);
    res.status(201).json(await changed(req, await createExteriorApplication(db, projectId(req), input, userId(req))));
  });
  router.put('/exterior-applications/:applicationId', edit, async (req, res) => {
    const { version, ...input } = parse(exteriorApplicationWriteSchema, req.body);
    await assertExteriorApplicationFitsEdition(db, projectId(req), input);
    res.json(
      await changed(
        req,
        await replaceExteriorApplication(
          db,
          projectId(req),
          idParam(req.params['applicationId'], 'This exterior application'),
          version,
          input,
          userId(req),
        ),
      ),
    );
  });
  router.delete('/exterior-applications/:applicationId', edit, async (req, res) => {
    const { version } = parse(versionQuerySchema, req.query);
    await changed(
      req,
      await deleteExteriorApplication(
        db,
        projectId(req),
        idParam(req.params['applicationId'], 'This exterior application'),
        version,
        userId(req),
      ),
    );
    res.status(204).end();
  });

  router.get('/additional-allowances', read, async (req, res) => {
    res.json(await listAllowanceClaims(db, projectId(req)));
  });
  router.post('/additional-allowances', edit, async (req, res) => {
    const input = parse(allowanceClaimInputSchema, req.body);
    await assertAllowanceFitsEdition(db, projectId(req), input);
    res.status(201).json(await changed(req, await createAllowanceClaim(db, projectId(req), input, userId(req))));
  });
  router.put('/additional-allowances/:claimId', edit, async (req, res) => {
    const { version, ...input } = parse(allowanceClaimWriteSchema, req.body);
    await assertAllowanceFitsEdition(db, projectId(req), input);
    res.json(
      await changed(
        req,
        await replaceAllowanceClaim(db, projectId(req), idParam(req.params['claimId'], 'This claim'), version, input, userId(req)),
      ),
    );
  });
  router.delete('/additional-allowances/:claimId', edit, async (req, res) => {
    const { version } = parse(versionQuerySchema, req.query);
    await changed(req, await deleteAllowanceClaim(db, projectId(req), idParam(req.params['claimId'], 'This claim'), version, userId(req)));
    res.status(204).end();
  });

  // Undo of a delete, from the snackbar or the History page: the thing comes back with its id.
  router.post('/spaces/:spaceId/restore', edit, async (req, res) => {
    res
      .status(201)
      .json(
        await changed(req, await restoreDeleted(db, projectId(req), 'space', idParam(req.params['spaceId'], 'This space'), userId(req))),
      );
  });
  router.post('/luminaire-types/:typeId/restore', edit, async (req, res) => {
    res
      .status(201)
      .json(
        await changed(
          req,
          await restoreDeleted(db, projectId(req), 'luminaire-type', idParam(req.params['typeId'], 'This luminaire type'), userId(req)),
        ),
      );
  });
  router.post('/exterior-applications/:applicationId/restore', edit, async (req, res) => {
    res
      .status(201)
      .json(
        await changed(
          req,
          await restoreDeleted(
            db,
            projectId(req),
            'exterior-application',
            idParam(req.params['applicationId'], 'This exterior application'),
            userId(req),
            await exteriorUnitsOf(db, projectId(req)),
          ),
        ),
      );
  });
  router.post('/additional-allowances/:claimId/restore', edit, async (req, res) => {
    res
      .status(201)
      .json(await changed(req, await restoreAllowanceClaim(db, projectId(req), idParam(req.params['claimId'], 'This claim'), userId(req))));
  });

  return router;
}

const importKeyPattern = /^[\x21-\x7e]{1,200}$/;

/** The `Idempotency-Key` of an import: a retry with the same key gets the first import's spaces back. */
function importKey(req: Request): ImportKey | undefined {
  const key = req.get('idempotency-key');
  if (key === undefined) return undefined;
  if (!importKeyPattern.test(key)) {
    throw AppError.badRequest('The Idempotency-Key header must be 1 to 200 visible ASCII characters.', [
      { path: 'Idempotency-Key', message: 'Not a usable key.' },
    ]);
  }
  return { key, requestHash: requestDigest(req.body) };
}
