import type { Knex } from 'knex';
import { migrationSource } from './migrations/index.js';
import { seedSource } from './seeds/index.js';

/** Knex settings with static migration and seed sources, so TypeScript files load under tsx and vitest alike. */
export function knexConfig(connectionString: string): Knex.Config {
  return {
    client: 'pg',
    connection: connectionString,
    pool: { min: 0, max: 4 },
    migrations: { migrationSource, tableName: 'knex_migrations' },
    seeds: { seedSource },
  };
}

export default knexConfig(process.env['DATABASE_URL'] ?? 'postgres://app@127.0.0.1:54329/allowlight');
