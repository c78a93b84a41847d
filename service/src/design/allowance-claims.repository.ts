import type { Knex } from 'knex';
import { recordAudit } from '../audit/audit.repository.js';
import { dec, text } from '../compliance/numbers.js';
import type { Database } from '../db/database.js';
import { deleteVersioned, updateVersioned, type VersionedRow } from '../db/optimistic.js';
import { lockProject } from '../db/project-lock.js';
import { AppError } from '../http/app-error.js';
import { touchProject } from './design.repository.js';

/** A space's claim on one of the edition's additional allowances (retail display on a sales floor). */
export interface AllowanceClaim {
  id: string;
  spaceId: string;
  allowance: string;
  area: string;
  version: number;
  updatedAt: string;
  updatedBy: string | null;
}

export interface AllowanceClaimInput {
  spaceId: string;
  allowance: string;
  area: string;
}

interface ClaimRow extends VersionedRow {
  space_id: string;
  allowance_key: string;
  area: string;
  updated_by_name: string | null;
}

function claimRecord(row: ClaimRow): AllowanceClaim {
  return {
    id: row.id,
    spaceId: row.space_id,
    allowance: row.allowance_key,
    area: text(dec(row.area)),
    version: row.version,
    updatedAt: row.updated_at.toISOString(),
    updatedBy: row.updated_by_name,
  };
}

function claims(db: Knex) {
  return db('retail_display_claims as t').leftJoin('users as u', 'u.id', 't.updated_by').select('t.*', 'u.name as updated_by_name');
}

export async function listAllowanceClaims(db: Knex, projectId: string): Promise<AllowanceClaim[]> {
  return (await claims(db).where('t.project_id', projectId).orderBy('t.created_at')).map(claimRecord);
}

async function oneClaim(db: Knex, id: string): Promise<AllowanceClaim> {
  return claimRecord(await claims(db).where('t.id', id).first());
}

/** A space claims each allowance once, for at most its own floor area. */
async function assertClaimFits(trx: Knex, projectId: string, input: AllowanceClaimInput, exceptId?: string): Promise<string> {
  const space = await trx('spaces').where({ id: input.spaceId, project_id: projectId }).first<{ name: string; area: string } | undefined>('name', 'area');
  if (!space) throw AppError.badRequest('This space does not exist.', [{ path: 'spaceId', message: 'Choose a space of the project.' }]);
  if (dec(input.area).greaterThan(dec(space.area))) {
    throw AppError.badRequest('The claimed area is larger than the space.', [{ path: 'area', message: `At most ${text(dec(space.area))}, the space’s floor area.` }]);
  }
  const twice = trx('retail_display_claims').where({ project_id: projectId, space_id: input.spaceId, allowance_key: input.allowance });
  if (exceptId) twice.whereNot({ id: exceptId });
  if (await twice.first('id')) throw AppError.conflict(`“${space.name}” already claims this allowance.`, [{ path: 'allowance', message: 'Each allowance once per space.' }]);
  return space.name;
}

export async function createAllowanceClaim(db: Database, projectId: string, input: AllowanceClaimInput, userId: string): Promise<AllowanceClaim> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const name = await assertClaimFits(trx, projectId, input);
    const [row] = await trx('retail_display_claims')
      .insert({ project_id: projectId, space_id: input.spaceId, allowance_key: input.allowance, area: input.area, updated_by: userId })
      .returning<{ id: string }[]>('id');
    const created = await oneClaim(trx, row!.id);
    await recordAudit(trx, { userId, projectId, action: 'create', entity: 'additional-allowance', entityId: created.id, detail: { name, after: created } });
    await touchProject(trx, projectId);
    return created;
  });
}

export async function replaceAllowanceClaim(db: Database, projectId: string, id: string, version: number, input: AllowanceClaimInput, userId: string): Promise<AllowanceClaim> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    if (!(await trx('retail_display_claims').where({ id, project_id: projectId }).first('id'))) throw AppError.notFound('This claim does not exist.');
    const before = await oneClaim(trx, id);
    const name = await assertClaimFits(trx, projectId, input, id);
    await updateVersioned(trx, 'retail_display_claims', { id, project_id: projectId }, version, { space_id: input.spaceId, allowance_key: input.allowance, area: input.area, unit_origin: null }, userId, 'This claim');
    const after = await oneClaim(trx, id);
    await recordAudit(trx, { userId, projectId, action: 'update', entity: 'additional-allowance', entityId: id, detail: { name, before, after } });
    await touchProject(trx, projectId);
    return after;
  });
}

export async function deleteAllowanceClaim(db: Database, projectId: string, id: string, version: number, userId: string): Promise<void> {
  await db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    if (!(await trx('retail_display_claims').where({ id, project_id: projectId }).first('id'))) throw AppError.notFound('This claim does not exist.');
    const before = await oneClaim(trx, id);
    const space = await trx('spaces').where({ id: before.spaceId }).first<{ name: string }>('name');
    await deleteVersioned(trx, 'retail_display_claims', { id, project_id: projectId }, version, 'This claim');
    await recordAudit(trx, { userId, projectId, action: 'delete', entity: 'additional-allowance', entityId: id, detail: { name: space.name, before } });
    await touchProject(trx, projectId);
  });
}
