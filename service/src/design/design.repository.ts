import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { recordAudit } from '../audit/audit.repository.js';
import { documentLimits } from '../compliance/bounds.js';
import { dec, text } from '../compliance/numbers.js';
import type { Database } from '../db/database.js';
import { deleteVersioned, updateVersioned, type VersionedRow } from '../db/optimistic.js';
import { lockProject } from '../db/project-lock.js';
import type {
  ExteriorApplicationRow,
  LuminaireTypeRow,
  SpaceControlRow,
  SpaceLuminaireRow,
  SpaceRow,
  SpaceSkylightRow,
  SpaceWindowRow,
} from '../db/tables.js';
import { carriedOrigin, type UnitOrigin } from '../db/unit-origin.js';
import { convertProjectUnits } from '../projects/unit-conversion.repository.js';
import { getCutSheet } from './cut-sheets.repository.js';
import { Conflict, InUse, KeyReused, NotFound, NotRestorable, Refused, type ErrorDetail } from '../domain-errors.js';
import {
  exteriorApplicationInputSchema,
  luminaireTypeInputSchema,
  spaceInputSchema,
  type ExteriorApplicationInput,
  type LuminaireTypeInput,
  type SpaceInput,
} from './design.schema.js';

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

/** A luminaire type as read, with the name of who last changed it. */
type LuminaireTypeRead = LuminaireTypeRow & { updated_by_name?: string | null };

export type LuminaireTypeRecord = LuminaireTypeInput & Stamp & { id: string };

function luminaireTypeRecord(row: LuminaireTypeRead): LuminaireTypeRecord {
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
      manufacturer: row.manufacturer ?? undefined,
      catalogNumber: row.catalog_number ?? undefined,
      lightSource: row.light_source ?? undefined,
      driver: row.driver ?? undefined,
      voltage: row.voltage ?? undefined,
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
    manufacturer: input.manufacturer ?? null,
    catalog_number: input.catalogNumber ?? null,
    light_source: input.lightSource ?? null,
    driver: input.driver ?? null,
    voltage: input.voltage ?? null,
  };
}

function withUpdaterName(db: Knex, table: string) {
  return db(`${table} as t`).leftJoin('users as u', 'u.id', 't.updated_by').select('t.*', 'u.name as updated_by_name');
}

export async function listLuminaireTypes(db: Knex, projectId: string): Promise<LuminaireTypeRecord[]> {
  const rows: LuminaireTypeRead[] = await withUpdaterName(db, 'luminaire_types').where('t.project_id', projectId).orderBy('t.tag');
  return rows.map(luminaireTypeRecord);
}

async function oneLuminaireType(db: Knex, id: string): Promise<LuminaireTypeRecord> {
  const row: LuminaireTypeRead = await withUpdaterName(db, 'luminaire_types').where('t.id', id).first();
  return luminaireTypeRecord(row);
}

async function assertTagFree(trx: Knex, projectId: string, tag: string, exceptId?: string): Promise<void> {
  const query = trx('luminaire_types').where({ project_id: projectId, tag });
  if (exceptId) query.whereNot({ id: exceptId });
  if (await query.first('id')) throw tagTaken(tag);
}

function tagTaken(tag: string): Conflict {
  return new Conflict(`A luminaire type tagged "${tag}" already exists in this project.`, [
    { path: 'tag', message: 'Tags are unique within a project.' },
  ]);
}

async function storedLuminaireType(trx: Knex, projectId: string, id: string): Promise<LuminaireTypeRow> {
  const row = await trx('luminaire_types').where({ id, project_id: projectId }).first();
  if (!row) throw new NotFound('This luminaire type does not exist.');
  return row;
}

export async function createLuminaireType(
  db: Database,
  projectId: string,
  input: LuminaireTypeInput,
  userId: string,
): Promise<LuminaireTypeRecord> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    await assertTagFree(trx, projectId, input.tag);
    const [row] = await trx('luminaire_types')
      .insert({ project_id: projectId, ...luminaireTypeColumns(input), updated_by: userId })
      .returning<{ id: string }[]>('id');
    const created = await oneLuminaireType(trx, row!.id);
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'create',
      entity: 'luminaire-type',
      entityId: created.id,
      name: created.tag,
      after: created,
    });
    await touchProject(trx, projectId);
    return created;
  });
}

export async function replaceLuminaireType(
  db: Database,
  projectId: string,
  id: string,
  version: number,
  input: LuminaireTypeInput,
  userId: string,
): Promise<LuminaireTypeRecord> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const stored = await storedLuminaireType(trx, projectId, id);
    const before = await oneLuminaireType(trx, id);
    await assertTagFree(trx, projectId, input.tag, id);
    const columns = luminaireTypeColumns(input);
    await updateVersioned(
      trx,
      'luminaire_types',
      { id, project_id: projectId },
      version,
      { ...columns, unit_origin: carriedOrigin(stored.unit_origin, { ...stored }, columns) },
      userId,
      'This luminaire type',
    );
    const after = await oneLuminaireType(trx, id);
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'update',
      entity: 'luminaire-type',
      entityId: id,
      name: after.tag,
      before,
      after,
    });
    await touchProject(trx, projectId);
    return after;
  });
}

