import type { Knex } from 'knex';
import type { PackageFileRecord, PackageJobRow } from '../db/tables.js';

/** A job as the route answers it, with the revision it made once done. */
export interface PackageJobRecord {
  id: string;
  projectId: string;
  state: PackageJobRow['state'];
  step: PackageJobRow['step'];
  progress: number;
  error: string | null;
  made: { id: string; number: number; draft: boolean; fingerprint: string; files: PackageFileRecord[] } | null;
}

interface JobRow extends PackageJobRow {
  number: number | null;
  draft: boolean | null;
  fingerprint: string | null;
  files: PackageFileRecord[] | null;
}

const jobColumns = ['j.*', 'r.number', 'r.draft', 'r.fingerprint', 'r.files'] as const;

function record(row: JobRow): PackageJobRecord {
  return {
    id: row.id,
    projectId: row.project_id,
    state: row.state,
    step: row.step,
    progress: row.progress,
    error: row.error,
    made:
      row.revision_id === null || row.number === null
        ? null
        : { id: row.revision_id, number: row.number, draft: row.draft ?? true, fingerprint: row.fingerprint ?? '', files: row.files ?? [] },
  };
}

export async function getPackageJob(db: Knex, projectId: string, jobId: string): Promise<PackageJobRecord | undefined> {
  const row = await db('package_jobs as j')
    .leftJoin('package_revisions as r', 'r.id', 'j.revision_id')
    .where({ 'j.project_id': projectId, 'j.id': jobId })
    .first<JobRow | undefined>(...jobColumns);
  return row ? record(row) : undefined;
}

/** The project's queued or running job, if any. */
export async function openPackageJob(db: Knex, projectId: string): Promise<PackageJobRecord | undefined> {
  const row = await db('package_jobs as j')
    .leftJoin('package_revisions as r', 'r.id', 'j.revision_id')
    .where({ 'j.project_id': projectId })
    .whereIn('j.state', ['queued', 'running'])
    .first<JobRow | undefined>(...jobColumns);
  return row ? record(row) : undefined;
}

/**
 * Queues a job for the project, or finds the one already queued or running (the partial unique
 * index keeps it to one, even when two requests race). `created` says which.
 */
export async function queuePackageJob(
  db: Knex,
  job: { id: string; projectId: string; requestedBy: string },
): Promise<{ job: PackageJobRecord; created: boolean }> {
  const inserted = await db.raw<{ rows: { id: string }[] }>(
    `insert into package_jobs (id, project_id, requested_by) values (?, ?, ?)
     on conflict (project_id) where state in ('queued', 'running') do nothing returning id`,
    [job.id, job.projectId, job.requestedBy],
  );
  if (inserted.rows.length === 1) return { job: (await getPackageJob(db, job.projectId, job.id))!, created: true };
  const open = await openPackageJob(db, job.projectId);
  // Finished between the insert and this read: queue again.
  return open ? { job: open, created: false } : queuePackageJob(db, job);
}

export async function startPackageJob(db: Knex, jobId: string): Promise<boolean> {
  const updated = await db('package_jobs')
    .where({ id: jobId, state: 'queued' })
    .update({ state: 'running', step: 'evaluate', progress: 0 });
  return updated === 1;
}

export async function packageJobStep(db: Knex, jobId: string, step: NonNullable<PackageJobRow['step']>, progress: number): Promise<void> {
  await db('package_jobs').where({ id: jobId, state: 'running' }).update({ step, progress });
}

export async function finishPackageJob(db: Knex, jobId: string, outcome: { revisionId: string } | { error: string }): Promise<void> {
  await db('package_jobs')
    .where({ id: jobId })
    .whereIn('state', ['queued', 'running'])
    .update(
      'revisionId' in outcome
        ? { state: 'done', progress: 100, step: null, revision_id: outcome.revisionId, finished_at: db.fn.now() }
        : { state: 'failed', error: outcome.error.slice(0, 500), finished_at: db.fn.now() },
    );
}

/** Jobs left running by a server that stopped mid-way: failed, in words, so the project may ask again. */
export async function failAbandonedPackageJobs(db: Knex, error: string): Promise<number> {
  return db('package_jobs').where({ state: 'running' }).update({ state: 'failed', error, finished_at: db.fn.now() });
}
