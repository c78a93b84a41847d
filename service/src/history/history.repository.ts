import type { Knex } from 'knex';
import { restoreDays } from '../design/design.repository.js';

export interface HistoryFilter {
  spaceId?: string;
  userId?: string;
  since?: string;
  /** Entries older than this one (the id of the last entry of the previous page). */
  before?: string;
  limit: number;
}

export interface HistoryEntry {
  id: string;
  at: string;
  user: { id: string; name: string } | null;
  action: string;
  entity: string;
  entityId: string | null;
  /** What a person calls the thing changed: a space's name, a type's tag, an e-mail. */
  name: string | null;
  before: unknown;
  after: unknown;
  /** For a change of units: the units and the rows converted. */
  conversion?: unknown;
  /** On a copy: the project it was made from. */
  copiedFrom?: unknown;
  /** On a move of the review state: from, to, the revision, the move in words and the comment. */
  transition?: unknown;
  /** On a check item's verdict, reply or bulk confirmation (`ReviewHistoryDetail`); `name` is the item's title. */
  review?: unknown;
  /** On a submittal package made: its revision number, whether a draft, and its fingerprint. */
  package?: unknown;
  /** On a field test recorded or repeated: the result, the measured values, the notes; `name` is the test item's title. */
  fieldTest?: unknown;
  /** On a cut sheet attached to or removed from a luminaire type: its file name, size and SHA-256, and the one it replaced. */
  cutSheet?: unknown;
  replaced?: unknown;
  /** A deleted space, luminaire type, exterior application or allowance claim that can still be brought back. */
  restorable: boolean;
}

interface AuditRow {
  id: string;
  at: Date;
  user_id: string | null;
  user_name: string | null;
  action: string;
  entity: string;
  entity_id: string | null;
  detail: {
    name?: string;
    before?: unknown;
    after?: unknown;
    conversion?: unknown;
    copiedFrom?: unknown;
    transition?: unknown;
    review?: unknown;
    package?: unknown;
    fieldTest?: unknown;
    cutSheet?: unknown;
    replaced?: unknown;
    restoredFrom?: string;
  } | null;
}

const restorableEntities = new Set(['space', 'luminaire-type', 'exterior-application', 'additional-allowance']);

/** A project's history, newest first, one page at a time. */
export async function listHistory(db: Knex, projectId: string, filter: HistoryFilter): Promise<{ entries: HistoryEntry[]; more: boolean }> {
  const query = db('audit_log as a')
    .leftJoin('users as u', 'u.id', 'a.user_id')
    .where('a.project_id', projectId)
    .orderBy('a.id', 'desc')
    .limit(filter.limit + 1)
    .select<AuditRow[]>('a.id', 'a.at', 'a.user_id', 'u.name as user_name', 'a.action', 'a.entity', 'a.entity_id', 'a.detail');
  if (filter.spaceId) query.where({ 'a.entity': 'space', 'a.entity_id': filter.spaceId });
  if (filter.userId) query.where('a.user_id', filter.userId);
  if (filter.since) query.where('a.at', '>=', filter.since);
  if (filter.before) query.where('a.id', '<', filter.before);
  const rows = await query;
  const page = rows.slice(0, filter.limit);

  // A delete stays restorable until something was restored from it (or it is too old).
  const deletes = page.filter((row) => row.action === 'delete' && restorableEntities.has(row.entity)).map((row) => row.id);
  const restored = new Set<string>();
  if (deletes.length > 0) {
    const later = await db('audit_log')
      .where({ project_id: projectId, action: 'restore' })
      .whereRaw(`detail->>'restoredFrom' = any(?)`, [deletes])
      .select<{ restored_from: string }[]>(db.raw(`detail->>'restoredFrom' as restored_from`));
    for (const row of later) restored.add(row.restored_from);
  }
  // A deleted claim waits in its table; one gone with its space (or past its days) cannot come back.
  const claimIds = page
    .filter((row) => row.action === 'delete' && row.entity === 'additional-allowance' && row.entity_id)
    .map((row) => row.entity_id!);
  const waitingClaims = new Set(
    claimIds.length > 0
      ? (await db('retail_display_claims').whereIn('id', claimIds).whereNotNull('deleted_at').select<{ id: string }[]>('id')).map(
          (row) => row.id,
        )
      : [],
  );
  const oldest = Date.now() - restoreDays * 86_400_000;
  return {
    entries: page.map((row) => ({
      id: String(row.id),
      at: row.at.toISOString(),
      user: row.user_id ? { id: row.user_id, name: row.user_name ?? '' } : null,
      action: row.action,
      entity: row.entity,
      entityId: row.entity_id,
      name: row.detail?.name ?? null,
      before: row.detail?.before ?? null,
      after: row.detail?.after ?? null,
      ...(row.detail?.conversion ? { conversion: row.detail.conversion } : {}),
      ...(row.detail?.copiedFrom ? { copiedFrom: row.detail.copiedFrom } : {}),
      ...(row.detail?.transition ? { transition: row.detail.transition } : {}),
      ...(row.detail?.review ? { review: row.detail.review } : {}),
      ...(row.detail?.package ? { package: row.detail.package } : {}),
      ...(row.detail?.fieldTest ? { fieldTest: row.detail.fieldTest } : {}),
      ...(row.detail?.cutSheet ? { cutSheet: row.detail.cutSheet } : {}),
      ...(row.detail?.replaced ? { replaced: row.detail.replaced } : {}),
      restorable:
        row.action === 'delete' &&
        restorableEntities.has(row.entity) &&
        !restored.has(String(row.id)) &&
        row.at.getTime() >= oldest &&
        (row.entity !== 'additional-allowance' || waitingClaims.has(row.entity_id ?? '')),
    })),
    more: rows.length > filter.limit,
  };
}

/** The people who appear in a project's history, for its filter. */
export async function historyPeople(db: Knex, projectId: string): Promise<{ id: string; name: string }[]> {
  return db('audit_log as a')
    .join('users as u', 'u.id', 'a.user_id')
    .where('a.project_id', projectId)
    .distinct<{ id: string; name: string }[]>('u.id', 'u.name')
    .orderBy('u.name');
}
