import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import type { FieldTestSummary } from '../../../contract/field-tests.js';
import { dec, text } from '../compliance/numbers.js';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import { updateVersioned } from '../db/optimistic.js';
import { lockProject } from '../db/project-lock.js';
import type { ProjectRole, ProjectRow } from '../db/tables.js';
import { NotFound } from '../domain-errors.js';
import { carriedOrigin } from '../db/unit-origin.js';
import { permitColumns, type ProjectCreate, type ProjectSetupPatch } from './projects.schema.js';

/** The last evaluation's verdict, kept for lists; null until the project is evaluated after its latest change. */
export interface ResultSummary {
  complies: boolean;
  /** Absent in summaries kept before verdicts could be incomplete. */
  verdict?: 'complies' | 'does-not-comply' | 'incomplete';
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
  revision: number;
  updatedAt: string;
  resultSummary: ResultSummary | null;
  /** Where the field tests stand, as last read from the test plan; null until then or after a design change. */
  fieldTests: FieldTestSummary | null;
  /** When the project was archived; archived projects are read-only and listed apart. */
  archivedAt: string | null;
}

type PermitField = keyof typeof permitColumns;

/** The permit office's fields; null where not entered. */
export type PermitFields = { [Field in PermitField]: Field extends 'scope' ? ProjectCreate['scope'] | null : string | null };

export interface ProjectDetail extends ProjectSummary, PermitFields {
  address: string | null;
  latitude: string | null;
  longitude: string | null;
  timeZone: string | null;
  jurisdiction: string | null;
  units: 'ip' | 'si';
  lightingZone: number | null;
  /** The jurisdiction amendments the project follows over the model code. */
  amendments: string[];
  updatedBy: string | null;
  members: { userId: string; name: string; email: string; role: ProjectRole }[];
}

/** A project as read, with the name of who last changed it. */
type ProjectRead = ProjectRow & { updated_by_name: string | null };

function permitFields(row: Record<string, unknown>): PermitFields {
  const fields = Object.fromEntries(
    Object.entries(permitColumns).map(([field, column]) => [field, (row[column] as string | null | undefined) ?? null]),
  ) as PermitFields;
  fields.grossFloorArea = plain(fields.grossFloorArea);
  return fields;
}

function plain(value: string | null): string | null {
  return value === null ? null : text(dec(value));
}

/** Projects the user is a member of (every project for an administrator), current or archived. */
export async function listProjectsFor(db: Database, userId: string, isAdmin: boolean, archived = false): Promise<ProjectSummary[]> {
  const query = db('projects as p')
    .leftJoin('project_members as m', function joinMembership() {
      this.on('m.project_id', '=', 'p.id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select<
      (Pick<
        ProjectRow,
        | 'id'
        | 'name'
        | 'state'
        | 'version'
        | 'revision'
        | 'updated_at'
        | 'edition_id'
        | 'method'
        | 'result_summary'
        | 'field_test_summary'
        | 'archived_at'
      > & {
        role: ProjectRole | null;
      })[]
    >(
      'p.id',
      'p.name',
      'p.state',
      'p.version',
      'p.revision',
      'p.updated_at',
      'p.edition_id',
      'p.method',
      'p.result_summary',
      'p.field_test_summary',
      'p.archived_at',
      'm.role',
    )
    .orderBy('p.name');
  if (archived) query.whereNotNull('p.archived_at');
  else query.whereNull('p.archived_at');
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
    revision: row.revision,
    updatedAt: row.updated_at.toISOString(),
    resultSummary: row.result_summary,
    fieldTests: row.field_test_summary,
    archivedAt: row.archived_at?.toISOString() ?? null,
  }));
}

export async function getProjectDetail(db: Knex, projectId: string, role: ProjectRole | null): Promise<ProjectDetail> {
  const row = await db('projects as p')
    .leftJoin('users as u', 'u.id', 'p.updated_by')
    .where('p.id', projectId)
    .first<ProjectRead | undefined>('p.*', 'u.name as updated_by_name');
  if (!row) throw new NotFound('No such project.');
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
    revision: row.revision,
    updatedAt: row.updated_at.toISOString(),
    resultSummary: row.result_summary,
    fieldTests: row.field_test_summary,
    archivedAt: row.archived_at?.toISOString() ?? null,
    address: row.address,
    latitude: plain(row.latitude),
    longitude: plain(row.longitude),
    timeZone: row.time_zone,
    jurisdiction: row.jurisdiction,
    units: row.units,
    lightingZone: row.lighting_zone,
    amendments: row.amendments,
    updatedBy: row.updated_by_name,
    ...permitFields(row as unknown as Record<string, unknown>),
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
    amendments: input.amendments,
    ...Object.fromEntries(Object.entries(permitColumns).map(([field, column]) => [column, input[field as PermitField]])),
  };
  return Object.fromEntries(Object.entries(columns).filter(([, value]) => value !== undefined));
}