/**
 * Deletes an unused luminaire type; its cut sheet's record goes with it (the foreign key cascades),
 * and the answer is the stored file's key, for the caller to remove from the store once committed.
 */
export async function deleteLuminaireType(
  db: Database,
  projectId: string,
  id: string,
  version: number,
  userId: string,
): Promise<{ cutSheetKey: string | null }> {
  return db.transaction(async (trx) => {
    const { units } = await lockProject(trx, projectId);
    await storedLuminaireType(trx, projectId, id);
    const users = await trx('space_luminaires as l')
      .join('spaces as s', 's.id', 'l.space_id')
      .where('l.luminaire_type_id', id)
      .distinct<{ name: string }[]>('s.name');
    if (users.length > 0) {
      const names = users.map((space) => space.name).sort();
      throw new InUse(
        `This luminaire type is still counted in ${names.length} space(s): ${names.slice(0, 5).join(', ')}${names.length > 5 ? ', …' : ''}. Remove those counts first.`,
      );
    }
    const before = await oneLuminaireType(trx, id);
    const cutSheet = await getCutSheet(trx, projectId, id);
    await deleteVersioned(trx, 'luminaire_types', { id, project_id: projectId }, version, 'This luminaire type');
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'delete',
      entity: 'luminaire-type',
      entityId: id,
      name: before.tag,
      before,
      units,
    });
    await touchProject(trx, projectId);
    return { cutSheetKey: cutSheet?.storage_key ?? null };
  });
}

// ---------------------------------------------------------------- spaces

/** A space as read, with the name of who last changed it. */
type SpaceRead = SpaceRow & { updated_by_name?: string | null };

/** A luminaire count with its type's tag, joined. */
type SpaceLuminaireRead = SpaceLuminaireRow & { tag: string };

export type SpaceRecord = Omit<SpaceInput, 'luminaires'> &
  Stamp & { id: string; position: number; luminaires: (SpaceInput['luminaires'][number] & { luminaireTypeId: string })[] };

function groupBy<Row extends { space_id: string }>(rows: Row[]): Map<string, Row[]> {
  const groups = new Map<string, Row[]>();
  for (const row of rows) {
    const group = groups.get(row.space_id);
    if (group) group.push(row);
    else groups.set(row.space_id, [row]);
  }
  return groups;
}

async function spaceRecords(db: Knex, rows: SpaceRead[]): Promise<SpaceRecord[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((row) => row.id);
  const inIds = (query: Knex.QueryBuilder) =>
    ids.length > 500
      ? query.whereIn('space_id', db('spaces').select('id').where('project_id', rows[0]!.project_id))
      : query.whereIn('space_id', ids);
  const queries = [
    () =>
      inIds(db('space_luminaires as l').join('luminaire_types as t', 't.id', 'l.luminaire_type_id').select('l.*', 't.tag')).orderBy([
        'space_id',
        'position',
      ]),
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
  const [luminaires, controls, windows, skylights] = results as [
    SpaceLuminaireRead[],
    SpaceControlRow[],
    SpaceWindowRow[],
    SpaceSkylightRow[],
  ];
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
      rooms: row.rooms === null ? undefined : String(row.rooms),
      unlit: row.unlit,
    }) as Omit<SpaceInput, 'luminaires' | 'controls' | 'windows' | 'skylights'>),
    luminaires: (luminairesBySpace.get(row.id) ?? []).map((group) =>
      defined({ tag: group.tag, count: String(group.count), zone: group.zone, luminaireTypeId: group.luminaire_type_id }),
    ),
    controls: (controlsBySpace.get(row.id) ?? []).map((control) =>
      defined({
        strategy: control.strategy,
        provided: control.provided,
        timeoutMinutes: decimal(control.timeout_minutes),
        zoneSize: decimal(control.zone_size),
        reductionPercent: decimal(control.reduction_percent),
        autoOn: control.auto_on,
        device: control.device,
        exceptionReason: control.exception_reason,
        exceptionNote: control.exception_note,
      }),
    ),
    windows: (windowsBySpace.get(row.id) ?? []).map((opening) =>
      defined({
        width: decimal(opening.width)!,
        headHeight: decimal(opening.head_height)!,
        sillHeight: decimal(opening.sill_height),
        wall: opening.wall ?? 'south',
        offset: decimal(opening.offset),
        visibleTransmittance: decimal(opening.visible_transmittance),
        daylightBlocked: opening.daylight_blocked ?? undefined,
      }),
    ),
    skylights: (skylightsBySpace.get(row.id) ?? []).map((skylight) =>
      defined({
        length: decimal(skylight.length)!,
        width: decimal(skylight.width)!,
        x: decimal(skylight.x),
        y: decimal(skylight.y),
        visibleTransmittance: decimal(skylight.visible_transmittance),
        daylightBlocked: skylight.daylight_blocked ?? undefined,
      }),
    ),
    ...stamp(row),
  })) as SpaceRecord[];
}

