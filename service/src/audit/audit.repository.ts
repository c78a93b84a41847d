import type { Knex } from 'knex';
import type { Database } from '../db/database.js';
import type { AuditLogRow } from '../db/tables.js';
import { changeChannel, type ProjectChange } from '../live/project-changes.js';

export interface AuditEntry {
  userId: string | null;
  projectId?: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  detail?: Record<string, unknown>;
}

function auditRow(entry: AuditEntry): Omit<AuditLogRow, 'id' | 'at'> {
  return {
    user_id: entry.userId,
    project_id: entry.projectId ?? null,
    action: entry.action,
    entity: entry.entity,
    entity_id: entry.entityId ?? null,
    detail: entry.detail ? JSON.stringify(entry.detail) : null,
  };
}

/**
 * Writes audit records in the caller's transaction, so a change and its record commit together or
 * not at all, and announces each project's change to those watching it (PostgreSQL delivers the
 * notification on commit, and drops it on rollback).
 */
export async function recordAudit(db: Database | Knex.Transaction, entries: AuditEntry | AuditEntry[]): Promise<void> {
  const list = Array.isArray(entries) ? entries : [entries];
  if (list.length === 0) return;
  const rows = list.map(auditRow);
  const [only] = rows;
  if (rows.length === 1 && only) {
    await db('audit_log').insert(only);
  } else {
    const batch = db.batchInsert('audit_log', rows, 500);
    await (db.isTransaction ? batch.transacting(db as Knex.Transaction) : batch);
  }
  const changes = new Map<string, ProjectChange>();
  for (const entry of list) {
    if (entry.projectId && !changes.has(entry.projectId))
      changes.set(entry.projectId, { projectId: entry.projectId, entity: entry.entity, action: entry.action });
  }
  for (const change of changes.values()) {
    await db.raw('select pg_notify(?, ?)', [changeChannel, JSON.stringify(change)]);
  }
}
