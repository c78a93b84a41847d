import knex from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { knexConfig } from '../../schema/knexfile.js';
import { emptyDatabase, type TestDatabase } from '../support/database.js';

let database: TestDatabase;

beforeAll(async () => {
  database = await emptyDatabase();
});

afterAll(async () => {
  await database.drop();
});

async function tables(db: knex.Knex): Promise<string[]> {
  const rows = await db('information_schema.tables').where({ table_schema: 'public' }).pluck('table_name');
  return rows.filter((name: string) => !name.startsWith('knex_')).sort();
}

describe('migrations', () => {
  it('migrate to latest, roll back all, and migrate to latest again', async () => {
    const db = knex(knexConfig(database.url));
    try {
      const [, applied] = await db.migrate.latest();
      expect(applied.length).toBeGreaterThan(0);
      const afterFirst = await tables(db);
      expect(afterFirst).toEqual(expect.arrayContaining(['audit_log', 'project_members', 'projects', 'users']));

      await db.migrate.rollback(undefined, true);
      expect(await tables(db)).toEqual([]);

      const [, reapplied] = await db.migrate.latest();
      expect(reapplied).toEqual(applied);
      expect(await tables(db)).toEqual(afterFirst);
    } finally {
      await db.destroy();
    }
  });
});
