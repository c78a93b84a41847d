/** The review loop as the service answers it and the web app reads it: states, check items, the desk. */

export const projectStates = ['draft', 'in-review', 'returned', 'accepted', 'issued'] as const;
export type ProjectState = (typeof projectStates)[number];

/** Words for a state, as people read it. */
export const projectStateLabels: Record<ProjectState, string> = {
  draft: 'Draft',
  'in-review': 'In review',
  returned: 'Returned',
  accepted: 'Accepted',
  issued: 'Issued',
};

/** Design data may change only in these states; a change to an accepted design reopens it as a draft. */
export const editableStates: readonly ProjectState[] = ['draft', 'returned'];

/** Body of `POST /api/projects/:id/transitions`. */
export interface TransitionRequest {
  to: ProjectState;
  /** The project version the caller last read: a stale one is answered 409 with the current state. */
  version: number;
  comment?: string;
}

/**
 * What a 409 from a transition tells besides its message: the error's details hold an entry with
 * path `state` and one with path `version`, whose messages are the project's present values.
 */
export interface TransitionRefusal {
  state: ProjectState;
  version: number;
}

export const reviewItemKinds = [
  'power-allowance',
  'occupancy-sensing',
  'automatic-shutoff',
  'daylight-response',
  'light-reduction',
  /** A space's controls that none of the four above covers: local control, and the separate control of specific applications. */
  'other-controls',
  'exterior-power',
  'exterior-controls',
] as const;
export type ReviewItemKind = (typeof reviewItemKinds)[number];

export const reviewItemKindLabels: Record<ReviewItemKind, string> = {
  'power-allowance': 'Power allowance',
  'occupancy-sensing': 'Occupancy sensing',
  'automatic-shutoff': 'Automatic shutoff',
  'daylight-response': 'Daylight response',
  'light-reduction': 'Light reduction',
  'other-controls': 'Other controls',
  'exterior-power': 'Exterior power',
  'exterior-controls': 'Exterior controls',
};

export const reviewVerdicts = ['confirmed', 'needs-revision', 'not-applicable'] as const;
export type ReviewVerdict = (typeof reviewVerdicts)[number];

export const reviewVerdictLabels: Record<ReviewVerdict, string> = {
  confirmed: 'Confirmed',
  'needs-revision': 'Needs revision',
  'not-applicable': 'Not applicable',
};

/** One entry of an item's thread: a verdict with its comment, or a reply. */
export interface ReviewThreadEntry {
  by: string;
  /** The writer's role on the project when they wrote. */
  role: 'engineer' | 'reviewer' | 'contractor' | 'admin';
  at: string;
  text: string;
  /** Set when the entry recorded a verdict. */
  verdict?: ReviewVerdict;
  /** The review round the entry was written in (1 for the first submission). */
  round: number;
}

/** One figure the engine used for the item, as the reviewer reads it. */
export interface ReviewValue {
  label: string;
  /** Already formatted with its unit, e.g. "1,240 W" or "0.82 W/ft²". */
  value: string;
}

/** What the engine concluded for the item in the round's frozen result. */
export type ReviewOutcome = 'met' | 'not-met' | 'to-verify' | 'not-required';

/** `GET /api/projects/:id/review-items` answers a list of these. */
export interface ReviewItem {
  id: string;
  kind: ReviewItemKind;
  /** The space the item checks; absent for the site's exterior items. */
  spaceId?: string;
  /** E.g. "Hose store: Occupancy sensing". */
  title: string;
  /** The section of the edition, e.g. "90.1-2019 §9.4.1.1(a)". */
  section: string;
  outcome: ReviewOutcome;
  /** The engine's reasoning in words. */
  reasoning: string;
  values: ReviewValue[];
  /** null until the reviewer records one in this round. */
  verdict: ReviewVerdict | null;
  /** The item's data differs from what it was in the previous round. */
  changed: boolean;
  /** The round the item was last generated in. */
  round: number;
  thread: ReviewThreadEntry[];
}

/** Body of `PATCH /api/projects/:id/review-items/:itemId`. */
export interface ReviewVerdictRequest {
  verdict: ReviewVerdict;
  comment?: string;
}

/** Body of `POST /api/projects/:id/review-items/bulk`: confirm every item of one kind, or every unchanged item, still without a verdict. */
export interface ReviewBulkRequest {
  confirm: { kind: ReviewItemKind } | { unchanged: true };
}

/** What the bulk confirmation answers: how many items it confirmed, and the round's items as they now are. */
export interface ReviewBulkResult {
  confirmed: number;
  items: ReviewItem[];
}

/**
 * A check item's step as the project's history keeps it (`review` on the entry): a verdict with its
 * comment, a reply's text, or a bulk confirmation with the kind (or "unchanged") and the titles it
 * confirmed. `name` on the entry is the item's title.
 */
export interface ReviewHistoryDetail {
  round: number;
  verdict?: ReviewVerdict;
  comment?: string;
  text?: string;
  kind?: ReviewItemKind;
  unchanged?: true;
  count?: number;
  titles?: string[];
}

/** One row of `GET /api/review-desk`. */
export interface ReviewDeskEntry {
  projectId: string;
  name: string;
  state: ProjectState;
  revision: number;
  /** The latest round (1 for the first submission); 0 before the design was ever submitted. */
  round: number;
  /** When the latest round was submitted, and by whom. */
  submittedAt: string | null;
  submittedBy: string | null;
  /** Items without a verdict in the current round. */
  open: number;
  /** Items of the current round marked Needs revision. */
  needsRevision: number;
  /** Every item of the current round. */
  total: number;
}