export async function listSpaces(db: Knex, projectId: string): Promise<SpaceRecord[]> {
  const rows: SpaceRead[] = await withUpdaterName(db, 'spaces')
    .where('t.project_id', projectId)
    .orderBy([{ column: 't.position' }, { column: 't.name' }]);
  return spaceRecords(db, rows);
}

async function oneSpace(db: Knex, id: string): Promise<SpaceRecord> {
  const rows: SpaceRead[] = await withUpdaterName(db, 'spaces').where('t.id', id);
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
    rooms: input.rooms === undefined ? undefined : Number(input.rooms),
    unlit: input.unlit,
  };
  return Object.fromEntries(Object.entries(columns).map(([key, value]) => [key, value ?? null]));
}

/** Luminaire tags → the project's type ids; an unknown tag is a 400 with its path. */
async function resolveTags(
  trx: Knex,
  projectId: string,
  inputs: { luminaires: SpaceInput['luminaires'] }[],
  pathPrefix: (index: number) => string,
): Promise<Map<string, string>> {
  const types = await trx('luminaire_types').where({ project_id: projectId }).select<{ id: string; tag: string }[]>('id', 'tag');
  const byTag = new Map(types.map((type) => [type.tag, type.id]));
  const problems: ErrorDetail[] = [];
  inputs.forEach((input, index) =>
    input.luminaires.forEach((group, groupIndex) => {
      if (!byTag.has(group.tag))
        problems.push({
          path: `${pathPrefix(index)}luminaires.${groupIndex}.tag`,
          message: `No luminaire type has the tag "${group.tag}".`,
        });
    }),
  );
  if (problems.length > 0) throw new Refused('Some luminaire tags are not defined in this project.', problems);
  return byTag;
}

function controlRow(spaceId: string, control: SpaceInput['controls'][number]): Record<string, unknown> {
  return {
    space_id: spaceId,
    strategy: control.strategy,
    provided: control.provided,
    timeout_minutes: control.timeoutMinutes ?? null,
    zone_size: control.zoneSize ?? null,
    reduction_percent: control.reductionPercent ?? null,
    auto_on: control.autoOn ?? null,
    device: control.device ?? null,
    exception_reason: control.exceptionReason ?? null,
    exception_note: control.exceptionNote ?? null,
  };
}

const childTables = {
  luminaires: 'space_luminaires',
  controls: 'space_controls',
  windows: 'space_windows',
  skylights: 'space_skylights',
} as const;

/** A space's children as table rows, by kind. */
type ChildRows = Record<keyof typeof childTables, Record<string, unknown>[]>;

function childRows(spaceId: string, input: SpaceInput, typeIds: Map<string, string>): ChildRows {
  return {
    luminaires: input.luminaires.map((group, position) => ({
      space_id: spaceId,
      position,
      luminaire_type_id: typeIds.get(group.tag),
      count: Number(group.count),
      zone: group.zone ?? null,
    })),
    controls: input.controls.map((control) => controlRow(spaceId, control)),
    windows: input.windows.map((opening, position) => ({
      space_id: spaceId,
      position,
      width: opening.width,
      head_height: opening.headHeight,
      sill_height: opening.sillHeight ?? null,
      wall: opening.wall,
      offset: opening.offset ?? null,
      visible_transmittance: opening.visibleTransmittance ?? null,
      daylight_blocked: opening.daylightBlocked ?? null,
    })),
    skylights: input.skylights.map((skylight, position) => ({
      space_id: spaceId,
      position,
      length: skylight.length,
      width: skylight.width,
      x: skylight.x ?? null,
      y: skylight.y ?? null,
      visible_transmittance: skylight.visibleTransmittance ?? null,
      daylight_blocked: skylight.daylightBlocked ?? null,
    })),
  };
}

/** Inserts the children of many spaces in a few statements (the bulk import writes thousands). */
async function insertChildren(trx: Knex.Transaction, rows: ChildRows[]): Promise<void> {
  for (const [kind, table] of Object.entries(childTables) as [keyof typeof childTables, string][]) {
    const all = rows.flatMap((row) => row[kind]);
    if (all.length > 0) await trx.batchInsert(table, all, 1000).transacting(trx);
  }
}

type StoredChild = Record<string, unknown> & { unit_origin: UnitOrigin | null };

/**
 * Replaces a space's children. A child that comes back with the values it had (same window at the
 * same position, same strategy) keeps what it knew of its values before the last change of units.
 */
