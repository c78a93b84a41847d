import type { Knex } from 'knex';
import { dec, text } from '../compliance/numbers.js';
import type { Database } from '../db/database.js';
import { deleteVersioned, updateVersioned, type VersionedRow } from '../db/optimistic.js';
import { AppError, type ErrorDetail } from '../http/app-error.js';
import type { ExteriorApplicationInput, LuminaireTypeInput, SpaceInput } from './design.schema.js';

/** A NUMERIC column's string in plain form ("12.5000" → "12.5"); absent stays absent. */
function decimal(value: string | null | undefined): string | undefined {
  return value === null || value === undefined ? undefined : text(dec(value));
}

function defined<T extends Record<string, unknown>>(record: T): T {
  return Object.fromEntries(Object.entries(record).filter(([, value]) => value !== undefined && value !== null)) as T;
}

interface Stamp {
  version: number;
  updatedAt: string;
  updatedBy: string | null;
}

function stamp(row: VersionedRow & { updated_by_name?: string | null }): Stamp {
  return { version: row.version, updatedAt: row.updated_at.toISOString(), updatedBy: row.updated_by_name ?? null };
}

// ---------------------------------------------------------------- luminaire types

interface LuminaireTypeRow extends VersionedRow {
  project_id: string;
  tag: string;
  description: string;
  input_watts: string;
  use: LuminaireTypeInput['use'];
  exempt_reason: string | null;
  basis: LuminaireTypeInput['basis'];
  length: string | null;
  limit_watts: string | null;
  wattage_source: string | null;
  updated_by_name?: string | null;
}

export type LuminaireTypeRecord = LuminaireTypeInput & Stamp & { id: string };

function luminaireTypeRecord(row: LuminaireTypeRow): LuminaireTypeRecord {
  return {
    id: row.id,
    ...defined({
      tag: row.tag,
      description: row.description,
      inputWatts: decimal(row.input_watts)!,
      use: row.use,
      exemptReason: row.exempt_reason ?? undefined,
      basis: row.basis,
      length: decimal(row.length),
      limitWatts: decimal(row.limit_watts),
      wattageSource: row.wattage_source ?? undefined,
    }),
    ...stamp(row),
  } as LuminaireTypeRecord;
}

function luminaireTypeColumns(input: LuminaireTypeInput): Record<string, unknown> {
  return {
    tag: input.tag,
    description: input.description,
    input_watts: input.inputWatts,
    use: input.use,
    exempt_reason: input.use === 'exempt' ? (input.exemptReason ?? null) : null,
    basis: input.basis,
    length: input.length ?? null,
    limit_watts: input.limitWatts ?? null,
    wattage_source: input.wattageSource ?? null,
  };
}

function withUpdaterName(db: Knex, table: string) {
  return db(`${table} as t`).leftJoin('users as u', 'u.id', 't.updated_by').select('t.*', 'u.name as updated_by_name');
}

export async function listLuminaireTypes(db: Knex, projectId: string): Promise<LuminaireTypeRecord[]> {
  const rows: LuminaireTypeRow[] = await withUpdaterName(db, 'luminaire_types').where('t.project_id', projectId).orderBy('t.tag');
  return rows.map(luminaireTypeRecord);
}

async function oneLuminaireType(db: Knex, id: string): Promise<LuminaireTypeRecord> {
  const row: LuminaireTypeRow = await withUpdaterName(db, 'luminaire_types').where('t.id', id).first();
  return luminaireTypeRecord(row);
}

async function assertTagFree(trx: Knex, projectId: string, tag: string, exceptId?: string): Promise<void> {
  const query = trx('luminaire_types').where({ project_id: projectId, tag });
  if (exceptId) query.whereNot({ id: exceptId });
  if (await query.first('id')) {
    throw AppError.conflict(`A luminaire type tagged "${tag}" already exists in this project.`, [{ path: 'tag', message: 'Tags are unique within a project.' }]);
  }
}

export async function createLuminaireType(db: Database, projectId: string, input: LuminaireTypeInput, userId: string): Promise<LuminaireTypeRecord> {
  return db.transaction(async (trx) => {
    await assertTagFree(trx, projectId, input.tag);
    const [row] = await trx('luminaire_types').insert({ project_id: projectId, ...luminaireTypeColumns(input), updated_by: userId }).returning<{ id: string }[]>('id');
    await touchProject(trx, projectId);
    return oneLuminaireType(trx, row!.id);
  });
}

