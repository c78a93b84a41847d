import type { Database } from '../db/database.js';
import type { ProjectRole } from '../db/tables.js';

export interface ProjectSummary {
  id: string;
  name: string;
  state: string;
  role: ProjectRole | null;
  version: number;
  updatedAt: string;
}

interface ProjectListRow {
  id: string;
  name: string;
  state: string;
  version: number;
  updated_at: Date;
  role: ProjectRole | null;
}

function toSummary(row: ProjectListRow): ProjectSummary {
  return { id: row.id, name: row.name, state: row.state, role: row.role, version: row.version, updatedAt: row.updated_at.toISOString() };
}

/** Projects the user is a member of; every project for an administrator. */
export async function listProjectsFor(db: Database, userId: string, isAdmin: boolean): Promise<ProjectSummary[]> {
  const query = db('projects as p')
    .leftJoin('project_members as m', function joinMembership() {
      this.on('m.project_id', '=', 'p.id').andOn('m.user_id', '=', db.raw('?', [userId]));
    })
    .select<ProjectListRow[]>('p.id', 'p.name', 'p.state', 'p.version', 'p.updated_at', 'm.role')
    .orderBy('p.name');
  if (!isAdmin) {
    query.whereNotNull('m.role');
  }
  return (await query).map(toSummary);
}

export async function getProjectSummary(db: Database, projectId: string, role: ProjectRole | null): Promise<ProjectSummary | undefined> {
  const row = await db('projects').where({ id: projectId }).first<Omit<ProjectListRow, 'role'> | undefined>('id', 'name', 'state', 'version', 'updated_at');
  return row ? toSummary({ ...row, role }) : undefined;
}
