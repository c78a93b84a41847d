import type { Database } from '../db/database.js';

export interface AuditEntry {
  userId: string | null;
  projectId?: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  detail?: Record<string, unknown>;
}

export async function recordAudit(db: Database, entry: AuditEntry): Promise<void> {
  await db('audit_log').insert({
    user_id: entry.userId,
    project_id: entry.projectId ?? null,
    action: entry.action,
    entity: entry.entity,
    entity_id: entry.entityId ?? null,
    detail: entry.detail ? JSON.stringify(entry.detail) : null,
  });
}