export async function replaceLuminaireType(db: Database, projectId: string, id: string, version: number, input: LuminaireTypeInput, userId: string): Promise<LuminaireTypeRecord> {
  return db.transaction(async (trx) => {
    await assertTagFree(trx, projectId, input.tag, id);
    await updateVersioned(trx, 'luminaire_types', { id, project_id: projectId }, version, luminaireTypeColumns(input), userId, 'This luminaire type');
    await touchProject(trx, projectId);
    return oneLuminaireType(trx, id);
  });
}

export async function deleteLuminaireType(db: Database, projectId: string, id: string, version: number): Promise<void> {
  await db.transaction(async (trx) => {
    const users = await trx('space_luminaires as l').join('spaces as s', 's.id', 'l.space_id').where('l.luminaire_type_id', id).distinct<{ name: string }[]>('s.name');
    if (users.length > 0) {
      const names = users.map((space) => space.name).sort();
      throw AppError.conflict(`This luminaire type is still counted in ${names.length} space(s): ${names.slice(0, 5).join(', ')}${names.length > 5 ? ', …' : ''}. Remove those counts first.`);
    }
    await deleteVersioned(trx, 'luminaire_types', { id, project_id: projectId }, version, 'This luminaire type');
    await touchProject(trx, projectId);
  });
}

// ---------------------------------------------------------------- spaces

interface SpaceRow extends VersionedRow {
  project_id: string;
  position: number;
  name: string;
  level: string;
  space_type: string | null;
  building_area_type: string | null;
  control_space_type: string | null;
  area: string;
  ceiling_height: string | null;
  length: string | null;
  width: string | null;
  luminaire_height: string | null;
  work_plane_height: string | null;
  enclosed: boolean | null;
  updated_by_name?: string | null;
}

interface SpaceLuminaireRow {
  space_id: string;
  position: number;
  luminaire_type_id: string;
  tag: string;
  count: number;
  zone: SpaceInput['luminaires'][number]['zone'] | null;
}

interface SpaceControlRow {
  space_id: string;
  strategy: string;
  provided: boolean;
  timeout_minutes: string | null;
  zone_size: string | null;
  auto_on: SpaceInput['controls'][number]['autoOn'] | null;
  device: string | null;
  exception_reason: SpaceInput['controls'][number]['exceptionReason'] | null;
  exception_note: string | null;
}

interface SpaceWindowRow {
  space_id: string;
  position: number;
  width: string;
  head_height: string;
  sill_height: string | null;
  wall: SpaceInput['windows'][number]['wall'] | null;
  offset: string | null;
}

interface SpaceSkylightRow {
  space_id: string;
  position: number;
  length: string;
  width: string;
  x: string | null;
  y: string | null;
}

export type SpaceRecord = Omit<SpaceInput, 'luminaires'> & Stamp & { id: string; position: number; luminaires: (SpaceInput['luminaires'][number] & { luminaireTypeId: string })[] };

function groupBy<Row extends { space_id: string }>(rows: Row[]): Map<string, Row[]> {
  const groups = new Map<string, Row[]>();
  for (const row of rows) {
    const group = groups.get(row.space_id);
    if (group) group.push(row);
    else groups.set(row.space_id, [row]);
  }
  return groups;
}

