// `npm start`: the whole set-up on a fresh machine, then the app with its demo on http://127.0.0.1:4300.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { clusterLocation, startCluster } from './postgres.mjs';
import { supervise } from './supervise.mjs';
import { ensureChromium, ensureDependencies, log, run } from './system.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const dataDir = path.join(root, '.data');
mkdirSync(dataDir, { recursive: true });

ensureDependencies(root);
// The submittal package's PDF is printed by headless Chromium from Debian's package.
ensureChromium();

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
const url = `http://127.0.0.1:${port}`;

async function answersHealth() {
  try {
    return (await fetch(`${url}/api/health`)).ok;
  } catch {
    return false;
  }
}

async function announceWhenReady(run) {
  for (let attempt = 0; attempt < 120; attempt += 1) {
    if (await answersHealth()) {
      if (run > 1) {
        log(`the server answers again at ${url}`);
        return;
      }
      console.log(`
  Allowlight is running at ${url}

  Demo sign-ins (password: ${demoPassword})
    engineer@alderbay.example     engineer on the demo project
    reviewer@alderbay.example     reviewer on the demo project
    contractor@alderbay.example   contractor on the demo project
    admin@alderbay.example        administrator
${
  mailCatcher
    ? `
  Mail the app sends: .data/mail/, and the Outbox page when signed in as the administrator.
`
    : ''
}
  Press Ctrl-C to stop the server${cluster?.started ? ' and the database' : ''}.
`);
      return;
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  log('the server did not answer on /api/health within 30 s');
}

// The app's mail goes to a local SMTP server that keeps each message under .data/mail/, unless
// SMTP_HOST names a real relay. Imported here, after the dependencies are installed.
let mailCatcher = null;
if (!process.env.SMTP_HOST) {
  const { startMailCatcher } = await import('./mail-catcher.mjs');
  const dir = path.join(dataDir, 'mail');
  const wanted = Number(process.env.SMTP_PORT || 2525);
  mailCatcher = await startMailCatcher({ dir, port: wanted }).catch((error) => {
    if (error?.code !== 'EADDRINUSE') throw error;
    return startMailCatcher({ dir, port: 0 });
  });
  log(`mail the app sends is kept in .data/mail/ (a local SMTP server on 127.0.0.1:${mailCatcher.port})`);
}

// Package files go to a local S3-compatible server keeping them under .data/s3/, unless
// S3_ENDPOINT or S3_BUCKET names a real store.
let localS3 = null;
if (!process.env.S3_ENDPOINT && !process.env.S3_BUCKET) {
  const { startLocalS3, localS3Credentials } = await import('./s3-server.mjs');
  const dir = path.join(dataDir, 's3');
  const bucket = 'allowlight-packages';
  const wanted = Number(process.env.S3_LOCAL_PORT || 4568);
  localS3 = await startLocalS3({ dir, bucket, port: wanted }).catch((error) => {
    if (error?.code !== 'EADDRINUSE') throw error;
    return startLocalS3({ dir, bucket, port: 0 });
  });
  localS3.env = {
    S3_ENDPOINT: localS3.endpoint,
    S3_BUCKET: bucket,
    S3_FORCE_PATH_STYLE: 'true',
    S3_ACCESS_KEY_ID: localS3Credentials.accessKeyId,
    S3_SECRET_ACCESS_KEY: localS3Credentials.secretAccessKey,
  };
  log(`package files are kept in .data/s3/ (a local S3 server on 127.0.0.1:${localS3.port})`);
}

const service = supervise({
  name: 'the server',
  command: process.execPath,
  args: [...tsx, 'service/src/main.ts'],
  spawnOptions: {
    cwd: root,
    stdio: ['ignore', 'inherit', 'inherit'],
    // Its own process group: Ctrl-C reaches only this process, which stops the server on purpose,
    // so a server that ends on the same keystroke is never mistaken for one that crashed.
    detached: true,
    env: {
      ...process.env,
      NODE_ENV: process.env.NODE_ENV || 'production',
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      JWT_SECRET: process.env.JWT_SECRET || secrets.jwtSecret,
      WEB_DIST: path.join(root, 'dist', 'web', 'browser'),
      LOG_LEVEL: process.env.LOG_LEVEL || 'warn',
      APP_URL: process.env.APP_URL || url,
      ...(localS3 ? localS3.env : {}),
      ...(mailCatcher ? { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(mailCatcher.port), SMTP_SECURE: 'false' } : {}),
    },
  },
  log,
  onStart: (_child, run) => void announceWhenReady(run),
});

let stopRequested = false;
for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP']) {
  process.on(signal, () => {
    if (stopRequested) return;
    stopRequested = true;
    log(`${signal}: stopping the server${cluster?.started ? ' and PostgreSQL' : ''}`);
    void service.stop('SIGTERM');
  });
}

const outcome = await service.done;
await mailCatcher?.close();
await localS3?.close();
stopCluster();
process.exit(outcome.reason === 'stopped' ? 0 : 1);
