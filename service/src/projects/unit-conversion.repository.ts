import type { Knex } from 'knex';
import { maxDecimalPlaces, ranges, type NumberRange } from '../compliance/bounds.js';
import { metresPerFoot, squareMetresPerSquareFoot } from '../compliance/index.js';
import { text } from '../compliance/numbers.js';
import { Refused } from '../domain-errors.js';

type Kind = 'length' | 'area';

interface ConvertedTable {
  table: string;
  /** What a person calls these rows. */
  label: string;
  /** Which rows: the project's own row, its rows, or its spaces' rows. */
  scope: 'self' | 'project' | 'space';
  /** Versioned rows get a new version, so a writer still holding the old values gets 409 instead of saving them in the wrong unit. */
  versioned: boolean;
  columns: Record<string, { kind: Kind; range: NumberRange }>;
  /** Only some rows convert (exterior quantities by their application's unit). */
  where?: (query: Knex.QueryBuilder) => void;
}

/** Every stored length and area of a project, by table and column. Watts and counts need no conversion. */
function convertedTables(exteriorUnits: ReadonlyMap<string, string>): ConvertedTable[] {
  const length = (range: NumberRange) => ({ kind: 'length' as const, range });
  const area = { kind: 'area' as const, range: ranges.area };
  const exteriorKeys = (unit: string) => [...exteriorUnits].filter(([, applicationUnit]) => applicationUnit === unit).map(([key]) => key);
  return [
    // The set-up write that changes the units has already given the project a new version.
    { table: 'projects', label: 'project set-up', scope: 'self', versioned: false, columns: { gross_floor_area: area } },
    {
      table: 'spaces',
      label: 'spaces',
      scope: 'project',
      versioned: true,
      columns: {
        area,
        ceiling_height: length(ranges.height),
        length: length(ranges.length),
        width: length(ranges.length),
        luminaire_height: length(ranges.heightAboveFloor),
        work_plane_height: length(ranges.heightAboveFloor),
      },
    },
    {
      table: 'space_windows',
      label: 'windows',
      scope: 'space',
      versioned: false,
      columns: {
        width: length(ranges.length),
        head_height: length(ranges.height),
        sill_height: length(ranges.heightAboveFloor),
        offset: length(ranges.offset),
      },
    },
    {
      table: 'space_skylights',
      label: 'skylights',
      scope: 'space',
      versioned: false,
      columns: { length: length(ranges.length), width: length(ranges.length), x: length(ranges.offset), y: length(ranges.offset) },
    },
    { table: 'space_controls', label: 'controls', scope: 'space', versioned: false, columns: { zone_size: area } },
    {
      table: 'luminaire_types',
      label: 'luminaire types',
      scope: 'project',
      versioned: true,
      columns: { length: length(ranges.length) },
      where: (query) => query.whereNotNull('length'),
    },
    { table: 'retail_display_claims', label: 'sales area claims', scope: 'project', versioned: true, columns: { area } },
    {
      table: 'exterior_applications',
      label: 'exterior applications',
      scope: 'project',
      versioned: true,
      columns: { quantity: { kind: 'area', range: ranges.exteriorQuantity } },
      where: (query) => query.whereIn('application_key', exteriorKeys('W/ft2')),
    },
    {
      table: 'exterior_applications',
      label: 'exterior applications',
      scope: 'project',
      versioned: true,
      columns: { quantity: { kind: 'length', range: ranges.exteriorQuantity } },
      where: (query) => query.whereIn('application_key', exteriorKeys('W/ft')),
    },
  ];
}

/** Decimal places kept when converting to IP, where dividing by 0.3048 need not terminate (1 µft is far below any drawing). */
const ipScale = 6;

export interface ConversionSummary {
  from: 'ip' | 'si';
  to: 'ip' | 'si';
  /** Rows whose values changed, by table. */
  rows: Record<string, number>;
}