async function spaceRecords(db: Knex, rows: SpaceRow[]): Promise<SpaceRecord[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((row) => row.id);
  const inIds = (query: Knex.QueryBuilder) => (ids.length > 500 ? query.whereIn('space_id', db('spaces').select('id').where('project_id', rows[0]!.project_id)) : query.whereIn('space_id', ids));
  const queries = [
    () => inIds(db('space_luminaires as l').join('luminaire_types as t', 't.id', 'l.luminaire_type_id').select('l.*', 't.tag')).orderBy(['space_id', 'position']),
    () => inIds(db('space_controls').select('*')).orderBy(['space_id', 'strategy']),
    () => inIds(db('space_windows').select('*')).orderBy(['space_id', 'position']),
    () => inIds(db('space_skylights').select('*')).orderBy(['space_id', 'position']),
  ];
  // A transaction has one connection, so its queries go one after another; otherwise in parallel.
  const results: unknown[][] = [];
  if (db.isTransaction) {
    for (const query of queries) results.push(await query());
  } else {
    results.push(...(await Promise.all(queries.map((query) => query()))));
  }
  const [luminaires, controls, windows, skylights] = results as [SpaceLuminaireRow[], SpaceControlRow[], SpaceWindowRow[], SpaceSkylightRow[]];
  const luminairesBySpace = groupBy(luminaires);
  const controlsBySpace = groupBy(controls);
  const windowsBySpace = groupBy(windows);
  const skylightsBySpace = groupBy(skylights);
  return rows.map((row) => ({
    id: row.id,
    position: row.position,
    ...(defined({
      name: row.name,
      level: row.level === '' ? undefined : row.level,
      spaceType: row.space_type,
      buildingAreaType: row.building_area_type,
      controlSpaceType: row.control_space_type,
      area: decimal(row.area)!,
      ceilingHeight: decimal(row.ceiling_height),
      length: decimal(row.length),
      width: decimal(row.width),
      luminaireHeight: decimal(row.luminaire_height),
      workPlaneHeight: decimal(row.work_plane_height),
      enclosed: row.enclosed,
    }) as Omit<SpaceInput, 'luminaires' | 'controls' | 'windows' | 'skylights'>),
    luminaires: (luminairesBySpace.get(row.id) ?? []).map((group) => defined({ tag: group.tag, count: String(group.count), zone: group.zone, luminaireTypeId: group.luminaire_type_id })),
    controls: (controlsBySpace.get(row.id) ?? []).map((control) =>
      defined({
        strategy: control.strategy,
        provided: control.provided,
        timeoutMinutes: decimal(control.timeout_minutes),
        zoneSize: decimal(control.zone_size),
        autoOn: control.auto_on,
        device: control.device,
        exceptionReason: control.exception_reason,
        exceptionNote: control.exception_note,
      }),
    ),
    windows: (windowsBySpace.get(row.id) ?? []).map((opening) =>
      defined({ width: decimal(opening.width)!, headHeight: decimal(opening.head_height)!, sillHeight: decimal(opening.sill_height), wall: opening.wall ?? 'south', offset: decimal(opening.offset) }),
    ),
    skylights: (skylightsBySpace.get(row.id) ?? []).map((skylight) =>
      defined({ length: decimal(skylight.length)!, width: decimal(skylight.width)!, x: decimal(skylight.x), y: decimal(skylight.y) }),
    ),
    ...stamp(row),
  })) as SpaceRecord[];
}

export async function listSpaces(db: Knex, projectId: string): Promise<SpaceRecord[]> {
  const rows: SpaceRow[] = await withUpdaterName(db, 'spaces').where('t.project_id', projectId).orderBy([{ column: 't.position' }, { column: 't.name' }]);
  return spaceRecords(db, rows);
}

async function oneSpace(db: Knex, id: string): Promise<SpaceRecord> {
  const rows: SpaceRow[] = await withUpdaterName(db, 'spaces').where('t.id', id);
  const [record] = await spaceRecords(db, rows);
  return record!;
}

function spaceColumns(input: Partial<SpaceInput>): Record<string, unknown> {
  const columns: Record<string, unknown> = {
    name: input.name,
    level: input.level ?? '',
    space_type: input.spaceType,
    building_area_type: input.buildingAreaType,
    control_space_type: input.controlSpaceType,
    area: input.area,
    ceiling_height: input.ceilingHeight,
    length: input.length,
    width: input.width,
    luminaire_height: input.luminaireHeight,
    work_plane_height: input.workPlaneHeight,
    enclosed: input.enclosed,
  };
  return Object.fromEntries(Object.entries(columns).map(([key, value]) => [key, value ?? null]));
}

