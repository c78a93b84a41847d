import type { Knex } from 'knex';
import { editableStates, type ProjectState } from '../../../contract/review.js';
import { Archived, Locked, NotFound } from '../domain-errors.js';

export interface LockedProject {
  id: string;
  edition_id: string | null;
  method: 'building-area' | 'space-by-space' | null;
  units: 'ip' | 'si';
  archived_at: Date | null;
  state: ProjectState;
  version: number;
  revision: number;
}

/** Why a design in each state that is not a draft cannot change, and what to do. */
const lockedWords: Record<ProjectState, string> = {
  draft: '',
  returned: '',
  'in-review': 'This design is in review: it cannot change until the reviewer returns it.',
  accepted: 'This design is accepted: reopen it as a draft to change it (that starts a new revision).',
  issued: 'This design is issued: reopen it as a draft to change it (that starts a new revision).',
};

/**
 * Takes the project's row lock for the rest of the transaction. Every design write takes it first,
 * so checks that span the project (a tag used once, one entry per exterior application, the next
 * space position, at least one engineer, a change of units) cannot be raced past by a parallel
 * writer; and since everyone takes the same lock first, they cannot deadlock on each other.
 */
export async function lockProject(
  trx: Knex.Transaction,
  projectId: string,
  options: { allowArchived?: boolean; anyState?: boolean } = {},
): Promise<LockedProject> {
  const project = await trx('projects')
    .where({ id: projectId })
    .forUpdate()
    .first<LockedProject | undefined>('id', 'edition_id', 'method', 'units', 'archived_at', 'state', 'version', 'revision');
  if (!project) throw new NotFound('No such project.');
  if (project.archived_at && !options.allowArchived) {
    throw new Archived('This project is archived. Restore it from the projects list to change it.');
  }
  if (!options.anyState && !editableStates.includes(project.state)) throw new Locked(lockedWords[project.state]);
  return project;
}