/**
 * When the project's design last changed, as PostgreSQL's text (a JavaScript Date would drop the
 * microseconds that `keepResultSummary` compares); null for no such project.
 */
/** What an evaluation of the project needs from its set-up. */
export interface ProjectSetup {
  edition_id: string | null;
  amendments: string[];
  method: 'building-area' | 'space-by-space' | null;
  units: 'ip' | 'si';
  lighting_zone: number | null;
}

export async function projectSetup(db: Knex, projectId: string): Promise<ProjectSetup | undefined> {
  return db('projects')
    .where({ id: projectId })
    .first<ProjectSetup | undefined>('edition_id', 'method', 'units', 'lighting_zone', 'amendments');
}

/** Where the site is, for its astronomical clock: null where the set-up leaves it blank. */
export interface ProjectSite {
  latitude: string | null;
  longitude: string | null;
  timeZone: string | null;
  editionId: string | null;
}

export async function projectSite(db: Knex, projectId: string): Promise<ProjectSite | undefined> {
  const row = await db('projects')
    .where({ id: projectId })
    .first<Pick<ProjectRow, 'latitude' | 'longitude' | 'time_zone' | 'edition_id'> | undefined>(
      'latitude',
      'longitude',
      'time_zone',
      'edition_id',
    );
  return row && { latitude: row.latitude, longitude: row.longitude, timeZone: row.time_zone, editionId: row.edition_id };
}

export async function designChangedAt(db: Database, projectId: string): Promise<string | null> {
  const row = await db('projects')
    .where({ id: projectId })
    .first<{ design_at: string } | undefined>(db.raw('updated_at::text as design_at'));
  return row?.design_at ?? null;
}

/** What every route under a project reads of it before its own work. */
export interface ProjectForAccess {
  id: string;
  name: string;
  editionId: string | null;
  method: string | null;
  units: 'ip' | 'si';
  archivedAt: Date | null;
}