/**
 * Converts a project's stored values between IP and SI in the caller's transaction.
 *
 * IP → SI multiplies by the exact factors (1 ft = 0.3048 m, from mathjs units); SI → IP divides
 * and keeps six decimal places. Before converting, each row keeps its values as they were in
 * `unit_origin`; converting back restores those exactly, so SI → IP → SI returns what was entered
 * (a write in between keeps the origin only of the values it left unchanged). Every converted row
 * gets a new version. A value that would leave its plausible range in the new unit stops the change.
 * With `only`, just those rows (and a space's openings and controls) convert: a thing deleted
 * before a change of units comes back in the project's present units.
 */
export async function convertProjectUnits(
  trx: Knex.Transaction,
  projectId: string,
  from: 'ip' | 'si',
  to: 'ip' | 'si',
  exteriorUnits: ReadonlyMap<string, string>,
  userId: string,
  only?: readonly string[],
): Promise<ConversionSummary> {
  const summary: ConversionSummary = { from, to, rows: {} };
  if (from === to) return summary;
  const factors: Record<Kind, string> = { length: text(metresPerFoot), area: text(squareMetresPerSquareFoot) };
  const spaceIds = trx('spaces').select('id').where({ project_id: projectId });
  const inScope = (query: Knex.QueryBuilder, scope: ConvertedTable['scope']) => {
    if (scope === 'self') query.where({ id: projectId });
    else if (scope === 'project') query.where({ project_id: projectId });
    else query.whereIn('space_id', spaceIds);
    if (only && scope === 'project') query.whereIn('id', only);
    if (only && scope === 'space') query.whereIn('space_id', only);
  };
  for (const { table, label, scope, versioned, columns, where } of convertedTables(exteriorUnits)) {
    if (only && scope === 'self') continue;
    const names = Object.keys(columns);
    const changes: Record<string, Knex.Raw> = {};
    for (const name of names) {
      const kind = columns[name]!.kind;
      const converted =
        to === 'si'
          ? trx.raw('round(?? * ?::numeric, ?)', [name, factors[kind], maxDecimalPlaces])
          : trx.raw('round(?? / ?::numeric, ?)', [name, factors[kind], ipScale]);
      changes[name] = trx.raw(
        `case when unit_origin->>'units' = ? and unit_origin->'values'->>?::text is not null then (unit_origin->'values'->>?::text)::numeric else ? end`,
        [to, name, name, converted],
      );
    }
    // The origin for the next change back: the values as they are now, except those this change restores.
    const current = trx.raw(
      `jsonb_build_object(${names.map(() => '?::text, ??').join(', ')})`,
      names.flatMap((name) => [name, name]),
    );
    changes['unit_origin'] = trx.raw(
      `jsonb_build_object('units', ?::text, 'values', jsonb_strip_nulls(? - (case when unit_origin->>'units' = ? then array(select jsonb_object_keys(unit_origin->'values')) else '{}'::text[] end)))`,
      [from, current, to],
    );
    if (versioned) Object.assign(changes, { version: trx.raw('version + 1'), updated_at: trx.fn.now(), updated_by: userId });
    const query = trx(table).update(changes);
    inScope(query, scope);
    where?.(query);
    const count = await query;
    summary.rows[table] = (summary.rows[table] ?? 0) + count;

    const outOfRange = trx(table).count<{ count: string }>('* as count');
    inScope(outOfRange, scope);
    outOfRange.where((clause) => {
      for (const name of names) clause.orWhere(name, '>', columns[name]!.range.max);
    });
    const { count: outside } = (await outOfRange.first()) ?? { count: '0' };
    if (Number(outside) > 0) {
      throw new Refused(`Some stored values would be out of range in ${to === 'ip' ? 'feet' : 'metres'}; nothing was converted.`, [
        { path: 'units', message: `${outside} of the ${label} hold values too large to convert.` },
      ]);
    }
  }
  return summary;
}