async function writeChildren(trx: Knex.Transaction, spaceId: string, rows: ChildRows): Promise<void> {
  const keyOf: Record<'controls' | 'windows' | 'skylights', (row: Record<string, unknown>) => string> = {
    controls: (row) => String(row['strategy']),
    windows: (row) => String(row['position']),
    skylights: (row) => String(row['position']),
  };
  const carried: ChildRows = { ...rows };
  for (const kind of ['controls', 'windows', 'skylights'] as const) {
    const stored = await trx(childTables[kind]).where({ space_id: spaceId }).whereNotNull('unit_origin').select<StoredChild[]>('*');
    if (stored.length === 0) continue;
    const byKey = new Map(stored.map((row) => [keyOf[kind](row), row]));
    carried[kind] = rows[kind].map((row) => {
      const old = byKey.get(keyOf[kind](row));
      return old ? { ...row, unit_origin: carriedOrigin(old.unit_origin, old, row) } : row;
    });
  }
  for (const table of Object.values(childTables)) {
    await trx(table).where({ space_id: spaceId }).delete();
  }
  await insertChildren(trx, [carried]);
}

async function nextPosition(trx: Knex, projectId: string): Promise<number> {
  const { max } = (await trx('spaces').where({ project_id: projectId }).max<{ max: number | null }>('position as max').first()) ?? {
    max: null,
  };
  return (max ?? -1) + 1;
}

export interface ImportKey {
  key: string;
  /** A digest of the request, so a key reused for a different import is refused rather than answered with the first. */
  requestHash: string;
}

export function requestDigest(body: unknown): string {
  return createHash('sha256').update(JSON.stringify(body)).digest('hex');
}

/** How long an import's idempotency key is remembered. */
const importKeyHours = 24;

/**
 * The luminaire types an import brings, created in its transaction: a tag the project already has
 * is a 409 naming it (the import would otherwise count the wrong type), and each type is audited
 * as a create, as one added by hand would be.
 */
async function createImportedTypes(trx: Knex.Transaction, projectId: string, inputs: LuminaireTypeInput[], userId: string): Promise<void> {
  const clashes = await trx('luminaire_types')
    .where({ project_id: projectId })
    .whereIn(
      'tag',
      inputs.map((input) => input.tag),
    )
    .select<{ tag: string }[]>('tag');
  const taken = new Set(clashes.map((row) => row.tag));
  if (taken.size > 0) {
    const tags = [...taken].sort().map((tag) => `"${tag}"`);
    const message =
      tags.length === 1
        ? `A luminaire type tagged ${tags[0]} already exists in this project.`
        : `Luminaire types tagged ${tags.join(', ')} already exist in this project.`;
    throw new Conflict(
      `${message} Nothing was imported.`,
      inputs.flatMap((input, index) =>
        taken.has(input.tag) ? [{ path: `luminaireTypes.${index}.tag`, message: 'Tags are unique within a project.' }] : [],
      ),
    );
  }
  const { count } = (await trx('luminaire_types').where({ project_id: projectId }).count<{ count: string }>('* as count').first()) ?? {
    count: '0',
  };
  if (Number(count) + inputs.length > documentLimits.luminaireTypes) {
    throw new Refused(
      `A project holds at most ${documentLimits.luminaireTypes.toLocaleString('en-US')} luminaire types; this one has ${Number(count).toLocaleString('en-US')}.`,
      [{ path: 'luminaireTypes', message: 'Too many luminaire types for one project.' }],
    );
  }
  const inserted = await trx('luminaire_types')
    .insert(inputs.map((input) => ({ project_id: projectId, ...luminaireTypeColumns(input), updated_by: userId })))
    .returning<{ id: string }[]>('id');
  const rows: LuminaireTypeRead[] = await withUpdaterName(trx, 'luminaire_types')
    .whereIn(
      't.id',
      inserted.map((row) => row.id),
    )
    .orderBy('t.tag');
  await recordDesignChanges(
    trx,
    rows
      .map(luminaireTypeRecord)
      .map((type) => ({ userId, projectId, action: 'create', entity: 'luminaire-type', entityId: type.id, name: type.tag, after: type })),
  );
}

/**
 * Creates spaces all together or not at all (the import's commit step uses this too), with the
 * luminaire types the import brings. With an import key, a retry of the same import returns the
 * spaces the first one created instead of creating them (or its types) again.
 */