/** The project and the person's role on it (null when not a member), in one query; undefined for no such project. */
export async function projectForMember(
  db: Database,
  projectId: string,
  userId: string,
): Promise<{ project: ProjectForAccess; role: ProjectRole | null } | undefined> {
  const row = await db('projects as p')
    .leftJoin('project_members as m', function joinMembership() {
      this.on('m.project_id', '=', 'p.id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .where('p.id', projectId)
    .first<
      (Pick<ProjectRow, 'id' | 'name' | 'edition_id' | 'method' | 'units' | 'archived_at'> & { role: ProjectRole | null }) | undefined
    >('p.id', 'p.name', 'p.edition_id', 'p.method', 'p.units', 'p.archived_at', 'm.role');
  if (!row) return undefined;
  return {
    project: { id: row.id, name: row.name, editionId: row.edition_id, method: row.method, units: row.units, archivedAt: row.archived_at },
    role: row.role,
  };
}

/**
 * Keeps the verdict of an evaluation for the project list, unless the design changed while it was
 * being computed (then the stored project no longer matches and nothing is kept).
 */
export async function keepResultSummary(db: Database, projectId: string, designAt: string, summary: ResultSummary): Promise<void> {
  await db('projects')
    .where({ id: projectId })
    .whereRaw('updated_at = ?::timestamptz', [designAt])
    .update({ result_summary: JSON.stringify(summary) });
}

/**
 * Keeps where the field tests stand for the project list, unless the design changed while the
 * plan was being made (then the stored project no longer matches and nothing is kept).
 */
export async function keepFieldTestSummary(db: Database, projectId: string, designAt: string, summary: FieldTestSummary): Promise<void> {
  await db('projects')
    .where({ id: projectId })
    .whereRaw('updated_at = ?::timestamptz', [designAt])
    .update({ field_test_summary: JSON.stringify(summary) });
}

/** A new project; its creator is its engineer. */
export async function createProject(db: Database, input: ProjectCreate, userId: string): Promise<string> {
  return db.transaction(async (trx) => {
    const [row] = await trx('projects')
      .insert({ ...setupColumns(input), created_by: userId, updated_by: userId })
      .returning<{ id: string }[]>('id');
    await trx('project_members').insert({ project_id: row!.id, user_id: userId, role: 'engineer' });
    await recordAudit(trx, {
      userId,
      projectId: row!.id,
      action: 'create',
      entity: 'project',
      entityId: row!.id,
      detail: { name: input.name, after: await setupRecord(trx, row!.id) },
    });
    return row!.id;
  });
}

/** The set-up as the history keeps it, before and after a change. */
async function setupRecord(trx: Knex, projectId: string): Promise<Record<string, unknown>> {
  const row = await trx('projects').where({ id: projectId }).first();
  if (!row) throw new NotFound('No such project.');
  return {
    name: row.name,
    address: row.address,
    latitude: plain(row.latitude),
    longitude: plain(row.longitude),
    timeZone: row.time_zone,
    jurisdiction: row.jurisdiction,
    edition: row.edition_id,
    method: row.method,
    units: row.units,
    lightingZone: row.lighting_zone,
    amendments: row.amendments,
    ...permitFields(row as unknown as Record<string, unknown>),
    version: row.version,
  };
}

/**
 * Saves the set-up at the version read; `alongside` (a change of units) runs in the same
 * transaction once the version has checked out. The history records the set-up before and after.
 */
export async function updateProjectSetup(
  db: Database,
  projectId: string,
  patch: ProjectSetupPatch,
  userId: string,
  alongside?: (trx: Knex.Transaction) => Promise<Record<string, unknown>>,
): Promise<void> {
  const { version, ...fields } = patch;
  await db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const stored = await trx('projects').where({ id: projectId }).first();
    if (!stored) throw new NotFound('No such project.');
    const before = await setupRecord(trx, projectId);
    const columns = setupColumns(fields);
    const origin = carriedOrigin(stored.unit_origin, { ...stored }, { gross_floor_area: stored.gross_floor_area, ...columns });
    await updateVersioned(
      trx,
      'projects',
      { id: projectId },
      version,
      { ...columns, unit_origin: origin, result_summary: null, field_test_summary: null },
      userId,
      'The project set-up',
    );
    const conversion = alongside ? await alongside(trx) : undefined;
    const after = await setupRecord(trx, projectId);
    await recordAudit(trx, {
      userId,
      projectId,
      action: conversion ? 'convert-units' : 'update',
      entity: 'project',
      entityId: projectId,
      detail: { name: String(after['name']), before, after, ...(conversion ? { conversion } : {}) },
    });
  });
}

/** Archives a project (read-only, listed apart) or brings it back. */
export async function setProjectArchived(db: Database, projectId: string, archived: boolean, userId: string): Promise<void> {
  await db.transaction(async (trx) => {
    const project = await lockProject(trx, projectId, { allowArchived: true, anyState: true });
    if ((project.archived_at !== null) === archived) return;
    await trx('projects')
      .where({ id: projectId })
      .update({ archived_at: archived ? trx.fn.now() : null, archived_by: archived ? userId : null });
    const { name } = await trx('projects').where({ id: projectId }).first<{ name: string }>('name');
    await recordAudit(trx, {
      userId,
      projectId,
      action: archived ? 'archive' : 'unarchive',
      entity: 'project',
      entityId: projectId,
      detail: { name },
    });
  });
}

/** Copies rows of one project's table to another, keeping every column but the ones given. */
async function copyRows(
  trx: Knex.Transaction,
  table: string,
  rows: Record<string, unknown>[],
  change: (row: Record<string, unknown>) => Record<string, unknown>,
): Promise<void> {
  if (rows.length === 0) return;
  await trx.batchInsert(table, rows.map(change), 500).transacting(trx);
}

/**
 * A copy of a project as a new draft, for a similar building or to try another method: the set-up,
 * the permit fields, every space with what is in it, the luminaire types and exterior lighting.
 * The person copying is its engineer; the team, the history and any review are not copied.
 */
export async function copyProject(db: Database, sourceId: string, name: string, userId: string): Promise<string> {
  return db.transaction(async (trx) => {
    const source = await lockProject(trx, sourceId, { allowArchived: true, anyState: true });
    const row = await trx('projects').where({ id: source.id }).first<Record<string, unknown>>();
    const {
      id: _id,
      state: _state,
      version: _version,
      revision: _revision,
      created_by: _createdBy,
      created_at: _createdAt,
      updated_at: _updatedAt,
      updated_by: _updatedBy,
      result_summary: _summary,
      field_test_summary: _fieldTests,
      archived_at: _archivedAt,
      archived_by: _archivedBy,
      ...setup
    } = row;
    const [copy] = await trx('projects')
      .insert({ ...setup, name, created_by: userId, updated_by: userId })
      .returning<{ id: string }[]>('id');
    const projectId = copy!.id;
    await trx('project_members').insert({ project_id: projectId, user_id: userId, role: 'engineer' });

    const stamp = { version: 1, updated_by: userId, created_at: trx.fn.now(), updated_at: trx.fn.now() };
    const types = await trx('luminaire_types').where({ project_id: sourceId }).select<Record<string, unknown>[]>('*');
    const typeIds = new Map(types.map((type) => [type['id'] as string, randomUUID()]));
    await copyRows(trx, 'luminaire_types', types, (type) => ({
      ...type,
      ...stamp,
      id: typeIds.get(type['id'] as string),
      project_id: projectId,
    }));

    const spaces = await trx('spaces').where({ project_id: sourceId }).select<Record<string, unknown>[]>('*');
    const spaceIds = new Map(spaces.map((space) => [space['id'] as string, randomUUID()]));
    await copyRows(trx, 'spaces', spaces, (space) => ({
      ...space,
      ...stamp,
      id: spaceIds.get(space['id'] as string),
      project_id: projectId,
    }));
    const sourceSpaces = trx('spaces').select('id').where({ project_id: sourceId });
    for (const table of ['space_luminaires', 'space_controls', 'space_windows', 'space_skylights']) {
      const children = await trx(table).whereIn('space_id', sourceSpaces).select<Record<string, unknown>[]>('*');
      await copyRows(trx, table, children, (child) => ({
        ...child,
        space_id: spaceIds.get(child['space_id'] as string),
        ...(child['luminaire_type_id'] ? { luminaire_type_id: typeIds.get(child['luminaire_type_id'] as string) } : {}),
      }));
    }
    const exterior = await trx('exterior_applications').where({ project_id: sourceId }).select<Record<string, unknown>[]>('*');
    await copyRows(trx, 'exterior_applications', exterior, (application) => ({
      ...application,
      ...stamp,
      id: randomUUID(),
      project_id: projectId,
      controls: JSON.stringify(application['controls']),
    }));
    const claims = await trx('retail_display_claims')
      .where({ project_id: sourceId })
      .whereNull('deleted_at')
      .select<Record<string, unknown>[]>('*');
    await copyRows(trx, 'retail_display_claims', claims, (claim) => ({
      ...claim,
      ...stamp,
      id: randomUUID(),
      project_id: projectId,
      space_id: spaceIds.get(claim['space_id'] as string),
    }));
    const aliases = await trx('project_import_aliases').where({ project_id: sourceId }).select<Record<string, unknown>[]>('*');
    await copyRows(trx, 'project_import_aliases', aliases, (alias) => ({ ...alias, project_id: projectId, updated_by: userId }));

    await recordAudit(trx, {
      userId,
      projectId,
      action: 'copy',
      entity: 'project',
      entityId: projectId,
      detail: { name, copiedFrom: { id: sourceId, name: row['name'] }, after: await setupRecord(trx, projectId) },
    });
    return projectId;
  });
}

/** Writes a project's review state with the revision and version the move gives it; answers the version written. */
export async function setReviewState(
  trx: Knex,
  projectId: string,
  next: { state: ProjectRow['state']; revision: number; version: number },
  userId: string,
): Promise<number> {
  const [updated] = await trx('projects')
    .where({ id: projectId })
    .update({ ...next, updated_at: trx.fn.now(), updated_by: userId })
    .returning('version');
  if (!updated) throw new NotFound('No such project.');
  return updated.version;
}
