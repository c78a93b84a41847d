import knex, { type Knex } from 'knex';

export type Database = Knex;

export function createDatabase(connectionString: string, poolMax = 10): Database {
  return knex({
    client: 'pg',
    connection: connectionString,
    pool: { min: 0, max: poolMax },
  });
}

/** Answers when the database does; throws when it does not (the health check). */
export async function ping(db: Database): Promise<void> {
  await db.raw('select 1');
}