export async function createSpaces(
  db: Database,
  projectId: string,
  inputs: SpaceInput[],
  userId: string,
  importKey?: ImportKey,
  luminaireTypes: LuminaireTypeInput[] = [],
): Promise<SpaceRecord[]> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    if (importKey) {
      await trx('idempotency_keys')
        .where({ project_id: projectId })
        .where('created_at', '<', trx.raw(`now() - interval '${importKeyHours} hours'`))
        .delete();
      const earlier = await trx('idempotency_keys')
        .where({ project_id: projectId, user_id: userId, key: importKey.key })
        .first<{ request_hash: string; space_ids: string[] } | undefined>();
      if (earlier) {
        if (earlier.request_hash !== importKey.requestHash) {
          throw new KeyReused('This import key was already used for a different import. Start a new import.');
        }
        const rows: SpaceRead[] = await withUpdaterName(trx, 'spaces').whereIn('t.id', earlier.space_ids).orderBy('t.position');
        return spaceRecords(trx, rows);
      }
    }
    const { count } = (await trx('spaces').where({ project_id: projectId }).count<{ count: string }>('* as count').first()) ?? {
      count: '0',
    };
    const room = documentLimits.spaces - Number(count);
    if (inputs.length > room) {
      throw new Refused(
        `A project holds at most ${documentLimits.spaces.toLocaleString('en-US')} spaces; this one has ${Number(count).toLocaleString('en-US')}, so at most ${Math.max(room, 0).toLocaleString('en-US')} more.`,
        [{ path: 'spaces', message: 'Too many spaces for one project.' }],
      );
    }
    if (luminaireTypes.length > 0) await createImportedTypes(trx, projectId, luminaireTypes, userId);
    const typeIds = await resolveTags(trx, projectId, inputs, (index) => (inputs.length === 1 ? '' : `spaces.${index}.`));
    const first = await nextPosition(trx, projectId);
    const ids: string[] = [];
    const chunk = 500;
    for (let start = 0; start < inputs.length; start += chunk) {
      const batch = inputs.slice(start, start + chunk);
      const inserted = await trx('spaces')
        .insert(
          batch.map((input, offset) => ({
            project_id: projectId,
            position: first + start + offset,
            ...spaceColumns(input),
            updated_by: userId,
          })),
        )
        .returning<{ id: string; position: number }[]>(['id', 'position']);
      inserted.sort((a, b) => a.position - b.position);
      ids.push(...inserted.map((row) => row.id));
    }
    await insertChildren(
      trx,
      inputs.map((input, index) => childRows(ids[index]!, input, typeIds)),
    );
    const rows: SpaceRead[] = await withUpdaterName(trx, 'spaces').whereIn('t.id', ids).orderBy('t.position');
    const created = await spaceRecords(trx, rows);
    await recordDesignChanges(
      trx,
      created.map((space) => ({
        userId,
        projectId,
        action: importKey || inputs.length > 1 ? 'import' : 'create',
        entity: 'space',
        entityId: space.id,
        name: space.name,
        after: space,
      })),
    );
    if (importKey) {
      await trx('idempotency_keys').insert({
        project_id: projectId,
        user_id: userId,
        key: importKey.key,
        request_hash: importKey.requestHash,
        space_ids: ids,
      });
    }
    await touchProject(trx, projectId);
    return created;
  });
}

export async function getSpace(db: Knex, projectId: string, spaceId: string): Promise<SpaceRecord> {
  const exists = await db('spaces').where({ id: spaceId, project_id: projectId }).first('id');
  if (!exists) throw new NotFound('This space does not exist.');
  return oneSpace(db, spaceId);
}

export async function replaceSpace(
  db: Database,
  projectId: string,
  spaceId: string,
  version: number,
  input: SpaceInput,
  userId: string,
): Promise<SpaceRecord> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const stored = await trx('spaces').where({ id: spaceId, project_id: projectId }).first<SpaceRow | undefined>();
    if (!stored) throw new NotFound('This space does not exist.');
    const before = await oneSpace(trx, spaceId);
    const typeIds = await resolveTags(trx, projectId, [input], () => '');
    const columns = spaceColumns(input);
    await updateVersioned(
      trx,
      'spaces',
      { id: spaceId, project_id: projectId },
      version,
      { ...columns, unit_origin: carriedOrigin(stored.unit_origin, { ...stored }, columns) },
      userId,
      'This space',
    );
    await writeChildren(trx, spaceId, childRows(spaceId, input, typeIds));
    const after = await oneSpace(trx, spaceId);
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'update',
      entity: 'space',
      entityId: spaceId,
      name: after.name,
      before,
      after,
    });
    await touchProject(trx, projectId);
    return after;
  });
}

export async function deleteSpace(db: Database, projectId: string, spaceId: string, version: number, userId: string): Promise<void> {
  await db.transaction(async (trx) => {
    const { units } = await lockProject(trx, projectId);
    const before = await getSpace(trx, projectId, spaceId);
    await deleteVersioned(trx, 'spaces', { id: spaceId, project_id: projectId }, version, 'This space');
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'delete',
      entity: 'space',
      entityId: spaceId,
      name: before.name,
      before,
      units,
    });
    await touchProject(trx, projectId);
  });
}