/** Luminaire tags → the project's type ids; an unknown tag is a 400 with its path. */
async function resolveTags(trx: Knex, projectId: string, inputs: { luminaires: SpaceInput['luminaires'] }[], pathPrefix: (index: number) => string): Promise<Map<string, string>> {
  const types = await trx('luminaire_types').where({ project_id: projectId }).select<{ id: string; tag: string }[]>('id', 'tag');
  const byTag = new Map(types.map((type) => [type.tag, type.id]));
  const problems: ErrorDetail[] = [];
  inputs.forEach((input, index) =>
    input.luminaires.forEach((group, groupIndex) => {
      if (!byTag.has(group.tag)) problems.push({ path: `${pathPrefix(index)}luminaires.${groupIndex}.tag`, message: `No luminaire type has the tag "${group.tag}".` });
    }),
  );
  if (problems.length > 0) throw AppError.badRequest('Some luminaire tags are not defined in this project.', problems);
  return byTag;
}

function childRows(spaceId: string, input: SpaceInput, typeIds: Map<string, string>) {
  return {
    luminaires: input.luminaires.map((group, position) => ({ space_id: spaceId, position, luminaire_type_id: typeIds.get(group.tag), count: Number(group.count), zone: group.zone ?? null })),
    controls: input.controls.map((control) => ({
      space_id: spaceId,
      strategy: control.strategy,
      provided: control.provided,
      timeout_minutes: control.timeoutMinutes ?? null,
      zone_size: control.zoneSize ?? null,
      auto_on: control.autoOn ?? null,
      device: control.device ?? null,
      exception_reason: control.exceptionReason ?? null,
      exception_note: control.exceptionNote ?? null,
    })),
    windows: input.windows.map((opening, position) => ({ space_id: spaceId, position, width: opening.width, head_height: opening.headHeight, sill_height: opening.sillHeight ?? null, wall: opening.wall, offset: opening.offset ?? null })),
    skylights: input.skylights.map((skylight, position) => ({ space_id: spaceId, position, length: skylight.length, width: skylight.width, x: skylight.x ?? null, y: skylight.y ?? null })),
  };
}

const childTables = { luminaires: 'space_luminaires', controls: 'space_controls', windows: 'space_windows', skylights: 'space_skylights' } as const;

/** Inserts the children of many spaces in a few statements (the bulk import writes thousands). */
async function insertChildren(trx: Knex.Transaction, rows: ReturnType<typeof childRows>[]): Promise<void> {
  for (const [kind, table] of Object.entries(childTables) as [keyof typeof childTables, string][]) {
    const all: Record<string, unknown>[] = rows.flatMap((row): Record<string, unknown>[] => row[kind]);
    if (all.length > 0) await trx.batchInsert(table, all, 1000).transacting(trx);
  }
}

async function writeChildren(trx: Knex.Transaction, spaceId: string, input: SpaceInput, typeIds: Map<string, string>): Promise<void> {
  for (const table of Object.values(childTables)) {
    await trx(table).where({ space_id: spaceId }).delete();
  }
  await insertChildren(trx, [childRows(spaceId, input, typeIds)]);
}

/** Creates spaces all together or not at all (the import's commit step uses this too). */
export async function createSpaces(db: Database, projectId: string, inputs: SpaceInput[], userId: string): Promise<SpaceRecord[]> {
  return db.transaction(async (trx) => {
    const typeIds = await resolveTags(trx, projectId, inputs, (index) => (inputs.length === 1 ? '' : `spaces.${index}.`));
    const { max } = (await trx('spaces').where({ project_id: projectId }).max<{ max: number | null }>('position as max').first()) ?? { max: null };
    const first = (max ?? -1) + 1;
    const ids: string[] = [];
    const chunk = 500;
    for (let start = 0; start < inputs.length; start += chunk) {
      const batch = inputs.slice(start, start + chunk);
      const inserted = await trx('spaces')
        .insert(batch.map((input, offset) => ({ project_id: projectId, position: first + start + offset, ...spaceColumns(input), updated_by: userId })))
        .returning<{ id: string; position: number }[]>(['id', 'position']);
      inserted.sort((a, b) => a.position - b.position);
      ids.push(...inserted.map((row) => row.id));
    }
    await insertChildren(trx, inputs.map((input, index) => childRows(ids[index]!, input, typeIds)));
    await touchProject(trx, projectId);
    const rows: SpaceRow[] = await withUpdaterName(trx, 'spaces').whereIn('t.id', ids).orderBy('t.position');
    return spaceRecords(trx, rows);
  });
}

