import { loadEditionData } from '../code-tables/code-tables.repository.js';
import { validateDocument } from '../compliance/index.js';
import type { Database } from '../db/database.js';
import { AppError, type ErrorDetail } from '../http/app-error.js';
import { listLuminaireTypes } from './design.repository.js';
import type { SpaceInput } from './design.schema.js';

/**
 * Checks spaces about to be stored against the project's edition and method with the same rules
 * an evaluation applies (known space or building area type, the method's rules, room geometry for
 * openings, defined luminaire tags), so a bad key is refused when it is typed, not later.
 * `single` reports paths relative to the one space (`spaceType`), otherwise `spaces.N.spaceType`.
 */
export async function assertSpacesFitEdition(db: Database, projectId: string, spaces: SpaceInput[], single: boolean): Promise<void> {
  const project = await db('projects').where({ id: projectId }).first<{ edition_id: string | null; method: 'building-area' | 'space-by-space' | null; units: 'ip' | 'si' } | undefined>('edition_id', 'method', 'units');
  if (!project?.edition_id || !project.method) return;
  const edition = await loadEditionData(db, project.edition_id);
  if (!edition) return;
  const types = await listLuminaireTypes(db, projectId);
  const outcome = validateDocument(
    {
      edition: project.edition_id,
      method: project.method,
      units: project.units,
      luminaireTypes: types.map(({ tag, description, inputWatts, use, exemptReason, basis, length, limitWatts }) => ({ tag, description, inputWatts, use, exemptReason, basis, length, limitWatts })),
      spaces: spaces.map((space, index) => ({ ...space, id: `space-${index}` })),
    },
    edition,
  );
  if (outcome.valid) return;
  const details: ErrorDetail[] = outcome.problems
    .filter((problem) => problem.path.startsWith('spaces.'))
    .map((problem) => ({ path: single ? problem.path.replace(/^spaces\.0\./, '') : problem.path, message: problem.message }));
  if (details.length > 0) throw AppError.badRequest('Some values do not fit the project’s code edition and method.', details);
}
