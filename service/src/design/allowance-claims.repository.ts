import type { Knex } from 'knex';
import { recordAudit } from '../audit/audit.repository.js';
import { dec, text } from '../compliance/numbers.js';
import type { Database } from '../db/database.js';
import { updateVersioned } from '../db/optimistic.js';
import type { RetailDisplayClaimRow } from '../db/tables.js';
import { lockProject } from '../db/project-lock.js';
import { Conflict, NotFound, NotRestorable, Refused } from '../domain-errors.js';
import { restoreDays, touchProject } from './design.repository.js';
import { assertAllowanceFitsEdition } from './edition-checks.js';

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

/** A claim as read, with the name of who last changed it. */
type ClaimRead = RetailDisplayClaimRow & { updated_by_name: string | null };

function claimRecord(row: ClaimRead): AllowanceClaim {
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

/** Claims with who last changed them; a deleted claim waits out its restore days with `deleted_at` set, and is not one. */
function claims(db: Knex) {
  return db('retail_display_claims as t')
    .leftJoin('users as u', 'u.id', 't.updated_by')
    .whereNull('t.deleted_at')
    .select('t.*', 'u.name as updated_by_name');
}

export async function listAllowanceClaims(db: Knex, projectId: string): Promise<AllowanceClaim[]> {
  return (await claims(db).where('t.project_id', projectId).orderBy('t.created_at')).map(claimRecord);
}

/** The project's live claims as an evaluation document lists them, oldest first (a deleted claim, kept for its restore days, is no claim). */
export async function liveClaimsForDocument(
  db: Knex,
  projectId: string,
): Promise<{ allowance_key: string; space_id: string; area: string }[]> {
  return db('retail_display_claims')
    .where({ project_id: projectId })
    .whereNull('deleted_at')
    .orderBy('created_at')
    .select<{ allowance_key: string; space_id: string; area: string }[]>('allowance_key', 'space_id', 'area');
}

async function oneClaim(db: Knex, id: string): Promise<AllowanceClaim> {
  return claimRecord(await claims(db).where('t.id', id).first());
}

/** A live claim of the project, or 404. */
async function assertClaimExists(trx: Knex, projectId: string, id: string): Promise<void> {
  if (!(await trx('retail_display_claims').where({ id, project_id: projectId }).whereNull('deleted_at').first('id')))
    throw new NotFound('This claim does not exist.');
}

/** A space claims each allowance once, for at most its own floor area. */
async function assertClaimFits(trx: Knex, projectId: string, input: AllowanceClaimInput, exceptId?: string): Promise<string> {
  const space = await trx('spaces')
    .where({ id: input.spaceId, project_id: projectId })
    .first<{ name: string; area: string } | undefined>('name', 'area');
  if (!space) throw new Refused('This space does not exist.', [{ path: 'spaceId', message: 'Choose a space of the project.' }]);
  if (dec(input.area).greaterThan(dec(space.area))) {
    throw new Refused('The claimed area is larger than the space.', [
      { path: 'area', message: `At most ${text(dec(space.area))}, the space’s floor area.` },
    ]);
  }
  const twice = trx('retail_display_claims')
    .where({ project_id: projectId, space_id: input.spaceId, allowance_key: input.allowance })
    .whereNull('deleted_at');
  if (exceptId) twice.whereNot({ id: exceptId });
  if (await twice.first('id'))
    throw new Conflict(`“${space.name}” already claims this allowance.`, [
      { path: 'allowance', message: 'Each allowance once per space.' },
    ]);
  return space.name;
}

export async function createAllowanceClaim(
  db: Database,
  projectId: string,
  input: AllowanceClaimInput,
  userId: string,
): Promise<AllowanceClaim> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const name = await assertClaimFits(trx, projectId, input);
    const [row] = await trx('retail_display_claims')
      .insert({ project_id: projectId, space_id: input.spaceId, allowance_key: input.allowance, area: input.area, updated_by: userId })
      .returning<{ id: string }[]>('id');
    const created = await oneClaim(trx, row!.id);
    await recordAudit(trx, {
      userId,
      projectId,
      action: 'create',
      entity: 'additional-allowance',
      entityId: created.id,
      detail: { name, after: created },
    });
    await touchProject(trx, projectId);
    return created;
  });
}

