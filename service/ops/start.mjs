// `npm start`: the whole set-up on a fresh machine, then the app with its demo on http://127.0.0.1:4300.
import { spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { clusterLocation, startCluster } from './postgres.mjs';
import { ensureDependencies, log, run } from './system.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const dataDir = path.join(root, '.data');
mkdirSync(dataDir, { recursive: true });

ensureDependencies(root);

/** Secrets generated once and kept under .data/, so a second start signs in with the same password. */
function localSecrets() {
  const file = path.join(dataDir, 'secrets.json');
  const stored = existsSync(file) ? JSON.parse(readFileSync(file, 'utf8')) : {};
  const secrets = {
    databasePassword: stored.databasePassword ?? randomBytes(18).toString('base64url'),
    jwtSecret: stored.jwtSecret ?? randomBytes(48).toString('base64url'),
    demoPassword: stored.demoPassword ?? `lamp-${randomBytes(6).toString('base64url')}`,
  };
  writeFileSync(file, `${JSON.stringify(secrets, null, 2)}\n`, { mode: 0o600 });
  return secrets;
}

const secrets = localSecrets();
const demoPassword = process.env.DEMO_PASSWORD || secrets.demoPassword;
let cluster = null;
let databaseUrl = process.env.DATABASE_URL;

if (!databaseUrl) {
  const location = clusterLocation(path.join(dataDir, 'postgres'));
  if (location.moved) {
    log(`the checkout's folders are closed to the postgres user, so the cluster lives in ${location.baseDir}`);
  }
  const port = Number(process.env.PG_PORT || 54329);
  cluster = startCluster({ baseDir: location.baseDir, port, password: secrets.databasePassword });
  cluster.ensureDatabase('allowlight');
  databaseUrl = cluster.url('allowlight');
  log(`PostgreSQL ${cluster.started ? 'started' : 'already running'} on 127.0.0.1:${port}`);
}

function stopCluster() {
  if (cluster?.started) {
    log('stopping PostgreSQL');
    try {
      cluster.stop();
    } catch (error) {
      console.error(error);
    }
    cluster = null;
  }
}

const tsx = ['--import', 'tsx'];
const schemaEnv = { ...process.env, DATABASE_URL: databaseUrl, DEMO_PASSWORD: demoPassword };
try {
  run(process.execPath, [...tsx, 'schema/cli.ts', 'migrate'], { cwd: root, env: schemaEnv });
  run(process.execPath, [...tsx, 'schema/cli.ts', 'seed'], { cwd: root, env: schemaEnv });
  if (process.env.SKIP_WEB_BUILD !== '1') {
    log('building the web app');
    run(path.join(root, 'node_modules', '.bin', 'ng'), ['build'], { cwd: root });
  }
} catch (error) {
  stopCluster();
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
}

const port = Number(process.env.PORT || 4300);
const server = spawn(process.execPath, [...tsx, 'service/src/main.ts'], {
  cwd: root,
  stdio: ['ignore', 'inherit', 'inherit'],
  env: {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV || 'production',
    PORT: String(port),
    DATABASE_URL: databaseUrl,
    JWT_SECRET: process.env.JWT_SECRET || secrets.jwtSecret,
    WEB_DIST: path.join(root, 'dist', 'web', 'browser'),
    LOG_LEVEL: process.env.LOG_LEVEL || 'warn',
  },
});

async function announceWhenReady() {
  const url = `http://127.0.0.1:${port}`;
  for (let attempt = 0; attempt < 120; attempt += 1) {
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) {
        console.log(`
  Allowlight is running at ${url}

  Demo sign-ins (password: ${demoPassword})
    engineer@alderbay.example     engineer on the demo project
    reviewer@alderbay.example     reviewer on the demo project
    contractor@alderbay.example   contractor on the demo project
    admin@alderbay.example        administrator

  Press Ctrl-C to stop the server${cluster?.started ? ' and the database' : ''}.
`);
        return;
      }
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  log('the server did not answer on /api/health within 30 s');
}

void announceWhenReady();

let stopping = false;
function shutdown() {
  if (stopping) return;
  stopping = true;
  server.kill('SIGTERM');
}

process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
server.on('exit', (code) => {
  stopCluster();
  process.exit(stopping ? 0 : (code ?? 1));
});
