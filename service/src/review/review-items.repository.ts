import type { Knex } from 'knex';
import {
  reviewItemKindLabels,
  type ProjectState,
  type ReviewBulkResult,
  type ReviewDeskEntry,
  type ReviewHistoryDetail,
  type ReviewItem,
  type ReviewItemKind,
  type ReviewOutcome,
  type ReviewThreadEntry,
  type ReviewValue,
  type ReviewVerdict,
} from '../../../contract/review.js';
import type { EvaluationResult } from '../../../contract/result.js';
import { recordAudit } from '../audit/audit.repository.js';
import type { EvaluationDocumentInput } from '../compliance/document.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import type { ProjectRole } from '../db/tables.js';
import { Conflict, NotFound } from '../domain-errors.js';
import type { CheckItem } from './check-items.js';

/** Who writes in a thread: their role on the project, or `admin` for an administrator who is not on the team. */
export interface ReviewActor {
  userId: string;
  role: ProjectRole | null;
}

interface RoundRow {
  id: string;
  number: number;
  opened_at: Date;
  closed_at: Date | null;
}

interface ItemRow {
  id: string;
  key: string;
  kind: ReviewItemKind;
  space_id: string | null;
  title: string;
  section: string;
  outcome: ReviewOutcome;
  reasoning: string;
  values: ReviewValue[];
  fingerprint: string;
  round: number;
  changed: boolean;
  verdict: ReviewVerdict | null;
  removed_in_round: number | null;
}

interface EntryRow {
  item_id: string;
  round: number;
  user_name: string | null;
  role: ReviewThreadEntry['role'];
  text: string;
  verdict: ReviewVerdict | null;
  at: Date;
}

const itemColumns = [
  'id',
  'key',
  'kind',
  'space_id',
  'title',
  'section',
  'outcome',
  'reasoning',
  'values',
  'fingerprint',
  'round',
  'changed',
  'verdict',
  'removed_in_round',
] as const;

/** Rows per upsert statement: 17 columns each, well inside PostgreSQL's 65,535 parameters. */
const upsertChunk = 1000;

/** The project's latest round, open or closed; undefined before its first submission. */
async function latestRound(db: Knex, projectId: string): Promise<RoundRow | undefined> {
  return db('review_rounds')
    .where({ project_id: projectId })
    .orderBy('number', 'desc')
    .first<RoundRow | undefined>('id', 'number', 'opened_at', 'closed_at');
}

/**
 * Opens the next round with the evaluation the submission froze, and brings the check items up
 * to it, in the caller's transaction (which holds the project's lock): an item is matched to last
 * round's by its key; one whose fingerprint differs is marked changed and loses its verdict, one
 * that is the same keeps its verdict; an item whose space is gone is marked removed; threads stay.
 */
export async function openRound(
  trx: Knex.Transaction,
  projectId: string,
  round: { revision: number; userId: string; document: EvaluationDocumentInput; result: EvaluationResult },
  items: readonly CheckItem[],
): Promise<number> {
  const previous = await latestRound(trx, projectId);
  if (previous && previous.closed_at === null) {
    // Only a state set outside the review loop leaves a round open; it ends without an outcome.
    await trx('review_rounds').where({ id: previous.id }).update({ closed_at: trx.fn.now() });
  }
  const number = (previous?.number ?? 0) + 1;
  await trx('review_rounds').insert({
    project_id: projectId,
    number,
    revision: round.revision,
    opened_by: round.userId,
    document: JSON.stringify(round.document),
    result: JSON.stringify(round.result),
  });

  // One upsert per chunk, so a project of thousands of spaces takes a few statements, not one per item.
  // In the update, `review_items.*` is the row as it was, so the verdict is cleared only where the print moved.
  const rows = items.map((item, position) => ({
    project_id: projectId,
    key: item.key,
    kind: item.kind,
    space_id: item.spaceId,
    title: item.title,
    section: item.section,
    outcome: item.outcome,
    reasoning: item.reasoning,
    values: JSON.stringify(item.values),
    fingerprint: item.fingerprint,
    round: number,
    position,
    // New in a later round: the reviewer has not seen it, so it counts as changed.
    changed: number > 1,
    verdict: null,
    removed_in_round: null,
  }));
  for (let start = 0; start < rows.length; start += upsertChunk) {
    await trx('review_items')
      .insert(rows.slice(start, start + upsertChunk))
      .onConflict(['project_id', 'key'])
      .merge({
        kind: trx.raw('excluded.kind'),
        space_id: trx.raw('excluded.space_id'),
        title: trx.raw('excluded.title'),
        section: trx.raw('excluded.section'),
        outcome: trx.raw('excluded.outcome'),
        reasoning: trx.raw('excluded.reasoning'),
        values: trx.raw('excluded.values'),
        fingerprint: trx.raw('excluded.fingerprint'),
        round: trx.raw('excluded.round'),
        position: trx.raw('excluded.position'),
        changed: trx.raw('review_items.fingerprint <> excluded.fingerprint'),
        verdict: trx.raw('case when review_items.fingerprint = excluded.fingerprint then review_items.verdict end'),
        removed_in_round: null,
        updated_at: trx.fn.now(),
      });
  }
  // What this round did not generate (a deleted space's items) is removed from the list, thread and all kept.
  await trx('review_items')
    .where({ project_id: projectId })
    .where('round', '<', number)
    .whereNull('removed_in_round')
    .update({ removed_in_round: number, updated_at: trx.fn.now() });
  return number;
}

