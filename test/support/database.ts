import { randomBytes } from 'node:crypto';
import knex from 'knex';
import { inject } from 'vitest';
import { createDatabase, type Database } from '../../service/src/db/database.js';
import { templateDatabase, withDatabase } from './database-names.js';

export interface TestDatabase {
  db: Database;
  url: string;
  drop(): Promise<void>;
}

async function createTestDatabase(template: string | null): Promise<TestDatabase> {
  const adminUrl = inject('adminDatabaseUrl');
  const name = `t_${randomBytes(6).toString('hex')}`;
  const admin = knex({ client: 'pg', connection: adminUrl, pool: { min: 0, max: 1 } });
  await admin.raw(template ? `create database ${name} template ${template}` : `create database ${name}`);
  const url = withDatabase(adminUrl, name);
  const db = createDatabase(url, 4);
  return {
    db,
    url,
    async drop() {
      await db.destroy();
      await admin.raw(`drop database if exists ${name} with (force)`);
      await admin.destroy();
    },
  };
}

/** A database of its own for one test file, copied from the migrated and seeded template. */
export function freshDatabase(): Promise<TestDatabase> {
  return createTestDatabase(templateDatabase);
}

/** An empty database with no migrations, for the schema tests. */
export function emptyDatabase(): Promise<TestDatabase> {
  return createTestDatabase(null);
}
