// `npm run backup [PATH]` and `npm run restore FILE`, against the database `npm start` serves.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { backupDatabase, formatSize, restoreDatabase } from './backup.mjs';
import { clusterLocation, ensurePostgresBinaries, startCluster } from './postgres.mjs';
import { log } from './system.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const dataDir = path.join(root, '.data');
const [command, given] = process.argv.slice(2);

/**
 * npm runs a script from the package folder; a path the user typed means one from where they typed
 * it. A trailing slash still says "a folder", even one that does not exist yet.
 */
function typedPath(typed) {
  const resolved = path.resolve(process.env.INIT_CWD || process.cwd(), typed);
  return typed.endsWith('/') || typed.endsWith(path.sep) ? resolved + path.sep : resolved;
}

/**
 * Runs `work` against DATABASE_URL, or else against the project-local cluster as `npm start` finds
 * it. A cluster that was not running is started for the work and stopped again after it.
 */
async function withConfiguredDatabase(work) {
  const bin = ensurePostgresBinaries();
  if (process.env.DATABASE_URL) return work({ url: process.env.DATABASE_URL, bin });

  const secretsFile = path.join(dataDir, 'secrets.json');
  const location = clusterLocation(path.join(dataDir, 'postgres'));
  // startCluster would create an empty cluster where none is: a backup of that, or a restore into
  // it with a password nobody kept, helps no one.
  if (!existsSync(secretsFile) || !existsSync(path.join(location.baseDir, 'pg', 'PG_VERSION'))) {
    throw new Error('there is no local database yet: `npm start` creates it (or set DATABASE_URL to use another server)');
  }
  const { databasePassword } = JSON.parse(readFileSync(secretsFile, 'utf8'));
  const port = Number(process.env.PG_PORT || 54329);
  const cluster = startCluster({ baseDir: location.baseDir, port, password: databasePassword });
  if (cluster.started) log(`started PostgreSQL on 127.0.0.1:${port} for the ${command}; it stops again afterwards`);
  try {
    return await work({ url: cluster.url('allowlight'), bin });
  } finally {
    if (cluster.started) {
      log('stopping PostgreSQL');
      cluster.stop();
    }
  }
}

const interrupt = new AbortController();
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => interrupt.abort());
}

async function main() {
  if (command === 'backup') {
    const file = given ? typedPath(given) : path.join(dataDir, 'backups') + path.sep;
    await withConfiguredDatabase(async ({ url, bin }) => {
      const written = await backupDatabase({ url, bin, file, signal: interrupt.signal });
      log(`backup written to ${written.file} (${formatSize(written.bytes)})`);
    });
  } else if (command === 'restore' && given) {
    const file = typedPath(given);
    await withConfiguredDatabase(async ({ url, bin }) => {
      const restored = await restoreDatabase({ url, bin, file, signal: interrupt.signal });
      if (restored.warnings) console.error(restored.warnings);
      log(`restored ${restored.file} into the database ${restored.database}`);
    });
  } else {
    console.error('usage: npm run backup [FILE or FOLDER]   |   npm run restore FILE');
    process.exitCode = 2;
  }
}

try {
  await main();
} catch (error) {
  console.error(`[allowlight] ${error instanceof Error ? error.message : error}`);
  process.exitCode = 1;
}
