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

/** Every column of the public tables with its type, nullability and default, in one comparable list. */
async function columns(db: knex.Knex): Promise<string[]> {
  const rows = (await db('information_schema.columns')
    .where({ table_schema: 'public' })
    .whereNot('table_name', 'like', 'knex_%')
    .select(
      'table_name',
      'column_name',
      'data_type',
      'udt_name',
      'is_nullable',
      'column_default',
      'character_maximum_length',
      'numeric_precision',
    )) as Record<string, unknown>[];
  return rows.map((row) => Object.values(row).map(String).join(' | ')).sort();
}

/** Every constraint (primary, foreign, unique, check) and index, by its definition. */
async function constraints(db: knex.Knex): Promise<string[]> {
  const checks = await db.raw<{ rows: { line: string }[] }>(`
    select conrelid::regclass::text || ' ' || conname || ' ' || pg_get_constraintdef(oid) as line
      from pg_constraint where connamespace = 'public'::regnamespace and conrelid::regclass::text not like 'knex_%'`);
  const indexes = await db.raw<{ rows: { line: string }[] }>(`
    select indexdef as line from pg_indexes where schemaname = 'public' and tablename not like 'knex_%'`);
  return [...checks.rows, ...indexes.rows].map((row) => row.line).sort();
}

describe('migrations', () => {
  it('migrate to latest, roll back all, and migrate to latest again', async () => {
    const db = knex(knexConfig(database.url));
    try {
      const [, applied] = await db.migrate.latest();
      expect(applied.length).toBeGreaterThan(0);
      const afterFirst = await tables(db);
      expect(afterFirst).toEqual(expect.arrayContaining(['audit_log', 'project_members', 'projects', 'users']));
      const columnsFirst = await columns(db);
      const constraintsFirst = await constraints(db);
      // Spot checks that the lists read what they should: a typed column and a foreign key.
      expect(columnsFirst).toContain('projects | version | integer | int4 | NO | 1 | null | 32');
      expect(constraintsFirst.some((line) => /^project_members \S+ FOREIGN KEY \(project_id\) REFERENCES projects\(id\)/.test(line))).toBe(
        true,
      );

      await db.migrate.rollback(undefined, true);
      expect(await tables(db)).toEqual([]);
      expect(await columns(db)).toEqual([]);
      // Nothing of ours may remain: no column, constraint or index.
      expect(await constraints(db)).toEqual([]);

      const [, reapplied] = await db.migrate.latest();
      expect(reapplied).toEqual(applied);
      expect(await tables(db)).toEqual(afterFirst);
      expect(await columns(db)).toEqual(columnsFirst);
      expect(await constraints(db)).toEqual(constraintsFirst);
    } finally {
      await db.destroy();
    }
  });
});
