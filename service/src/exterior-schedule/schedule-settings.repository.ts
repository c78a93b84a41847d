import { recordAudit } from '../audit/audit.repository.js';
import { defaultScheduleSettings, scheduleSettingsSchema, type ScheduleSettings } from '../compliance/exterior-schedule.js';
import type { Database } from '../db/database.js';
import { lockProject } from '../db/project-lock.js';
import { Stale } from '../domain-errors.js';

/** The schedule a project runs: the saved one, or the defaults (version 0) until one is saved. */
export interface StoredScheduleSettings {
  settings: ScheduleSettings;
  /** 0 until saved; each save adds one. */
  version: number;
  saved: boolean;
  updatedAt: string | null;
  updatedBy: string | null;
}

export async function scheduleSettings(db: Database, projectId: string): Promise<StoredScheduleSettings> {
  const row = await db('exterior_schedule_settings as s')
    .leftJoin('users as u', 'u.id', 's.updated_by')
    .where('s.project_id', projectId)
    .first<{ settings: unknown; version: number; updated_at: Date; updated_by_name: string | null } | undefined>(
      's.settings',
      's.version',
      's.updated_at',
      'u.name as updated_by_name',
    );
  if (!row) return { settings: defaultScheduleSettings, version: 0, saved: false, updatedAt: null, updatedBy: null };
  // Stored only after the same schema passed it; read through it again so a hand-edited row cannot reach the clock.
  const parsed = scheduleSettingsSchema.safeParse(row.settings);
  return {
    settings: parsed.success ? parsed.data : defaultScheduleSettings,
    version: row.version,
    saved: parsed.success,
    updatedAt: row.updated_at.toISOString(),
    updatedBy: row.updated_by_name,
  };
}

/**
 * Saves the project's schedule under the project's row lock (so the design lock holds: only a
 * draft or a returned design changes), refused as stale when `version` is not the one stored;
 * audited with the settings before and after.
 */
export async function saveScheduleSettings(
  db: Database,
  projectId: string,
  settings: ScheduleSettings,
  version: number,
  userId: string,
): Promise<StoredScheduleSettings> {
  await db.transaction(async (trx) => {
    await lockProject(trx, projectId);
    const current = await trx('exterior_schedule_settings').where({ project_id: projectId }).first('settings', 'version');
    const currentVersion = current?.version ?? 0;
    if (currentVersion !== version) {
      throw new Stale('Someone saved the schedule since you opened it: reload to see their settings.', currentVersion);
    }
    const json = JSON.stringify(settings);
    if (current) {
      await trx('exterior_schedule_settings')
        .where({ project_id: projectId })
        .update({ settings: json, version: currentVersion + 1, updated_by: userId, updated_at: trx.fn.now() });
    } else {
      await trx('exterior_schedule_settings').insert({ project_id: projectId, settings: json, version: 1, updated_by: userId });
    }
    await recordAudit(trx, {
      userId,
      projectId,
      action: current ? 'update' : 'create',
      entity: 'exterior-schedule',
      entityId: projectId,
      detail: { before: current?.settings ?? defaultScheduleSettings, after: settings },
    });
  });
  return scheduleSettings(db, projectId);
}
