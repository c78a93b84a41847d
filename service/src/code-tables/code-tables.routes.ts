import { Router } from 'express';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';
import { parse } from '../http/validate.js';
import {
  findEditionVersion,
  getRules,
  listAdditionalAllowances,
  listAmendments,
  listBuildingAreaTypes,
  listControlStrategies,
  listEditions,
  listExteriorApplications,
  listLightingZones,
  listSpaceTypes,
  type EditionVersion,
} from './code-tables.repository.js';
import { editionParams, editionQuery } from './code-tables.schema.js';

/** Read-only code tables: the editions, and each edition's tables at its current data version (or `?dataVersion=`). */
export function codeEditionsRouter(db: Database): Router {
  const router = Router();

  router.get('/', async (_req, res) => {
    res.json(await listEditions(db));
  });

  const tables: Record<string, (db: Database, version: EditionVersion) => Promise<unknown>> = {
    'building-area-types': listBuildingAreaTypes,
    'space-types': listSpaceTypes,
    'control-strategies': listControlStrategies,
    'exterior-applications': listExteriorApplications,
    'lighting-zones': listLightingZones,
    'additional-allowances': listAdditionalAllowances,
    amendments: listAmendments,
    rules: getRules,
  };
  for (const [name, list] of Object.entries(tables)) {
    router.get(`/:editionId/${name}`, async (req, res) => {
      const { editionId } = parse(editionParams, req.params);
      const { dataVersion } = parse(editionQuery, req.query);
      const version = await findEditionVersion(db, editionId, dataVersion);
      if (!version) {
        throw AppError.notFound(
          dataVersion ? `No data version ${dataVersion} of code edition ${editionId}.` : `No code edition ${editionId}.`,
        );
      }
      res.setHeader('X-Data-Version', version.dataVersion);
      res.json(await list(db, version));
    });
  }

  return router;
}
