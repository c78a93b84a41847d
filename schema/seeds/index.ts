import type { Knex } from 'knex';
import * as codeTables from './00_code_tables.js';
import * as demoUsers from './01_demo_users.js';
import * as demoProject from './02_demo_project.js';

interface Seed {
  seed(knex: Knex): Promise<void>;
}

/** Every seed in the order it runs. Add a new file here as well as in the folder. */
const seeds: Record<string, Seed> = {
  '00_code_tables': codeTables,
  '01_demo_users': demoUsers,
  '02_demo_project': demoProject,
};

export const seedSource: Knex.SeedSource<string> = {
  getSeeds: async () => Object.keys(seeds).sort(),
  getSeed: async (name) => {
    const seed = seeds[name];
    if (!seed) throw new Error(`Unknown seed ${name}`);
    return seed;
  },
};
