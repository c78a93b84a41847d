import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import { openVerdicts } from '../review/review-items.repository.js';

/** One project of a reviewer's digest. */
export interface DigestRow {
  projectId: string;
  name: string;
  /** When it was last submitted for review (its last move into review). */
  submittedAt: Date;
  /** The open round's check items still without a verdict, and those that need revision. */
  open: number;
  needsRevision: number;
}

/** The accounts that chose the digest and can still sign in. */
export async function digestRecipients(db: Database): Promise<{ id: string; email: string; name: string }[]> {
  return db('users').where({ review_digest: true }).whereNull('disabled_at').orderBy('email').select('id', 'email', 'name');
}

/**
 * What one reviewer's digest lists: the projects in review where they are a reviewer, longest
 * waiting first, each with its open round's counts of items without a verdict and needing revision.
 */
export async function digestRows(trx: Knex.Transaction, userId: string): Promise<DigestRow[]> {
  const rows: { id: string; name: string; submitted_at: Date }[] = await trx('projects as p')
    .join('project_members as m', 'm.project_id', 'p.id')
    .where({ 'm.user_id': userId, 'm.role': 'reviewer', 'p.state': 'in-review' })
    .whereNull('p.archived_at')
    .select(
      'p.id',
      'p.name',
      // A project put in review before the moves were audited waits since its last change.
      trx.raw(
        `coalesce((select max(a.at) from audit_log a
                    where a.project_id = p.id and a.action = 'transition' and a.detail -> 'transition' ->> 'to' = 'in-review'),
                  p.updated_at) as submitted_at`,
      ),
    )
    .orderBy([{ column: 'submitted_at' }, { column: 'p.name' }]);
  const listed: DigestRow[] = [];
  for (const row of rows) {
    const counts = await openVerdicts(trx, row.id);
    listed.push({ projectId: row.id, name: row.name, submittedAt: row.submitted_at, ...counts });
  }
  return listed;
}

/**
 * Claims the person's digest for one day in the caller's transaction. Only one claim of a day can
 * commit, whichever process makes it, so a digest is never sent twice; false when already claimed.
 */
export async function claimDigestDay(trx: Knex.Transaction, userId: string, day: string): Promise<boolean> {
  const claimed = await trx('review_digests').insert({ user_id: userId, day }).onConflict(['user_id', 'day']).ignore().returning('user_id');
  return claimed.length > 0;
}

export async function recordDigestMail(trx: Knex.Transaction, userId: string, day: string, mailId: string): Promise<void> {
  await trx('review_digests').where({ user_id: userId, day }).update({ mail_id: mailId });
}
