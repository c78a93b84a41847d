import type { Knex } from 'knex';
import type { FieldTestRecord, MeasuredValues } from '../../../contract/field-tests.js';
import { recordAudit } from '../audit/audit.repository.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import type { ProjectRole } from '../db/tables.js';

export type { FieldTestRecord, MeasuredValues };

interface ResultRead {
  id: string;
  item_id: string;
  result: 'pass' | 'fail';
  timeout_minutes: string | null;
  light_level: string | null;
  override_minutes: string | null;
  notes: string | null;
  recorded_by: string | null;
  user_name: string | null;
  recorded_at: Date;
  light_unit: string | null;
}

/** A stored decimal without trailing zeros: "20.00" → "20". */
function plain(value: string | null): string | undefined {
  if (value === null) return undefined;
  return value.includes('.') ? value.replace(/0+$/, '').replace(/\.$/, '') : value;
}

function record(row: ResultRead): FieldTestRecord {
  const measured: MeasuredValues = {};
  const timeout = plain(row.timeout_minutes);
  const light = plain(row.light_level);
  const override = plain(row.override_minutes);
  if (timeout !== undefined) measured.timeoutMinutes = timeout;
  if (light !== undefined) measured.lightLevel = light;
  if (override !== undefined) measured.overrideMinutes = override;
  return {
    id: String(row.id),
    itemId: row.item_id,
    result: row.result,
    measured,
    lightLevelUnit: light === undefined ? null : row.light_unit === 'si' ? 'lux' : 'fc',
    notes: row.notes,
    by: row.recorded_by ? { id: row.recorded_by, name: row.user_name ?? '' } : null,
    at: row.recorded_at.toISOString(),
  };
}

/** Every test recorded on a project, oldest first (retests after the tests they repeat). */
export async function listFieldTests(db: Knex, projectId: string): Promise<FieldTestRecord[]> {
  const rows = await db('field_test_results as r')
    .leftJoin('users as u', 'u.id', 'r.recorded_by')
    .where('r.project_id', projectId)
    .orderBy('r.id')
    .select<ResultRead[]>(
      'r.id',
      'r.item_id',
      'r.result',
      'r.timeout_minutes',
      'r.light_level',
      'r.override_minutes',
      'r.notes',
      'r.recorded_by',
      'u.name as user_name',
      'r.recorded_at',
      'r.light_unit',
    );
  return rows.map(record);
}

/**
 * Records one test of a plan item (a retest is one more row; nothing is overwritten) and its audit
 * entry, in one transaction under the project's row lock. Refused for an archived project; any
 * review state is fine, since the field tests come after the design is built.
 */
export async function recordFieldTest(
  db: Database,
  projectId: string,
  item: { id: string; title: string },
  input: { result: 'pass' | 'fail'; measured: MeasuredValues; notes?: string },
  actor: { userId: string; role: ProjectRole | null; retest: boolean },
): Promise<FieldTestRecord> {
  return db.transaction(async (trx) => {
    const project = await lockProject(trx, projectId, { anyState: true });
    const [inserted] = await trx('field_test_results')
      .insert({
        project_id: projectId,
        item_id: item.id,
        result: input.result,
        timeout_minutes: input.measured.timeoutMinutes ?? null,
        light_level: input.measured.lightLevel ?? null,
        override_minutes: input.measured.overrideMinutes ?? null,
        light_unit: project.units,
        notes: input.notes ?? null,
        recorded_by: actor.userId,
      })
      .returning<{ id: string }[]>('id');
    await recordAudit(trx, {
      userId: actor.userId,
      projectId,
      action: actor.retest ? 'retest' : 'record',
      entity: 'field-test',
      entityId: null,
      detail: {
        name: item.title,
        fieldTest: {
          result: input.result,
          ...(Object.keys(input.measured).length ? { measured: input.measured } : {}),
          ...(input.measured.lightLevel !== undefined ? { lightLevelUnit: project.units === 'si' ? 'lux' : 'fc' } : {}),
          ...(input.notes ? { notes: input.notes } : {}),
          retest: actor.retest,
          role: actor.role,
        },
      },
    });
    const row = await trx('field_test_results as r')
      .leftJoin('users as u', 'u.id', 'r.recorded_by')
      .where('r.id', inserted!.id)
      .first<ResultRead>(
        'r.id',
        'r.item_id',
        'r.result',
        'r.timeout_minutes',
        'r.light_level',
        'r.override_minutes',
        'r.notes',
        'r.recorded_by',
        'u.name as user_name',
        'r.recorded_at',
        'r.light_unit',
      );
    return record(row);
  });
}