/** One control recorded on many spaces in one step (the same device, or the same exception). */
export async function setControlOnSpaces(
  db: Database,
  projectId: string,
  targets: { id: string; version: number }[],
  control: SpaceInput['controls'][number],
  userId: string,
): Promise<SpaceRecord[]> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const ids = targets.map((target) => target.id);
    const stored = await trx('spaces')
      .where({ project_id: projectId })
      .whereIn('id', ids)
      .select<{ id: string; name: string; version: number }[]>('id', 'name', 'version');
    if (stored.length !== new Set(ids).size) throw new NotFound('Some of these spaces no longer exist. Reload and choose again.');
    const wanted = new Map(targets.map((target) => [target.id, target.version]));
    const stale = stored.filter((row) => wanted.get(row.id) !== row.version);
    if (stale.length > 0) {
      const names = stale.map((row) => row.name).sort();
      const staleIds = new Set(stale.map((row) => row.id));
      const nameOf = new Map(stale.map((row) => [row.id, row.name]));
      // One detail per changed space, at its place in the request, so a client can name each one.
      const details = targets.flatMap((target, index) =>
        staleIds.has(target.id) ? [{ path: `spaces.${index}`, message: `“${nameOf.get(target.id)}” changed since you read it.` }] : [],
      );
      throw new Conflict(
        `${names.length} of these spaces changed since you read them (${names.slice(0, 5).join(', ')}${names.length > 5 ? ', …' : ''}). Reload and apply the control again.`,
        details,
      );
    }
    const before = await spaceRecords(trx, await withUpdaterName(trx, 'spaces').whereIn('t.id', ids).orderBy('t.position'));
    await trx('space_controls').whereIn('space_id', ids).where({ strategy: control.strategy }).delete();
    await trx
      .batchInsert(
        'space_controls',
        ids.map((spaceId) => controlRow(spaceId, control)),
        1000,
      )
      .transacting(trx);
    await trx('spaces')
      .whereIn('id', ids)
      .update({ version: trx.raw('version + 1'), updated_at: trx.fn.now(), updated_by: userId });
    const after = await spaceRecords(trx, await withUpdaterName(trx, 'spaces').whereIn('t.id', ids).orderBy('t.position'));
    const earlier = new Map(before.map((space) => [space.id, space]));
    await recordDesignChanges(
      trx,
      after.map((space) => ({
        userId,
        projectId,
        action: 'update',
        entity: 'space',
        entityId: space.id,
        name: space.name,
        before: earlier.get(space.id),
        after: space,
      })),
    );
    await touchProject(trx, projectId);
    return after;
  });
}

// ---------------------------------------------------------------- exterior applications

/** An exterior application as read, with the name of who last changed it. */
type ExteriorRead = ExteriorApplicationRow & { updated_by_name?: string | null };

export type ExteriorApplicationRecord = ExteriorApplicationInput & Stamp & { id: string };

function exteriorRecord(row: ExteriorRead): ExteriorApplicationRecord {
  return {
    id: row.id,
    key: row.application_key,
    description: row.description,
    quantity: decimal(row.quantity)!,
    installedWatts: decimal(row.installed_watts)!,
    ...(row.exempt_reason !== null ? { exemptWatts: decimal(row.exempt_watts)!, exemptReason: row.exempt_reason } : {}),
    ...(row.exempt_note !== null ? { exemptNote: row.exempt_note } : {}),
    controls: row.controls,
    ...stamp(row),
  };
}

function exteriorColumns(input: ExteriorApplicationInput): Record<string, unknown> {
  return {
    application_key: input.key,
    description: input.description,
    quantity: input.quantity,
    installed_watts: input.installedWatts,
    // The exempt part is kept only with its reason (the writes refuse one without the other).
    exempt_watts: input.exemptReason === undefined ? null : (input.exemptWatts ?? null),
    exempt_reason: input.exemptReason ?? null,
    exempt_note: input.exemptReason === undefined ? null : (input.exemptNote ?? null),
    controls: JSON.stringify(input.controls),
  };
}

export async function listExteriorApplications(db: Knex, projectId: string): Promise<ExteriorApplicationRecord[]> {
  const rows: ExteriorRead[] = await withUpdaterName(db, 'exterior_applications')
    .where('t.project_id', projectId)
    .orderBy([{ column: 't.position' }, { column: 't.created_at' }]);
  return rows.map(exteriorRecord);
}

async function oneExterior(db: Knex, id: string): Promise<ExteriorApplicationRecord> {
  return exteriorRecord(await withUpdaterName(db, 'exterior_applications').where('t.id', id).first());
}

/** Each exterior application of the edition appears once in a project; a second entry would be counted twice. */
async function assertApplicationFree(trx: Knex, projectId: string, key: string, exceptId?: string): Promise<void> {
  const query = trx('exterior_applications').where({ project_id: projectId, application_key: key });
  if (exceptId) query.whereNot({ id: exceptId });
  if (await query.first('id')) {
    throw new Conflict('This exterior application is already on the project; change its quantity and watts there instead.', [
      { path: 'key', message: 'Each application appears once.' },
    ]);
  }
}

