import type { Knex } from 'knex';
import { metresPerFoot, squareMetresPerSquareFoot } from '../compliance/index.js';
import { text } from '../compliance/numbers.js';

type Kind = 'length' | 'area';

/** Every stored length and area of a project, by table and column. Watts and counts need no conversion. */
const columns: { table: string; scope: 'project' | 'space'; kind: Kind; names: string[] }[] = [
  { table: 'spaces', scope: 'project', kind: 'area', names: ['area'] },
  { table: 'spaces', scope: 'project', kind: 'length', names: ['ceiling_height', 'length', 'width', 'luminaire_height', 'work_plane_height'] },
  { table: 'space_windows', scope: 'space', kind: 'length', names: ['width', 'head_height', 'sill_height', 'offset'] },
  { table: 'space_skylights', scope: 'space', kind: 'length', names: ['length', 'width', 'x', 'y'] },
  { table: 'space_controls', scope: 'space', kind: 'area', names: ['zone_size'] },
  { table: 'luminaire_types', scope: 'project', kind: 'length', names: ['length'] },
  { table: 'retail_display_claims', scope: 'project', kind: 'area', names: ['area'] },
];

/** Decimal places kept when converting to IP, where dividing by 0.3048 need not terminate (1 µft is far below any drawing). */
const ipScale = 6;

/**
 * Converts a project's stored values between IP and SI in the caller's transaction. IP → SI
 * multiplies by the exact factors (1 ft = 0.3048 m, from mathjs units), so nothing is lost;
 * SI → IP divides and keeps six decimal places. Exterior quantities convert by their
 * application's unit (per ft² → area, per linear ft → length; counts and watts stay).
 */
export async function convertProjectUnits(
  trx: Knex.Transaction,
  projectId: string,
  from: 'ip' | 'si',
  to: 'ip' | 'si',
  exteriorUnits: ReadonlyMap<string, string>,
): Promise<void> {
  if (from === to) return;
  const factors: Record<Kind, string> = { length: text(metresPerFoot), area: text(squareMetresPerSquareFoot) };
  const converted = (column: string, kind: Kind) =>
    to === 'si' ? trx.raw('?? * ?::numeric', [column, factors[kind]]) : trx.raw('round(?? / ?::numeric, ?)', [column, factors[kind], ipScale]);
  const spaceIds = trx('spaces').select('id').where({ project_id: projectId });
  for (const { table, scope, kind, names } of columns) {
    const changes = Object.fromEntries(names.map((name) => [name, converted(name, kind)]));
    const query = trx(table).update(changes);
    if (scope === 'project') query.where({ project_id: projectId });
    else query.whereIn('space_id', spaceIds);
    await query;
  }
  const applications = await trx('exterior_applications').where({ project_id: projectId }).select<{ id: string; application_key: string }[]>('id', 'application_key');
  for (const application of applications) {
    const unit = exteriorUnits.get(application.application_key);
    const kind: Kind | null = unit === 'W/ft2' ? 'area' : unit === 'W/ft' ? 'length' : null;
    if (kind) await trx('exterior_applications').where({ id: application.id }).update({ quantity: converted('quantity', kind) });
  }
}