/** Ends the open round with the reviewer's decision. */
export async function closeRound(trx: Knex.Transaction, projectId: string, outcome: 'returned' | 'accepted'): Promise<void> {
  await trx('review_rounds').where({ project_id: projectId }).whereNull('closed_at').update({ closed_at: trx.fn.now(), outcome });
}

/** What keeps the open round from being accepted: its items that need revision and those without a verdict. */
export async function openVerdicts(db: Knex, projectId: string): Promise<{ needsRevision: number; open: number }> {
  const round = await latestRound(db, projectId);
  if (!round || round.closed_at !== null) return { needsRevision: 0, open: 0 };
  const [counts] = await db('review_items')
    .where({ project_id: projectId, round: round.number })
    .whereNull('removed_in_round')
    .select<{ needs_revision: string; open: string }[]>(
      db.raw(`count(*) filter (where verdict = 'needs-revision') as needs_revision`),
      db.raw('count(*) filter (where verdict is null) as open'),
    );
  return { needsRevision: Number(counts?.needs_revision ?? 0), open: Number(counts?.open ?? 0) };
}

// ---------------------------------------------------------------- reads

async function threads(db: Knex, itemIds: readonly string[]): Promise<Map<string, ReviewThreadEntry[]>> {
  const byItem = new Map<string, ReviewThreadEntry[]>();
  if (itemIds.length === 0) return byItem;
  const rows = await db('review_entries as e')
    .leftJoin('users as u', 'u.id', 'e.user_id')
    .whereIn('e.item_id', itemIds)
    .orderBy('e.id')
    .select<EntryRow[]>('e.item_id', 'e.round', 'u.name as user_name', 'e.role', 'e.text', 'e.verdict', 'e.at');
  for (const row of rows) {
    const entry: ReviewThreadEntry = {
      by: row.user_name ?? 'Someone',
      role: row.role,
      at: row.at.toISOString(),
      text: row.text,
      round: row.round,
      ...(row.verdict ? { verdict: row.verdict } : {}),
    };
    byItem.set(row.item_id, [...(byItem.get(row.item_id) ?? []), entry]);
  }
  return byItem;
}

function toItem(row: ItemRow, thread: ReviewThreadEntry[]): ReviewItem {
  return {
    id: row.id,
    kind: row.kind,
    ...(row.space_id ? { spaceId: row.space_id } : {}),
    title: row.title,
    section: row.section,
    outcome: row.outcome,
    reasoning: row.reasoning,
    values: row.values,
    verdict: row.verdict,
    changed: row.changed,
    round: row.round,
    thread,
  };
}

/** The latest round's number and its items with verdicts and threads, for the package's review record; undefined before any submission. */
export async function reviewRecord(db: Knex, projectId: string): Promise<{ round: number; items: ReviewItem[] } | undefined> {
  const round = await latestRound(db, projectId);
  return round ? { round: round.number, items: await listReviewItems(db, projectId) } : undefined;
}

