import type { Database } from '../db/database.js';
import type { ProjectRole } from '../db/tables.js';
import { recordAudit } from '../audit/audit.repository.js';
import { lockProject } from '../db/project-lock.js';
import { Conflict, NotFound } from '../domain-errors.js';

export interface Member {
  userId: string;
  name: string;
  email: string;
  role: ProjectRole;
}

export async function listMembers(db: Database, projectId: string): Promise<Member[]> {
  return db('project_members as m')
    .join('users as u', 'u.id', 'm.user_id')
    .where('m.project_id', projectId)
    .orderBy(['m.role', 'u.name'])
    .select<Member[]>('u.id as userId', 'u.name', 'u.email', 'm.role');
}

/**
 * Adds a person by e-mail or changes their role. Only people who already have an account can be
 * added; for any other address nothing changes and the answer is the same team, so the route
 * cannot be used to learn which addresses have accounts.
 */
export async function setMember(db: Database, projectId: string, email: string, role: ProjectRole, actorId: string): Promise<Member[]> {
  await db.transaction(async (trx) => {
    await lockProject(trx, projectId, { allowArchived: true, anyState: true });
    const user = await trx('users').whereRaw('lower(email) = lower(?)', [email]).first('id');
    if (!user) {
      await recordAudit(trx, {
        userId: actorId,
        projectId,
        action: 'add-member-no-account',
        entity: 'project_member',
        detail: { name: email, role },
      });
      return;
    }
    const current = await trx('project_members').where({ project_id: projectId, user_id: user.id }).first('role');
    if (current?.role === 'engineer' && role !== 'engineer') await assertAnotherEngineer(trx, projectId, user.id);
    await trx('project_members')
      .insert({ project_id: projectId, user_id: user.id, role })
      .onConflict(['project_id', 'user_id'])
      .merge({ role });
    await recordAudit(trx, {
      userId: actorId,
      projectId,
      action: current ? 'change-role' : 'add-member',
      entity: 'project_member',
      entityId: user.id,
      detail: { name: email, before: current ? { role: current.role } : null, after: { role } },
    });
  });
  return listMembers(db, projectId);
}

export async function removeMember(db: Database, projectId: string, userId: string, actorId: string): Promise<Member[]> {
  await db.transaction(async (trx) => {
    // The project's lock serialises team changes: two engineers removing each other at once cannot both pass the check below.
    await lockProject(trx, projectId, { allowArchived: true, anyState: true });
    const current = await trx('project_members as m')
      .join('users as u', 'u.id', 'm.user_id')
      .where({ 'm.project_id': projectId, 'm.user_id': userId })
      .first<{ role: ProjectRole; email: string } | undefined>('m.role', 'u.email');
    if (!current) throw new NotFound('That person is not on this project.');
    if (current.role === 'engineer') await assertAnotherEngineer(trx, projectId, userId);
    await trx('project_members').where({ project_id: projectId, user_id: userId }).delete();
    await recordAudit(trx, {
      userId: actorId,
      projectId,
      action: 'remove-member',
      entity: 'project_member',
      entityId: userId,
      detail: { name: current.email, before: { role: current.role } },
    });
  });
  return listMembers(db, projectId);
}

/** A project always keeps an engineer of record. */
async function assertAnotherEngineer(trx: Database, projectId: string, leavingUserId: string): Promise<void> {
  const others = await trx('project_members')
    .where({ project_id: projectId, role: 'engineer' })
    .whereNot({ user_id: leavingUserId })
    .first('user_id');
  if (!others) throw new Conflict('A project keeps at least one engineer; add another engineer first.');
}
