import type { Knex } from 'knex';
import type { Database } from '../db/database.js';

export interface AuditEntry {
  userId: string | null;
  projectId?: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  detail?: Record<string, unknown>;
}

function auditRow(entry: AuditEntry) {
  return {
    user_id: entry.userId,
    project_id: entry.projectId ?? null,
    action: entry.action,
    entity: entry.entity,
    entity_id: entry.entityId ?? null,
    detail: entry.detail ? JSON.stringify(entry.detail) : null,
  };
}

/** Writes audit records in the caller's transaction, so a change and its record commit together or not at all. */
export async function recordAudit(db: Database | Knex.Transaction, entries: AuditEntry | AuditEntry[]): Promise<void> {
  const rows = (Array.isArray(entries) ? entries : [entries]).map(auditRow);
  if (rows.length === 0) return;
  if (rows.length === 1) {
    await db('audit_log').insert(rows[0]);
    return;
  }
  const batch = db.batchInsert('audit_log', rows, 500);
  await (db.isTransaction ? batch.transacting(db as Knex.Transaction) : batch);
}
