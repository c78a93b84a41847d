import knex, { type Knex } from 'knex';

export type Database = Knex;

export function createDatabase(connectionString: string, poolMax = 10): Database {
  return knex({
    client: 'pg',
    connection: connectionString,
    pool: { min: 0, max: poolMax },
  });
}