export async function createExteriorApplication(
  db: Database,
  projectId: string,
  input: ExteriorApplicationInput,
  userId: string,
): Promise<ExteriorApplicationRecord> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    await assertApplicationFree(trx, projectId, input.key);
    const { max } = (await trx('exterior_applications')
      .where({ project_id: projectId })
      .max<{ max: number | null }>('position as max')
      .first()) ?? { max: null };
    const [row] = await trx('exterior_applications')
      .insert({ project_id: projectId, position: (max ?? -1) + 1, ...exteriorColumns(input), updated_by: userId })
      .returning<{ id: string }[]>('id');
    const created = await oneExterior(trx, row!.id);
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'create',
      entity: 'exterior-application',
      entityId: created.id,
      name: created.description || created.key,
      after: created,
    });
    await touchProject(trx, projectId);
    return created;
  });
}

export async function replaceExteriorApplication(
  db: Database,
  projectId: string,
  id: string,
  version: number,
  input: ExteriorApplicationInput,
  userId: string,
): Promise<ExteriorApplicationRecord> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const stored = await trx('exterior_applications').where({ id, project_id: projectId }).first();
    if (!stored) throw new NotFound('This exterior application does not exist.');
    const before = exteriorRecord(stored);
    await assertApplicationFree(trx, projectId, input.key, id);
    const columns = exteriorColumns(input);
    const origin = stored.application_key === input.key ? carriedOrigin(stored.unit_origin, { ...stored }, columns) : null;
    await updateVersioned(
      trx,
      'exterior_applications',
      { id, project_id: projectId },
      version,
      { ...columns, unit_origin: origin },
      userId,
      'This exterior application',
    );
    const after = await oneExterior(trx, id);
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'update',
      entity: 'exterior-application',
      entityId: id,
      name: after.description || after.key,
      before,
      after,
    });
    await touchProject(trx, projectId);
    return after;
  });
}

export async function deleteExteriorApplication(
  db: Database,
  projectId: string,
  id: string,
  version: number,
  userId: string,
): Promise<void> {
  await db.transaction(async (trx) => {
    const { units } = await lockProject(trx, projectId);
    const stored = await trx('exterior_applications').where({ id, project_id: projectId }).first();
    if (!stored) throw new NotFound('This exterior application does not exist.');
    const before = exteriorRecord(stored);
    await deleteVersioned(trx, 'exterior_applications', { id, project_id: projectId }, version, 'This exterior application');
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'delete',
      entity: 'exterior-application',
      entityId: id,
      name: before.description || before.key,
      before,
      units,
    });
    await touchProject(trx, projectId);
  });
}

// ---------------------------------------------------------------- restoring what was deleted

/** How long a deleted space, luminaire type, exterior application or allowance claim can be brought back from the history. */
export const restoreDays = 30;

interface DeleteEntry {
  id: string;
  at: Date;
  /** `units` is absent in deletes recorded before it was kept: those are taken as in the present units. */
  detail: { name: string; before: Record<string, unknown>; units?: 'ip' | 'si' };
}

/** The stored fields of a record as the history kept it, without its stamp. */
function withoutStamp(record: Record<string, unknown>): Record<string, unknown> {
  const { id: _id, position: _position, version: _version, updatedAt: _at, updatedBy: _by, ...fields } = record;
  return fields;
}

/**
 * Brings back a space, luminaire type or exterior application deleted in the last
 * {@link restoreDays} days, with the id, values and (for a space) the position and children it
 * had. It comes back at version 1 of its new life; the history records the restore.
 */
