import type { ProjectState } from '../../../../../contract/review';
import type { ProjectRole } from '../../core/api/api-types';

/** A move of the review state as the workspace offers it: the button's words and what it asks first. */
export interface ReviewMove {
  to: ProjectState;
  label: string;
  icon: string;
  /** The words once made, for the note that confirms it. */
  done: string;
  /** A return asks the reviewer for what needs revision (the service requires it). */
  asksComment?: boolean;
  /** Reopening starts a new revision: asked before it is made. */
  asksConfirm?: boolean;
  /** The main move of the state, drawn filled. */
  primary?: boolean;
}

interface RoleMove extends ReviewMove {
  from: ProjectState;
  role: ProjectRole;
}

/**
 * The moves the service allows (service/src/review/transitions.ts), by role. Issuing is left out:
 * it needs a submittal package, which cannot be made yet, so the button would only be refused.
 */
const roleMoves: readonly RoleMove[] = [
  {
    from: 'draft',
    to: 'in-review',
    role: 'engineer',
    label: 'Submit for review',
    icon: 'send',
    done: 'Submitted for review.',
    primary: true,
  },
  {
    from: 'returned',
    to: 'in-review',
    role: 'engineer',
    label: 'Submit again',
    icon: 'send',
    done: 'Submitted again for review.',
    primary: true,
  },
  {
    from: 'in-review',
    to: 'returned',
    role: 'reviewer',
    label: 'Return to the engineer',
    icon: 'undo',
    done: 'Returned to the engineer.',
    asksComment: true,
  },
  { from: 'in-review', to: 'accepted', role: 'reviewer', label: 'Accept', icon: 'verified', done: 'Accepted.', primary: true },
  {
    from: 'accepted',
    to: 'draft',
    role: 'engineer',
    label: 'Reopen as a draft',
    icon: 'edit',
    done: 'Reopened as a draft with a new revision.',
    asksConfirm: true,
  },
  {
    from: 'issued',
    to: 'draft',
    role: 'engineer',
    label: 'Reopen as a draft',
    icon: 'edit',
    done: 'Reopened as a draft with a new revision.',
    asksConfirm: true,
  },
];

/** The moves a person may make from the state: their role's on the project, or every role's for an administrator. */
export function movesFrom(state: ProjectState, role: ProjectRole | null, isAdmin: boolean): ReviewMove[] {
  return roleMoves
    .filter((move) => move.from === state && (isAdmin || move.role === role))
    .map(({ from: _from, role: _role, ...move }) => move);
}