/** The check items of the latest round, in the order they were generated (spaces in their order, then the site). */
export async function listReviewItems(db: Knex, projectId: string, only?: readonly string[]): Promise<ReviewItem[]> {
  const query = db('review_items')
    .where({ project_id: projectId })
    .whereNull('removed_in_round')
    .orderBy('position')
    .select<ItemRow[]>(itemColumns);
  if (only) query.whereIn('id', only);
  const rows = await query;
  const byItem = await threads(
    db,
    rows.map((row) => row.id),
  );
  return rows.map((row) => toItem(row, byItem.get(row.id) ?? []));
}

// ---------------------------------------------------------------- writes

function entryRole(actor: ReviewActor): ReviewThreadEntry['role'] {
  return actor.role ?? 'admin';
}

/** Takes the project's lock and finds a current item of it; a removed item or another project's is not found. */
async function lockedItem(trx: Knex.Transaction, projectId: string, itemId: string): Promise<{ state: ProjectState; item: ItemRow }> {
  const project = await lockProject(trx, projectId, { anyState: true });
  const item = await trx('review_items')
    .where({ id: itemId, project_id: projectId })
    .whereNull('removed_in_round')
    .first<ItemRow | undefined>(itemColumns);
  if (!item) throw new NotFound('That check item does not exist in this project’s current review.');
  return { state: project.state, item };
}

function mustBeInReview(state: ProjectState): void {
  if (state !== 'in-review') {
    const words: Record<ProjectState, string> = {
      draft: 'it is a draft',
      returned: 'it has been returned to the engineer',
      'in-review': '',
      accepted: 'it has been accepted',
      issued: 'it has been issued',
    };
    throw new Conflict(`Verdicts are recorded while the design is in review, and ${words[state]}.`);
  }
}

async function currentRoundNumber(trx: Knex.Transaction, projectId: string): Promise<number> {
  return (await latestRound(trx, projectId))?.number ?? 1;
}

/** The reviewer's verdict on one item, with its comment in the thread; audited. */
export async function recordVerdict(
  db: Database,
  projectId: string,
  itemId: string,
  input: { verdict: ReviewVerdict; comment?: string },
  actor: ReviewActor,
): Promise<ReviewItem> {
  await db.transaction(async (trx) => {
    const { state, item } = await lockedItem(trx, projectId, itemId);
    mustBeInReview(state);
    const round = await currentRoundNumber(trx, projectId);
    await trx('review_items').where({ id: itemId }).update({ verdict: input.verdict, updated_at: trx.fn.now() });
    await trx('review_entries').insert({
      item_id: itemId,
      round,
      user_id: actor.userId,
      role: entryRole(actor),
      text: input.comment ?? '',
      verdict: input.verdict,
    });
    await recordAudit(trx, {
      userId: actor.userId,
      projectId,
      action: 'verdict',
      entity: 'review-item',
      entityId: itemId,
      detail: {
        name: item.title,
        review: { verdict: input.verdict, round, ...(input.comment ? { comment: input.comment } : {}) } satisfies ReviewHistoryDetail,
      },
    });
  });
  return (await listReviewItems(db, projectId, [itemId]))[0]!;
}

/** A reply in the item's thread, by the engineer or a reviewer, in any state once the design was submitted; audited. */
export async function replyToItem(db: Database, projectId: string, itemId: string, text: string, actor: ReviewActor): Promise<ReviewItem> {
  await db.transaction(async (trx) => {
    const { item } = await lockedItem(trx, projectId, itemId);
    const round = await currentRoundNumber(trx, projectId);
    await trx('review_entries').insert({ item_id: itemId, round, user_id: actor.userId, role: entryRole(actor), text, verdict: null });
    await recordAudit(trx, {
      userId: actor.userId,
      projectId,
      action: 'reply',
      entity: 'review-item',
      entityId: itemId,
      detail: { name: item.title, review: { text, round } satisfies ReviewHistoryDetail },
    });
  });
  return (await listReviewItems(db, projectId, [itemId]))[0]!;
}

/**
 * Confirms in one step every current item of one kind, or every unchanged one, that has no
 * verdict yet; each gets the verdict in its thread, and the step is one audit record.
 */
