import type { Knex } from 'knex';
import { dec, text } from '../compliance/numbers.js';
import type { Database } from '../db/database.js';
import { updateVersioned } from '../db/optimistic.js';
import type { ProjectRole } from '../db/tables.js';
import { AppError } from '../http/app-error.js';
import type { ProjectCreate, ProjectSetupPatch } from './projects.schema.js';

/** The last evaluation's verdict, kept for lists; null until the project is evaluated after its latest change. */
export interface ResultSummary {
  complies: boolean;
  marginPct: string | null;
  dataVersion: string;
}

export interface ProjectSummary {
  id: string;
  name: string;
  state: string;
  role: ProjectRole | null;
  edition: string | null;
  method: string | null;
  version: number;
  updatedAt: string;
  resultSummary: ResultSummary | null;
}

export interface ProjectDetail extends ProjectSummary {
  address: string | null;
  latitude: string | null;
  longitude: string | null;
  timeZone: string | null;
  jurisdiction: string | null;
  units: 'ip' | 'si';
  lightingZone: number | null;
  updatedBy: string | null;
  members: { userId: string; name: string; email: string; role: ProjectRole }[];
}

interface ProjectRow {
  id: string;
  name: string;
  state: string;
  version: number;
  updated_at: Date;
  address: string | null;
  latitude: string | null;
  longitude: string | null;
  time_zone: string | null;
  jurisdiction: string | null;
  edition_id: string | null;
  method: string | null;
  units: 'ip' | 'si';
  lighting_zone: number | null;
  result_summary: ResultSummary | null;
  updated_by_name: string | null;
}

function plain(value: string | null): string | null {
  return value === null ? null : text(dec(value));
}

/** Projects the user is a member of; every project for an administrator. */
export async function listProjectsFor(db: Database, userId: string, isAdmin: boolean): Promise<ProjectSummary[]> {
  const query = db('projects as p')
    .leftJoin('project_members as m', function joinMembership() {
      this.on('m.project_id', '=', 'p.id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select<(Pick<ProjectRow, 'id' | 'name' | 'state' | 'version' | 'updated_at' | 'edition_id' | 'method' | 'result_summary'> & { role: ProjectRole | null })[]>(
      'p.id',
      'p.name',
      'p.state',
      'p.version',
      'p.updated_at',
      'p.edition_id',
      'p.method',
      'p.result_summary',
      'm.role',
    )
    .orderBy('p.name');
  if (!isAdmin) {
    query.whereNotNull('m.role');
  }
  return (await query).map((row) => ({
    id: row.id,
    name: row.name,
    state: row.state,
    role: row.role,
    edition: row.edition_id,
    method: row.method,
    version: row.version,
    updatedAt: row.updated_at.toISOString(),
    resultSummary: row.result_summary,
  }));
}

export async function getProjectDetail(db: Knex, projectId: string, role: ProjectRole | null): Promise<ProjectDetail> {
  const row = await db('projects as p')
    .leftJoin('users as u', 'u.id', 'p.updated_by')
    .where('p.id', projectId)
    .first<ProjectRow | undefined>('p.*', 'u.name as updated_by_name');
  if (!row) throw AppError.notFound('No such project.');
  const members = await db('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', projectId)
    .orderBy(['m.role', 'u.name'])
    .select<{ userId: string; name: string; email: string; role: ProjectRole }[]>('u.id as userId', 'u.name', 'u.email', 'm.role');
  return {
    id: row.id,
    name: row.name,
    state: row.state,
    role,
    edition: row.edition_id,
    method: row.method,
    version: row.version,
    updatedAt: row.updated_at.toISOString(),
    resultSummary: row.result_summary,
    address: row.address,
    latitude: plain(row.latitude),
    longitude: plain(row.longitude),
    timeZone: row.time_zone,
    jurisdiction: row.jurisdiction,
    units: row.units,
    lightingZone: row.lighting_zone,
    updatedBy: row.updated_by_name,
    members,
  };
}

function setupColumns(input: Partial<ProjectCreate>): Record<string, unknown> {
  const columns: Record<string, unknown> = {
    name: input.name,
    address: input.address,
    latitude: input.latitude,
    longitude: input.longitude,
    time_zone: input.timeZone,
    jurisdiction: input.jurisdiction,
    edition_id: input.edition,
    method: input.method,
    units: input.units,
    lighting_zone: input.lightingZone,
  };
  return Object.fromEntries(Object.entries(columns).filter(([, value]) => value !== undefined));
}

/**
 * Keeps the verdict of an evaluation for the project list, unless the design changed while it was
 * being computed (then the stored project no longer matches and nothing is kept).
 */
export async function keepResultSummary(db: Database, projectId: string, designAt: string, summary: ResultSummary): Promise<void> {
  await db('projects').where({ id: projectId }).whereRaw('updated_at = ?::timestamptz', [designAt]).update({ result_summary: JSON.stringify(summary) });
}

/** A new project; its creator is its engineer. */
export async function createProject(db: Database, input: ProjectCreate, userId: string): Promise<string> {
  return db.transaction(async (trx) => {
    const [row] = await trx('projects').insert({ ...setupColumns(input), created_by: userId, updated_by: userId }).returning<{ id: string }[]>('id');
    await trx('project_members').insert({ project_id: row!.id, user_id: userId, role: 'engineer' });
    return row!.id;
  });
}

/** Saves the set-up at the version read; `alongside` runs in the same transaction once the version has checked out. */
export async function updateProjectSetup(
  db: Database,
  projectId: string,
  patch: ProjectSetupPatch,
  userId: string,
  alongside?: (trx: Knex.Transaction) => Promise<void>,
): Promise<void> {
  const { version, ...fields } = patch;
  await db.transaction(async (trx) => {
    await updateVersioned(trx, 'projects', { id: projectId }, version, { ...setupColumns(fields), result_summary: null }, userId, 'The project set-up');
    if (alongside) await alongside(trx);
  });
}
