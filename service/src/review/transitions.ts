import type { Knex } from 'knex';
import { projectStateLabels, type ProjectState } from '../../../contract/review.js';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import type { ProjectRole } from '../db/tables.js';
import { Conflict, DomainError } from '../domain-errors.js';
import { hasFinalPackage } from '../package/package.repository.js';
import { setReviewState } from '../projects/projects.repository.js';
import { moveRound } from './rounds.js';
import { queueTransitionMail, type TransitionMailSettings } from './transition-mail.js';

/** Who makes a move: the project's role that may, with what the move means in words. */
interface Move {
  from: ProjectState;
  to: ProjectState;
  role: ProjectRole;
  /** The history's words for the move. */
  words: string;
  /** A return needs the reviewer's reasons. */
  commentRequired?: boolean;
  /** Reopening an accepted or issued design starts a new revision. */
  newRevision?: boolean;
}

/**
 * The review states and the moves between them. Issuing needs a final submittal package of the
 * design's revision (making the package of an accepted design records one and issues it).
 */
export const moves: readonly Move[] = [
  { from: 'draft', to: 'in-review', role: 'engineer', words: 'Submitted for review' },
  { from: 'returned', to: 'in-review', role: 'engineer', words: 'Submitted again for review' },
  { from: 'in-review', to: 'returned', role: 'reviewer', words: 'Returned to the engineer', commentRequired: true },
  { from: 'in-review', to: 'accepted', role: 'reviewer', words: 'Accepted' },
  { from: 'accepted', to: 'issued', role: 'engineer', words: 'Issued' },
  { from: 'accepted', to: 'draft', role: 'engineer', words: 'Reopened as a draft', newRevision: true },
  { from: 'issued', to: 'draft', role: 'engineer', words: 'Reopened as a draft', newRevision: true },
];

/** A move the caller's role may not make: answered 403. */
export class NotYourMove extends DomainError {}

/** A move refused from the project's present state, or on a stale version: 409 with the state and version. */
export class TransitionRefused extends Conflict {
  constructor(
    message: string,
    readonly state: ProjectState,
    readonly version: number,
  ) {
    super(message);
  }
}

export interface TransitionInput {
  to: ProjectState;
  version: number;
  comment?: string;
}

export interface TransitionOutcome {
  from: ProjectState;
  to: ProjectState;
  revision: number;
  version: number;
}

const roleWords: Record<ProjectRole, string> = { engineer: 'the engineer', reviewer: 'a reviewer', contractor: 'the contractor' };

/**
 * Moves the project's review state, in one transaction under the project's row lock: the caller's
 * role (an administrator may make any role's move), the present state and the version the caller
 * read are checked first; the move bumps the version, a reopening the revision, and writes the
 * audit record the history shows; the people the move concerns are mailed in the same transaction.
 */
export async function applyTransition(
  db: Database,
  projectId: string,
  input: TransitionInput,
  actor: { userId: string; role: ProjectRole | null; isAdmin: boolean },
  mail: TransitionMailSettings,
  alongside?: (trx: Knex.Transaction, outcome: TransitionOutcome) => Promise<void>,
): Promise<TransitionOutcome> {
  return db.transaction(async (trx) => {
    const project = await lockProject(trx, projectId, { anyState: true });
    const from = project.state;
    const here = (message: string) => new TransitionRefused(message, from, project.version);
    if (input.version !== project.version) {
      throw here(
        `The project changed since you opened it; it is now ${projectStateLabels[from].toLowerCase()}. Look again, then try once more.`,
      );
    }
    const move = moves.find((candidate) => candidate.from === from && candidate.to === input.to);
    if (!move) {
      throw here(
        from === input.to
          ? `The project is already ${projectStateLabels[from].toLowerCase()}.`
          : `A project that is ${projectStateLabels[from].toLowerCase()} cannot become ${projectStateLabels[input.to].toLowerCase()}.`,
      );
    }
    if (!actor.isAdmin && actor.role !== move.role) {
      throw new NotYourMove(`Only ${roleWords[move.role]} may do this (${move.words.toLowerCase()}).`);
    }
    const comment = input.comment?.trim() ?? '';
    if (move.commentRequired && comment === '') {
      throw here('Say what needs revision: a return needs a comment for the engineer.');
    }
    if (move.to === 'issued' && !(await hasFinalPackage(trx, projectId, project.revision))) {
      throw here('Issuing needs a final submittal package of this design: make the package from the Package page.');
    }
    // The check items: a submission opens a round on the evaluation as it now is; accepting needs a verdict on each item.
    await moveRound(trx, { projectId, from, to: move.to, revision: project.revision, userId: actor.userId }, here);
    const revision = move.newRevision ? project.revision + 1 : project.revision;
    const version = await setReviewState(trx, projectId, { state: move.to, revision, version: project.version + 1 }, actor.userId);
    const outcome: TransitionOutcome = { from, to: move.to, revision, version };
    await recordAudit(trx, {
      userId: actor.userId,
      projectId,
      action: 'transition',
      entity: 'project',
      entityId: projectId,
      detail: { transition: { from, to: move.to, revision, words: move.words, ...(comment ? { comment } : {}) } },
    });
    await queueTransitionMail(
      trx,
      { projectId, from, to: move.to, revision, actorId: actor.userId, ...(comment ? { comment } : {}) },
      mail,
    );
    if (alongside) await alongside(trx, outcome);
    return outcome;
  });
}