export async function confirmInBulk(
  db: Database,
  projectId: string,
  which: { kind: ReviewItemKind } | { unchanged: true },
  actor: ReviewActor,
): Promise<ReviewBulkResult> {
  const confirmed = await db.transaction(async (trx) => {
    const project = await lockProject(trx, projectId, { anyState: true });
    mustBeInReview(project.state);
    const round = await currentRoundNumber(trx, projectId);
    const query = trx('review_items').where({ project_id: projectId }).whereNull('removed_in_round').whereNull('verdict');
    if ('kind' in which) query.where({ kind: which.kind });
    else query.where({ changed: false });
    const rows = await query.orderBy('position').select<ItemRow[]>(itemColumns);
    if (rows.length === 0) return 0;
    const words =
      'kind' in which
        ? `Confirmed in one step with every ${reviewItemKindLabels[which.kind]} item that had no verdict.`
        : 'Confirmed in one step with every unchanged item that had no verdict.';
    const ids = rows.map((row) => row.id);
    await trx('review_items').whereIn('id', ids).update({ verdict: 'confirmed', updated_at: trx.fn.now() });
    await trx('review_entries').insert(
      ids.map((id) => ({ item_id: id, round, user_id: actor.userId, role: entryRole(actor), text: words, verdict: 'confirmed' })),
    );
    await recordAudit(trx, {
      userId: actor.userId,
      projectId,
      action: 'bulk-confirm',
      entity: 'review-item',
      detail: {
        name: 'kind' in which ? reviewItemKindLabels[which.kind] : 'unchanged items',
        review: {
          verdict: 'confirmed',
          round,
          count: rows.length,
          ...('kind' in which ? { kind: which.kind } : { unchanged: true }),
          titles: rows.map((row) => row.title),
        } satisfies ReviewHistoryDetail,
      },
    });
    return rows.length;
  });
  return { confirmed, items: await listReviewItems(db, projectId) };
}

// ---------------------------------------------------------------- the desk

interface DeskRow {
  id: string;
  name: string;
  state: ProjectState;
  revision: number;
  round: number | null;
  opened_at: Date | null;
  opened_by_name: string | null;
  total: string;
  open: string;
  needs_revision: string;
}

/**
 * The projects where the person is a reviewer (every project for an administrator), archived ones
 * left out: those in review first, then by the oldest submission, with the latest round's counts.
 */
export async function reviewDesk(db: Database, userId: string, isAdmin: boolean): Promise<ReviewDeskEntry[]> {
  const query = db('projects as p')
    .leftJoin(
      db('review_rounds')
        .distinctOn('project_id')
        .orderBy([{ column: 'project_id' }, { column: 'number', order: 'desc' }])
        .select('project_id', 'number', 'opened_at', 'opened_by')
        .as('r'),
      'r.project_id',
      'p.id',
    )
    .leftJoin('users as u', 'u.id', 'r.opened_by')
    .leftJoin('review_items as i', function currentItems() {
      this.on('i.project_id', '=', 'p.id').andOnNull('i.removed_in_round');
    })
    .whereNull('p.archived_at')
    .groupBy('p.id', 'p.name', 'p.state', 'p.revision', 'r.number', 'r.opened_at', 'u.name')
    .select<DeskRow[]>(
      'p.id',
      'p.name',
      'p.state',
      'p.revision',
      'r.number as round',
      'r.opened_at',
      'u.name as opened_by_name',
      db.raw('count(i.id) as total'),
      db.raw('count(i.id) filter (where i.verdict is null) as open'),
      db.raw(`count(i.id) filter (where i.verdict = 'needs-revision') as needs_revision`),
    )
    .orderByRaw(`(p.state = 'in-review') desc, r.opened_at asc nulls last, p.name asc`);
  if (!isAdmin) {
    query.whereExists(
      db('project_members as m').whereRaw('m.project_id = p.id').where({ 'm.user_id': userId, 'm.role': 'reviewer' }).select(db.raw('1')),
    );
  }
  return (await query).map((row) => ({
    projectId: row.id,
    name: row.name,
    state: row.state,
    revision: row.revision,
    round: row.round ?? 0,
    submittedAt: row.opened_at ? row.opened_at.toISOString() : null,
    submittedBy: row.opened_by_name,
    open: Number(row.open),
    needsRevision: Number(row.needs_revision),
    total: Number(row.total),
  }));
}
