import type { Knex } from 'knex';
import type { EvaluationResult } from '../../../contract/result.js';
import type { PackageFileRecord, PackageRevisionRow } from '../db/tables.js';

/** A revision as listed: everything but the frozen document and result. */
export interface PackageRevisionSummary {
  id: string;
  number: number;
  draft: boolean;
  designRevision: number;
  fingerprint: string;
  files: PackageFileRecord[];
  madeAt: string;
  madeBy: string | null;
}

type SummaryRow = Omit<PackageRevisionRow, 'document' | 'result' | 'project_id' | 'project_name'> & { made_by_name: string | null };

const summaryColumns = [
  'r.id',
  'r.number',
  'r.draft',
  'r.design_revision',
  'r.fingerprint',
  'r.files',
  'r.made_by',
  'r.made_at',
  'u.name as made_by_name',
] as const;

function summary(row: SummaryRow): PackageRevisionSummary {
  return {
    id: row.id,
    number: row.number,
    draft: row.draft,
    designRevision: row.design_revision,
    fingerprint: row.fingerprint,
    files: row.files,
    madeAt: row.made_at.toISOString(),
    madeBy: row.made_by_name,
  };
}

/** The project's package revisions, oldest first. */
export async function listRevisions(db: Knex, projectId: string): Promise<PackageRevisionSummary[]> {
  const rows = await db('package_revisions as r')
    .leftJoin('users as u', 'u.id', 'r.made_by')
    .where('r.project_id', projectId)
    .orderBy('r.number')
    .select<SummaryRow[]>(...summaryColumns);
  return rows.map(summary);
}

/** One revision of the project with its frozen result; undefined when the project has no such revision. */
export async function getRevision(
  db: Knex,
  projectId: string,
  revisionId: string,
): Promise<(PackageRevisionSummary & { result: EvaluationResult }) | undefined> {
  const row = await db('package_revisions as r')
    .leftJoin('users as u', 'u.id', 'r.made_by')
    .where({ 'r.project_id': projectId, 'r.id': revisionId })
    .first<(SummaryRow & { result: EvaluationResult }) | undefined>(...summaryColumns, 'r.result');
  return row ? { ...summary(row), result: row.result } : undefined;
}

/** The number the project's next revision takes; read under the project's row lock. */
export async function nextRevisionNumber(trx: Knex.Transaction, projectId: string): Promise<number> {
  const row = await trx('package_revisions').where({ project_id: projectId }).max<{ max: number | null }>('number as max').first();
  return (row?.max ?? 0) + 1;
}

export interface NewRevision {
  id: string;
  projectId: string;
  number: number;
  draft: boolean;
  projectName: string;
  designRevision: number;
  fingerprint: string;
  document: unknown;
  result: EvaluationResult;
  files: PackageFileRecord[];
  madeBy: string;
  madeAt: Date;
}

export async function insertRevision(trx: Knex.Transaction, revision: NewRevision): Promise<void> {
  await trx('package_revisions').insert({
    id: revision.id,
    project_id: revision.projectId,
    number: revision.number,
    draft: revision.draft,
    project_name: revision.projectName,
    design_revision: revision.designRevision,
    fingerprint: revision.fingerprint,
    document: JSON.stringify(revision.document),
    result: JSON.stringify(revision.result),
    files: JSON.stringify(revision.files),
    made_by: revision.madeBy,
    made_at: revision.madeAt,
  });
}

/** Whether a final (not draft) package was made of this design revision: what issuing it needs. */
export async function hasFinalPackage(db: Knex, projectId: string, designRevision: number): Promise<boolean> {
  const row = await db('package_revisions').where({ project_id: projectId, design_revision: designRevision, draft: false }).first('id');
  return row !== undefined;
}

/** What the public check tells of final packages with a fingerprint: the project's name and revision as issued, and when. */
export async function finalPackagesByFingerprint(
  db: Knex,
  fingerprint: string,
): Promise<{ projectName: string; number: number; issuedAt: string }[]> {
  const rows = await db('package_revisions')
    .where({ fingerprint, draft: false })
    .orderBy('made_at')
    .select<{ project_name: string; number: number; made_at: Date }[]>('project_name', 'number', 'made_at');
  return rows.map((row) => ({ projectName: row.project_name, number: row.number, issuedAt: row.made_at.toISOString() }));
}
