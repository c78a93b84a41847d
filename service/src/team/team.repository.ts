import type { Database } from '../db/database.js';
import type { ProjectRole } from '../db/tables.js';
import { recordAudit } from '../audit/audit.repository.js';
import { AppError } from '../http/app-error.js';

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

/** Adds a person by e-mail or changes their role; only people who already have an account can be added. */
export async function setMember(db: Database, projectId: string, email: string, role: ProjectRole, actorId: string): Promise<Member[]> {
  await db.transaction(async (trx) => {
    const user = await trx('users').whereRaw('lower(email) = lower(?)', [email]).first<{ id: string } | undefined>('id');
    if (!user) {
      throw AppError.badRequest('No one with that e-mail has an account.', [{ path: 'email', message: 'An administrator creates the account first.' }]);
    }
    const current = await trx('project_members').where({ project_id: projectId, user_id: user.id }).first<{ role: ProjectRole } | undefined>('role');
    if (current?.role === 'engineer' && role !== 'engineer') await assertAnotherEngineer(trx, projectId, user.id);
    await trx('project_members').insert({ project_id: projectId, user_id: user.id, role }).onConflict(['project_id', 'user_id']).merge({ role });
    await recordAudit(trx, { userId: actorId, projectId, action: current ? 'change-role' : 'add-member', entity: 'project_member', entityId: user.id, detail: { role, previous: current?.role ?? null } });
  });
  return listMembers(db, projectId);
}

export async function removeMember(db: Database, projectId: string, userId: string, actorId: string): Promise<Member[]> {
  await db.transaction(async (trx) => {
    const current = await trx('project_members').where({ project_id: projectId, user_id: userId }).first<{ role: ProjectRole } | undefined>('role');
    if (!current) throw AppError.notFound('That person is not on this project.');
    if (current.role === 'engineer') await assertAnotherEngineer(trx, projectId, userId);
    await trx('project_members').where({ project_id: projectId, user_id: userId }).delete();
    await recordAudit(trx, { userId: actorId, projectId, action: 'remove-member', entity: 'project_member', entityId: userId, detail: { role: current.role } });
  });
  return listMembers(db, projectId);
}

/** A project always keeps an engineer of record. */
async function assertAnotherEngineer(trx: Database, projectId: string, leavingUserId: string): Promise<void> {
  const others = await trx('project_members').where({ project_id: projectId, role: 'engineer' }).whereNot({ user_id: leavingUserId }).first('user_id');
  if (!others) throw AppError.conflict('A project keeps at least one engineer; add another engineer first.');
}
