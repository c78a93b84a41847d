import knex from 'knex';
import { knexConfig } from './knexfile.js';

/** `migrate` brings the schema to the latest version, `rollback` undoes every migration, `seed` loads the seeds. */
const command = process.argv[2];
const url = process.env['DATABASE_URL'];
if (!url) {
  console.error('DATABASE_URL is not set.');
  process.exit(2);
}

const db = knex(knexConfig(url));
try {
  if (command === 'migrate') {
    const [batch, names] = await db.migrate.latest();
    console.log(names.length ? `migrated (batch ${batch}): ${names.join(', ')}` : 'schema is up to date');
  } else if (command === 'rollback') {
    const [, names] = await db.migrate.rollback(undefined, true);
    console.log(`rolled back: ${names.join(', ') || 'nothing'}`);
  } else if (command === 'seed') {
    const [names] = await db.seed.run();
    console.log(`seeded: ${names.join(', ')}`);
  } else {
    console.error('usage: cli.ts migrate | rollback | seed');
    process.exitCode = 2;
  }
} finally {
  await db.destroy();
}
