import type { Knex } from 'knex';
import type { ProjectState } from '../../../contract/review.js';
import { projectDocument } from '../design/project-document.js';
import { DomainError } from '../domain-errors.js';
import { evaluateDocument, notComputedMessage } from '../evaluation/evaluation.service.js';
import { checkItems } from './check-items.js';
import { closeRound, openRound, openVerdicts } from './review-items.repository.js';

export interface RoundMove {
  projectId: string;
  from: ProjectState;
  to: ProjectState;
  /** The design revision the round reviews. */
  revision: number;
  userId: string;
}

function plural(count: number, one: string, many: string): string {
  return `${count} ${count === 1 ? one : many}`;
}

/**
 * What a move of the review state does to the check items, in the move's transaction (under the
 * project's lock): a submission freezes the evaluation as it now is as the next round and brings
 * the items up to it; a return closes the round; an acceptance closes it too, and is refused while
 * any item of the round needs revision or has no verdict. `refuse` makes the move's own 409.
 */
export async function moveRound(trx: Knex.Transaction, move: RoundMove, refuse: (message: string) => Error): Promise<void> {
  if (move.to === 'in-review') {
    let document, result;
    try {
      // Read in the transaction that holds the lock, so the round is exactly the design submitted.
      document = await projectDocument(trx, move.projectId);
      result = await evaluateDocument(trx, document);
    } catch (error) {
      if (!(error instanceof DomainError)) throw error;
      const reason =
        error.message === notComputedMessage
          ? `${plural(error.details.length, 'problem stands', 'problems stand')} in the way, and the Results page lists them.`
          : error.message;
      throw refuse(`The design cannot be submitted until its results can be computed. ${reason}`);
    }
    await openRound(trx, move.projectId, { revision: move.revision, userId: move.userId, document, result }, checkItems(document, result));
    return;
  }
  if (move.from !== 'in-review') return;
  if (move.to === 'accepted') {
    const { needsRevision, open } = await openVerdicts(trx, move.projectId);
    if (needsRevision > 0 || open > 0) {
      const reasons = [
        ...(needsRevision > 0 ? [`${plural(needsRevision, 'check item needs', 'check items need')} revision`] : []),
        ...(open > 0 ? [`${plural(open, 'check item has', 'check items have')} no verdict yet`] : []),
      ];
      throw refuse(
        `The design cannot be accepted while ${reasons.join(' and ')}. Record a verdict on each${needsRevision > 0 ? ', or return the design to the engineer' : ''}.`,
      );
    }
    await closeRound(trx, move.projectId, 'accepted');
  } else if (move.to === 'returned') {
    await closeRound(trx, move.projectId, 'returned');
  }
}