export async function getSpace(db: Knex, projectId: string, spaceId: string): Promise<SpaceRecord> {
  const exists = await db('spaces').where({ id: spaceId, project_id: projectId }).first('id');
  if (!exists) throw AppError.notFound('This space does not exist.');
  return oneSpace(db, spaceId);
}

export async function replaceSpace(db: Database, projectId: string, spaceId: string, version: number, input: SpaceInput, userId: string): Promise<SpaceRecord> {
  return db.transaction(async (trx) => {
    const typeIds = await resolveTags(trx, projectId, [input], () => '');
    await updateVersioned(trx, 'spaces', { id: spaceId, project_id: projectId }, version, spaceColumns(input), userId, 'This space');
    await writeChildren(trx, spaceId, input, typeIds);
    await touchProject(trx, projectId);
    return oneSpace(trx, spaceId);
  });
}

export async function deleteSpace(db: Database, projectId: string, spaceId: string, version: number): Promise<void> {
  await db.transaction(async (trx) => {
    await deleteVersioned(trx, 'spaces', { id: spaceId, project_id: projectId }, version, 'This space');
    await touchProject(trx, projectId);
  });
}

// ---------------------------------------------------------------- exterior applications

interface ExteriorRow extends VersionedRow {
  project_id: string;
  position: number;
  application_key: string;
  description: string;
  quantity: string;
  installed_watts: string;
  controls: ExteriorApplicationInput['controls'];
  updated_by_name?: string | null;
}

export type ExteriorApplicationRecord = ExteriorApplicationInput & Stamp & { id: string };

function exteriorRecord(row: ExteriorRow): ExteriorApplicationRecord {
  return {
    id: row.id,
    key: row.application_key,
    description: row.description,
    quantity: decimal(row.quantity)!,
    installedWatts: decimal(row.installed_watts)!,
    controls: row.controls,
    ...stamp(row),
  };
}

function exteriorColumns(input: ExteriorApplicationInput): Record<string, unknown> {
  return { application_key: input.key, description: input.description, quantity: input.quantity, installed_watts: input.installedWatts, controls: JSON.stringify(input.controls) };
}

export async function listExteriorApplications(db: Knex, projectId: string): Promise<ExteriorApplicationRecord[]> {
  const rows: ExteriorRow[] = await withUpdaterName(db, 'exterior_applications').where('t.project_id', projectId).orderBy([{ column: 't.position' }, { column: 't.created_at' }]);
  return rows.map(exteriorRecord);
}

async function oneExterior(db: Knex, id: string): Promise<ExteriorApplicationRecord> {
  return exteriorRecord(await withUpdaterName(db, 'exterior_applications').where('t.id', id).first());
}

export async function createExteriorApplication(db: Database, projectId: string, input: ExteriorApplicationInput, userId: string): Promise<ExteriorApplicationRecord> {
  return db.transaction(async (trx) => {
    const { max } = (await trx('exterior_applications').where({ project_id: projectId }).max<{ max: number | null }>('position as max').first()) ?? { max: null };
    const [row] = await trx('exterior_applications').insert({ project_id: projectId, position: (max ?? -1) + 1, ...exteriorColumns(input), updated_by: userId }).returning<{ id: string }[]>('id');
    await touchProject(trx, projectId);
    return oneExterior(trx, row!.id);
  });
}

export async function replaceExteriorApplication(db: Database, projectId: string, id: string, version: number, input: ExteriorApplicationInput, userId: string): Promise<ExteriorApplicationRecord> {
  return db.transaction(async (trx) => {
    await updateVersioned(trx, 'exterior_applications', { id, project_id: projectId }, version, exteriorColumns(input), userId, 'This exterior application');
    await touchProject(trx, projectId);
    return oneExterior(trx, id);
  });
}

export async function deleteExteriorApplication(db: Database, projectId: string, id: string, version: number): Promise<void> {
  await db.transaction(async (trx) => {
    await deleteVersioned(trx, 'exterior_applications', { id, project_id: projectId }, version, 'This exterior application');
    await touchProject(trx, projectId);
  });
}

/** Any design write marks the project as changed, so lists sort by it. */
async function touchProject(trx: Knex, projectId: string): Promise<void> {
  await trx('projects').where({ id: projectId }).update({ updated_at: trx.fn.now(), result_summary: null });
}