export async function replaceAllowanceClaim(
  db: Database,
  projectId: string,
  id: string,
  version: number,
  input: AllowanceClaimInput,
  userId: string,
): Promise<AllowanceClaim> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    await assertClaimExists(trx, projectId, id);
    const before = await oneClaim(trx, id);
    const name = await assertClaimFits(trx, projectId, input, id);
    await updateVersioned(
      trx,
      'retail_display_claims',
      { id, project_id: projectId },
      version,
      { space_id: input.spaceId, allowance_key: input.allowance, area: input.area, unit_origin: null },
      userId,
      'This claim',
    );
    const after = await oneClaim(trx, id);
    await recordAudit(trx, {
      userId,
      projectId,
      action: 'update',
      entity: 'additional-allowance',
      entityId: id,
      detail: { name, before, after },
    });
    await touchProject(trx, projectId);
    return after;
  });
}

/** Marks the claim deleted (the evaluation and every list leave it out) for the days it can be restored; older deleted claims of the project go for good. */
export async function deleteAllowanceClaim(db: Database, projectId: string, id: string, version: number, userId: string): Promise<void> {
  await db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    await assertClaimExists(trx, projectId, id);
    const before = await oneClaim(trx, id);
    const space = await trx('spaces').where({ id: before.spaceId }).first<{ name: string }>('name');
    await updateVersioned(
      trx,
      'retail_display_claims',
      { id, project_id: projectId },
      version,
      { deleted_at: trx.fn.now() },
      userId,
      'This claim',
    );
    await trx('retail_display_claims')
      .where({ project_id: projectId })
      .where('deleted_at', '<', trx.raw(`now() - make_interval(days => ?)`, [restoreDays]))
      .delete();
    await recordAudit(trx, {
      userId,
      projectId,
      action: 'delete',
      entity: 'additional-allowance',
      entityId: id,
      detail: { name: space.name, before },
    });
    await touchProject(trx, projectId);
  });
}

/**
 * Brings back a claim deleted in the last {@link restoreDays} days, with its id, if the project
 * would accept it as a new claim now: under the space-by-space method, an allowance of the edition,
 * on a sales floor, at most the floor's area, and not claimed again on that floor since. The
 * history records the restore beside the delete it undoes.
 */
export async function restoreAllowanceClaim(db: Database, projectId: string, id: string, userId: string): Promise<AllowanceClaim> {
  return db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const row = await trx('retail_display_claims')
      .where({ id, project_id: projectId })
      .whereNotNull('deleted_at')
      .first<ClaimRead | undefined>();
    const entry = await trx('audit_log')
      .where({ project_id: projectId, entity: 'additional-allowance', entity_id: id, action: 'delete' })
      .orderBy('id', 'desc')
      .first<{ id: string } | undefined>('id');
    if (!row || !entry) throw new NotFound('There is nothing deleted here to restore.');
    const space = await trx('spaces').where({ id: row.space_id }).first<{ name: string }>('name');
    const what = `The claim on “${space.name}”`;
    if (Date.now() - row.deleted_at!.getTime() > restoreDays * 86_400_000) {
      throw new NotRestorable(
        `${what} was deleted more than ${restoreDays} days ago and can no longer be restored; claim it again instead.`,
      );
    }
    const input = { spaceId: row.space_id, allowance: row.allowance_key, area: text(dec(row.area)) };
    try {
      await assertAllowanceFitsEdition(trx, projectId, input);
      await assertClaimFits(trx, projectId, input, id);
    } catch (error) {
      // The rules of a new claim refuse it, or find it clashing, with their reason; for a restore that reason is why not.
      if (!(error instanceof Refused) && !(error instanceof Conflict)) throw error;
      const why = [error.message, ...error.details.map((detail) => detail.message)].join(' ');
      throw new NotRestorable(`${what} cannot be restored as it was: ${why}`);
    }
    await trx('retail_display_claims')
      .where({ id })
      .update({ deleted_at: null, version: trx.raw('version + 1'), updated_at: trx.fn.now(), updated_by: userId });
    const restored = await oneClaim(trx, id);
    await recordAudit(trx, {
      userId,
      projectId,
      action: 'restore',
      entity: 'additional-allowance',
      entityId: id,
      detail: { name: space.name, after: restored, restoredFrom: entry.id },
    });
    await touchProject(trx, projectId);
    return restored;
  });
}