export async function restoreDeleted(
  db: Database,
  projectId: string,
  entity: DesignEntity,
  entityId: string,
  userId: string,
  /** The unit of each exterior application of the project's edition, for converting a restored one. */
  exteriorUnits: ReadonlyMap<string, string> = new Map(),
): Promise<SpaceRecord | LuminaireTypeRecord | ExteriorApplicationRecord> {
  return db.transaction(async (trx) => {
    const { units } = await lockProject(trx, projectId);
    const entry = await trx('audit_log')
      .where({ project_id: projectId, entity, entity_id: entityId, action: 'delete' })
      .orderBy('id', 'desc')
      .first<DeleteEntry | undefined>('id', 'at', 'detail');
    const table = { space: 'spaces', 'luminaire-type': 'luminaire_types', 'exterior-application': 'exterior_applications' }[entity];
    if (!entry || (await trx(table).where({ id: entityId }).first('id'))) {
      throw new NotFound('There is nothing deleted here to restore.');
    }
    if (Date.now() - entry.at.getTime() > restoreDays * 86_400_000) {
      throw new NotRestorable(
        `“${entry.detail.name}” was deleted more than ${restoreDays} days ago and can no longer be restored; add it again instead.`,
      );
    }
    const fields = withoutStamp(entry.detail.before);
    // Deleted before a change of units: the values come back converted, as every kept row was.
    const convert = async () => {
      const deletedIn = entry.detail.units ?? units;
      if (deletedIn !== units) await convertProjectUnits(trx, projectId, deletedIn, units, exteriorUnits, userId, [entityId]);
    };
    let restored: SpaceRecord | LuminaireTypeRecord | ExteriorApplicationRecord;
    if (entity === 'space') {
      const parsed = spaceInputSchema.safeParse({
        ...fields,
        luminaires: ((fields['luminaires'] as Record<string, unknown>[] | undefined) ?? []).map(
          ({ luminaireTypeId: _type, ...group }) => group,
        ),
      });
      if (!parsed.success)
        throw new NotRestorable(
          `“${entry.detail.name}” holds values that are no longer accepted, so it cannot be restored; add it again instead.`,
        );
      const typeIds = await resolveTags(trx, projectId, [parsed.data], () => '').catch(() => {
        throw new NotRestorable(`“${entry.detail.name}” counted luminaire types that no longer exist; restore or add them first.`);
      });
      const wanted = Number(entry.detail.before['position']);
      const taken = Number.isInteger(wanted) ? await trx('spaces').where({ project_id: projectId, position: wanted }).first('id') : true;
      const position = taken ? await nextPosition(trx, projectId) : wanted;
      await trx('spaces').insert({ id: entityId, project_id: projectId, position, ...spaceColumns(parsed.data), updated_by: userId });
      await insertChildren(trx, [childRows(entityId, parsed.data, typeIds)]);
      await convert();
      restored = await oneSpace(trx, entityId);
    } else if (entity === 'luminaire-type') {
      const parsed = luminaireTypeInputSchema.safeParse(fields);
      if (!parsed.success)
        throw new NotRestorable(
          `“${entry.detail.name}” holds values that are no longer accepted, so it cannot be restored; add it again instead.`,
        );
      await assertTagFree(trx, projectId, parsed.data.tag);
      await trx('luminaire_types').insert({
        id: entityId,
        project_id: projectId,
        ...luminaireTypeColumns(parsed.data),
        updated_by: userId,
      });
      await convert();
      restored = await oneLuminaireType(trx, entityId);
    } else {
      const parsed = exteriorApplicationInputSchema.safeParse(fields);
      if (!parsed.success)
        throw new NotRestorable(
          `“${entry.detail.name}” holds values that are no longer accepted, so it cannot be restored; add it again instead.`,
        );
      await assertApplicationFree(trx, projectId, parsed.data.key);
      const { max } = (await trx('exterior_applications')
        .where({ project_id: projectId })
        .max<{ max: number | null }>('position as max')
        .first()) ?? { max: null };
      await trx('exterior_applications').insert({
        id: entityId,
        project_id: projectId,
        position: (max ?? -1) + 1,
        ...exteriorColumns(parsed.data),
        updated_by: userId,
      });
      await convert();
      restored = await oneExterior(trx, entityId);
    }
    await recordDesignChange(trx, {
      userId,
      projectId,
      action: 'restore',
      entity,
      entityId,
      name: entry.detail.name,
      after: restored,
      restoredFrom: entry.id,
    });
    await touchProject(trx, projectId);
    return restored;
  });
}

// ---------------------------------------------------------------- audit

export type DesignEntity = 'space' | 'luminaire-type' | 'exterior-application';

interface DesignChange {
  userId: string;
  projectId: string;
  action: 'create' | 'import' | 'update' | 'delete' | 'restore';
  entity: DesignEntity;
  entityId: string;
  /** What a person calls the thing (its name or tag), kept so the history reads after it is gone. */
  name: string;
  /** A delete keeps the units its values are in, so a restore after a change of units converts them. */
  units?: 'ip' | 'si';
  before?: unknown;
  after?: unknown;
  restoredFrom?: string;
}

function auditEntry(change: DesignChange) {
  const { before, after, name, restoredFrom, units } = change;
  return {
    userId: change.userId,
    projectId: change.projectId,
    action: change.action,
    entity: change.entity,
    entityId: change.entityId,
    detail: {
      name,
      ...(before === undefined ? {} : { before }),
      ...(after === undefined ? {} : { after }),
      ...(restoredFrom ? { restoredFrom } : {}),
      ...(units ? { units } : {}),
    },
  };
}

async function recordDesignChange(trx: Knex.Transaction, change: DesignChange): Promise<void> {
  await recordAudit(trx, auditEntry(change));
}

async function recordDesignChanges(trx: Knex.Transaction, changes: DesignChange[]): Promise<void> {
  await recordAudit(trx, changes.map(auditEntry));
}

/** Any design write marks the project as changed, so lists sort by it. */
export async function touchProject(trx: Knex, projectId: string): Promise<void> {
  await trx('projects').where({ id: projectId }).update({ updated_at: trx.fn.now(), result_summary: null, field_test_summary: null });
}

/** A space's type, or undefined when the project has no such space. */
export async function spaceTypeOf(db: Knex, projectId: string, spaceId: string): Promise<string | null | undefined> {
  const space = await db('spaces')
    .where({ id: spaceId, project_id: projectId })
    .first<{ space_type: string | null } | undefined>('space_type');
  return space?.space_type;
}
