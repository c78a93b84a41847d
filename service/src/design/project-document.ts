import type { Knex } from 'knex';
import type { EvaluationDocumentInput } from '../compliance/document.js';
import { NotFound, Refused } from '../domain-errors.js';
import { readAll } from '../db/database.js';
import { projectSetup } from '../projects/projects.repository.js';
import { liveClaimsForDocument } from './allowance-claims.repository.js';
import { listExteriorApplications, listLuminaireTypes, listSpaces } from './design.repository.js';

/**
 * The stored project as an evaluation document: the same document `POST /api/evaluate` takes,
 * so evaluating it gives exactly the stored project's results.
 */
export async function projectDocument(db: Knex, projectId: string): Promise<EvaluationDocumentInput> {
  const project = await projectSetup(db, projectId);
  if (!project) throw new NotFound('No such project.');
  if (!project.edition_id || !project.method) {
    throw new Refused('Choose the code edition and compliance method in the set-up first.', [
      ...(project.edition_id ? [] : [{ path: 'edition', message: 'Required.' }]),
      ...(project.method ? [] : [{ path: 'method', message: 'Required.' }]),
    ]);
  }
  const [types, spaces, exterior, claims] = await readAll(db, [
    () => listLuminaireTypes(db, projectId),
    () => listSpaces(db, projectId),
    () => listExteriorApplications(db, projectId),
    () => liveClaimsForDocument(db, projectId),
  ]);
  const document: EvaluationDocumentInput = {
    edition: project.edition_id,
    method: project.method,
    units: project.units,
    luminaireTypes: types.map(({ tag, description, inputWatts, use, exemptReason, basis, length, limitWatts }) =>
      defined({ tag, description, inputWatts, use, exemptReason, basis, length, limitWatts }),
    ),
    spaces: spaces.map(
      ({
        position: _position,
        version: _version,
        updatedAt: _updatedAt,
        updatedBy: _updatedBy,
        luminaires,
        controlSpaceType,
        ...space
      }) => ({
        ...space,
        // Kept for the building area method; with the space-by-space method the space type sets the controls.
        ...(project.method === 'building-area' && controlSpaceType !== undefined ? { controlSpaceType } : {}),
        luminaires: luminaires.map(({ luminaireTypeId: _typeId, ...group }) => group),
      }),
    ),
  };
  if (project.lighting_zone !== null || exterior.length > 0) {
    document.exterior = {
      lightingZone: String(project.lighting_zone ?? ''),
      applications: exterior.map(({ key, quantity, installedWatts, exemptWatts, exemptReason, exemptNote, controls }) =>
        defined({ key, quantity, installedWatts, exemptWatts, exemptReason, exemptNote, controls }),
      ),
    };
  }
  if (project.amendments.length > 0) document.amendments = project.amendments;
  if (claims.length > 0) {
    document.retailDisplay = {
      claims: claims.map((claim) => ({ allowance: claim.allowance_key, spaceId: claim.space_id, area: claim.area })),
    };
  }
  return document;
}

/** The fields that have a value (the document leaves out what was never entered). */
function defined<Fields extends Record<string, unknown>>(fields: Fields): Fields {
  return Object.fromEntries(Object.entries(fields).filter(([, value]) => value !== undefined)) as Fields;
}
