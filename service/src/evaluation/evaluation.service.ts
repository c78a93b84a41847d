import { compareEditions, summary, type EditionComparison } from '../compliance/comparison.js';
import { editionIds } from '../compliance/edition-data.js';
import { evaluate, validateDocument, type EditionData, type EvaluationResult } from '../compliance/index.js';
import { projectDocument } from '../design/project-document.js';
import { loadEditionData } from '../code-tables/code-tables.repository.js';
import type { Database } from '../db/database.js';
import { DomainError, Refused } from '../domain-errors.js';
import { designChangedAt, keepResultSummary } from '../projects/projects.repository.js';

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
    throw new Refused(notComputedMessage, [{ path: 'edition', message: 'No code edition is chosen.' }]);
  }
  const tables = await loadEditionData(db, edition.trim());
  if (!tables) {
    throw new Refused(notComputedMessage, [{ path: 'edition', message: `There is no code edition "${edition}".` }]);
  }
  const outcome = validateDocument(input, tables);
  if (!outcome.valid) {
    throw new Refused(notComputedMessage, outcome.problems);
  }
  return evaluate(outcome.document, tables);
}

/** A stored project's result (GET /api/projects/:id/results): a read, which stores nothing. */
export async function projectResults(db: Database, projectId: string): Promise<EvaluationResult> {
  return evaluateDocument(db, await projectDocument(db, projectId));
}

/**
 * Keeps the verdict of the project as it now is for the project list; called after each write that
 * changes what its evaluation reads (the design, the set-up), once the write is committed, so the
 * list is right without anyone opening the results. Nothing is kept when another write landed while
 * it was computed (that write keeps its own), nor when the project cannot be evaluated yet (the
 * write cleared the old verdict, so the list shows none). A failure here is logged and leaves the
 * write as it was: the write itself succeeded.
 */
export async function keepVerdict(
  db: Database,
  projectId: string,
  log?: { error: (context: object, message: string) => void },
): Promise<void> {
  try {
    const designAt = await designChangedAt(db, projectId);
    if (designAt === null) return;
    let result: EvaluationResult;
    try {
      result = await evaluateDocument(db, await projectDocument(db, projectId));
    } catch (error) {
      if (error instanceof DomainError) return;
      throw error;
    }
    await keepResultSummary(db, projectId, designAt, {
      complies: result.complies,
      verdict: result.verdict,
      marginPct: result.interior.marginPct,
      dataVersion: result.dataVersion,
    });
  } catch (err) {
    log?.error({ err, projectId }, 'the verdict for the project list was not kept');
  }
}

/**
 * The stored project under its own edition and under every other edition loaded, mapped row by
 * row (GET /api/projects/:id/comparison), with the cautions of its own evaluation. The project's own
 * evaluation keeps its amendments, and every other edition's control requirements are set against it.
 */
export async function compareProject(
  db: Database,
  projectId: string,
): Promise<{ current: EditionComparison; editions: EditionComparison[]; cautions: string[] }> {
  const document = await projectDocument(db, projectId);
  const own = await loadEditionData(db, document.edition);
  if (!own) throw new Refused('The project’s code edition is not loaded.');
  const others = (await Promise.all(editionIds.filter((id) => id !== own.id).map((id) => loadEditionData(db, id)))).filter(
    (edition): edition is EditionData => edition !== undefined,
  );
  const result = await evaluateDocument(db, document);
  return {
    current: {
      edition: own.id,
      title: own.title,
      status: 'evaluated',
      unmapped: [],
      remapped: [],
      controlsNotCarried: [],
      controlChanges: [],
      problems: [],
      result: summary(result),
    },
    editions: compareEditions(document, own, others, result),
    cautions: result.cautions,
  };
}
