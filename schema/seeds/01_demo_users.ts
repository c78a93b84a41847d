import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { demoProjectName, demoUsers } from './demo-data.js';

/** Creates the demo team and project once; later runs keep their data and refresh only the password. */
export async function seed(knex: Knex): Promise<void> {
  const password = process.env['DEMO_PASSWORD'];
  if (!password) {
    throw new Error('DEMO_PASSWORD must be set to seed the demo users.');
  }
  const userIds = new Map<string, string>();
  for (const demo of demoUsers) {
    const existing = await knex('users')
      .whereRaw('lower(email) = lower(?)', [demo.email])
      .first<{ id: string; password_hash: string } | undefined>('id', 'password_hash');
    if (existing) {
      if (!(await bcrypt.compare(password, existing.password_hash))) {
        await knex('users')
          .where({ id: existing.id })
          .update({ password_hash: await bcrypt.hash(password, 10) });
      }
      userIds.set(demo.email, existing.id);
      continue;
    }
    const [row] = await knex('users')
      .insert({ email: demo.email, name: demo.name, is_admin: demo.isAdmin, password_hash: await bcrypt.hash(password, 10) })
      .returning<{ id: string }[]>('id');
    userIds.set(demo.email, row!.id);
  }

  const existingProject = await knex('projects').where({ name: demoProjectName }).first<{ id: string } | undefined>('id');
  if (existingProject) return;
  const engineerId = userIds.get('engineer@alderbay.example')!;
  const [project] = await knex('projects').insert({ name: demoProjectName, created_by: engineerId }).returning<{ id: string }[]>('id');
  const members = demoUsers.flatMap((demo) =>
    demo.projectRole === null ? [] : [{ project_id: project!.id, user_id: userIds.get(demo.email)!, role: demo.projectRole }],
  );
  await knex('project_members').insert(members);
}
