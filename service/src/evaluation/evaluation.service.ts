import { evaluate, validateDocument, type EvaluationResult } from '../compliance/index.js';
import { loadEditionData } from '../code-tables/code-tables.repository.js';
import type { Database } from '../db/database.js';
import { AppError } from '../http/app-error.js';

/** Said above the list of problems, each of which names its field and what to do about it. */
export const notComputedMessage = 'The results cannot be computed until the problems below are fixed.';

/**
 * The one path from a project document to a result, used by `POST /api/evaluate` and by a stored
 * project's results alike: find the edition's current tables, check the whole document, evaluate.
 * Any problem is a 400 listing every path; nothing is half-computed.
 */
export async function evaluateDocument(db: Database, input: unknown): Promise<EvaluationResult> {
  const edition = typeof input === 'object' && input !== null && 'edition' in input ? (input as { edition: unknown }).edition : undefined;
  if (typeof edition !== 'string' || edition.trim() === '') {
    throw AppError.badRequest(notComputedMessage, [{ path: 'edition', message: 'No code edition is chosen.' }]);
  }
  const tables = await loadEditionData(db, edition.trim());
  if (!tables) {
    throw AppError.badRequest(notComputedMessage, [{ path: 'edition', message: `There is no code edition "${edition}".` }]);
  }
  const outcome = validateDocument(input, tables);
  if (!outcome.valid) {
    throw AppError.badRequest(notComputedMessage, outcome.problems);
  }
  return evaluate(outcome.document, tables);
}
