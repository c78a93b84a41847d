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

type Answers<T extends readonly (() => Promise<unknown>)[]> = { -readonly [K in keyof T]: Awaited<ReturnType<T[K]>> };

/**
 * Several reads at once: in parallel on the pool, one after another in a transaction, which holds
 * one connection that runs one query at a time (pg refuses overlapping queries on one client from
 * its version 9; until then it warns).
 */
export async function readAll<const T extends readonly (() => Promise<unknown>)[]>(db: Database, reads: T): Promise<Answers<T>> {
  if (!db.isTransaction) return (await Promise.all(reads.map((read) => read()))) as Answers<T>;
  const answers: unknown[] = [];
  for (const read of reads) answers.push(await read());
  return answers as Answers<T>;
}
