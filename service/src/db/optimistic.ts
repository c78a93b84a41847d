import type { Knex } from 'knex';
import { NotFound, Stale } from '../domain-errors.js';

export interface VersionedRow {
  id: string;
  version: number;
  updated_at: Date;
  updated_by: string | null;
}

/** Who last changed a row, for a 409 that tells the person what happened. */
async function lastChange(
  trx: Knex,
  table: string,
  id: string,
): Promise<{ version: number; updatedAt: string; updatedBy: string | null } | undefined> {
  const row = await trx(`${table} as t`)
    .leftJoin('users as u', 'u.id', 't.updated_by')
    .where('t.id', id)
    .first<{ version: number; updated_at: Date; name: string | null } | undefined>('t.version', 't.updated_at', 'u.name');
  return row ? { version: row.version, updatedAt: row.updated_at.toISOString(), updatedBy: row.name } : undefined;
}

export function staleWrite(what: string, change: { version: number; updatedAt: string; updatedBy: string | null }): Stale {
  const who = change.updatedBy ?? 'someone';
  return new Stale(
    `${what} was changed by ${who} at ${change.updatedAt} (now version ${change.version}). Reload to see their change, then apply yours again.`,
    change.version,
    [{ path: 'version', message: `current version is ${change.version}` }],
  );
}

/**
 * Updates one row only if it still has the version the writer read; bumps the version.
 * A stale version is refused as stale, naming who changed it; a missing row is not found. Nothing is overwritten.
 */
export async function updateVersioned(
  trx: Knex,
  table: string,
  scope: { id: string; project_id?: string },
  expectedVersion: number,
  changes: Record<string, unknown>,
  userId: string,
  what: string,
): Promise<void> {
  const updated = await trx(table)
    .where({ ...scope, version: expectedVersion })
    .update({ ...changes, version: trx.raw('version + 1'), updated_at: trx.fn.now(), updated_by: userId });
  if (updated === 1) return;
  const exists = await trx(table).where(scope).first('id');
  if (!exists) throw new NotFound(`${what} does not exist.`);
  const change = await lastChange(trx, table, scope.id);
  throw staleWrite(what, change!);
}

/** Deletes one row only at the version the writer read. */
export async function deleteVersioned(
  trx: Knex,
  table: string,
  scope: { id: string; project_id?: string },
  expectedVersion: number,
  what: string,
): Promise<void> {
  const deleted = await trx(table)
    .where({ ...scope, version: expectedVersion })
    .delete();
  if (deleted === 1) return;
  const exists = await trx(table).where(scope).first('id');
  if (!exists) throw new NotFound(`${what} does not exist.`);
  const change = await lastChange(trx, table, scope.id);
  throw staleWrite(what, change!);
}
