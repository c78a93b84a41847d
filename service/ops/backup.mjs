// Backups of one database as pg_dump custom-format archives, and their restore. Plain Node.js:
// `npm run backup` and `npm run restore` may run on a machine where `npm ci` never did.
import { spawn } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, openSync, readSync, renameSync, rmSync, statSync } from 'node:fs';
import path from 'node:path';

// Every custom-format archive starts with these bytes (pg_backup_archiver.c writes them first).
const archiveMagic = Buffer.from('PGDMP');

// The connection-string parameters libpq also reads from the environment, so none of them has to
// appear on a command line.
const parameterVariables = {
  sslmode: 'PGSSLMODE',
  sslrootcert: 'PGSSLROOTCERT',
  sslcert: 'PGSSLCERT',
  sslkey: 'PGSSLKEY',
  connect_timeout: 'PGCONNECT_TIMEOUT',
  application_name: 'PGAPPNAME',
};

/**
 * Arguments and environment for pg_dump and pg_restore. The password travels in PGPASSWORD: a
 * command line, connection string included, is readable by anyone through `ps`.
 */
export function connectionFor(url) {
  const parsed = new URL(url);
  if (parsed.protocol !== 'postgres:' && parsed.protocol !== 'postgresql:') {
    throw new Error(`not a PostgreSQL connection string: ${parsed.protocol}//…`);
  }
  const database = decodeURIComponent(parsed.pathname.replace(/^\//, ''));
  if (!database) throw new Error('the connection string names no database');
  const args = [];
  const host = decodeURIComponent(parsed.hostname).replace(/^\[(.*)\]$/, '$1');
  if (host) args.push('--host', host);
  if (parsed.port) args.push('--port', parsed.port);
  if (parsed.username) args.push('--username', decodeURIComponent(parsed.username));
  args.push('--dbname', database);
  const env = { ...process.env };
  if (parsed.password) env.PGPASSWORD = decodeURIComponent(parsed.password);
  for (const [name, value] of parsed.searchParams) {
    const variable = parameterVariables[name];
    if (!variable) throw new Error(`the connection-string parameter ${name} is not supported by backup and restore`);
    env[variable] = value;
  }
  return { args, env, database };
}

/** 2026-03-04T05:06:07.890Z → 20260304T050607Z: sorts by time and has no colons, which some file systems refuse. */
export function backupTimestamp(date = new Date()) {
  return date
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/[-:]/g, '');
}

export function formatSize(bytes) {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${(bytes / 1024 / 1024).toFixed(1)} MiB`;
}

function targetFile(file, now) {
  const isFolder = file.endsWith(path.sep) || file.endsWith('/') || (existsSync(file) && statSync(file).isDirectory());
  const target = isFolder ? path.join(file, `allowlight-${backupTimestamp(now)}.dump`) : file;
  if (existsSync(target)) {
    throw new Error(`${target} already exists; a backup never overwrites a file (choose another name or folder)`);
  }
  return path.resolve(target);
}

/** Runs a PostgreSQL tool; resolves with its standard error, rejects with it when the tool fails. */
function runTool(executable, args, env, signal) {
  return new Promise((resolve, reject) => {
    const child = spawn(executable, args, { env, stdio: ['ignore', 'inherit', 'pipe'], signal });
    let stderr = '';
    child.stderr.setEncoding('utf8');
    child.stderr.on('data', (chunk) => {
      stderr += chunk;
    });
    child.on('error', (error) => reject(error.name === 'AbortError' ? new Error(`${path.basename(executable)} was interrupted`) : error));
    child.on('close', (code, exitSignal) => {
      if (code === 0) resolve(stderr.trim());
      else
        reject(
          Object.assign(new Error(stderr.trim() || `${path.basename(executable)} exited with ${code ?? exitSignal}`), {
            exitCode: code,
            signal: exitSignal,
          }),
        );
    });
  });
}

/**
 * Writes a custom-format archive of the database at `url` to `file` (a file, or a folder to name
 * one in). The archive appears under its final name only once pg_dump has finished, so a failed or
 * interrupted backup never leaves a file that looks like a good one.
 */
export async function backupDatabase({ url, bin, file, now = new Date(), signal }) {
  const target = targetFile(file, now);
  mkdirSync(path.dirname(target), { recursive: true, mode: 0o700 });
  const partial = `${target}.partial`;
  // The archive holds the users' password hashes: created private before pg_dump writes into it.
  closeSync(openSync(partial, 'wx', 0o600));
  const connection = connectionFor(url);
  try {
    await runTool(path.join(bin, 'pg_dump'), ['--format=custom', '--file', partial, ...connection.args], connection.env, signal);
    renameSync(partial, target);
  } catch (error) {
    rmSync(partial, { force: true });
    throw new Error(`backup of ${connection.database} failed, no archive was written: ${error.message}`);
  }
  return { file: target, bytes: statSync(target).size };
}

function startsLikeAnArchive(file) {
  const head = Buffer.alloc(archiveMagic.length);
  const descriptor = openSync(file, 'r');
  try {
    return readSync(descriptor, head, 0, head.length, 0) === head.length && head.equals(archiveMagic);
  } finally {
    closeSync(descriptor);
  }
}

/**
 * Replaces the contents of the database at `url` with the archive `file`, in one transaction: if
 * anything fails, nothing of the restore stays and the database is as it was.
 */
export async function restoreDatabase({ url, bin, file, signal }) {
  const notAnArchive = `${file} is not a pg_dump custom-format archive (npm run backup writes those); nothing was restored`;
  if (!existsSync(file) || !statSync(file).isFile()) throw new Error(`${file} does not exist or is not a file; nothing was restored`);
  if (!startsLikeAnArchive(file)) throw new Error(notAnArchive);
  const pgRestore = path.join(bin, 'pg_restore');
  const connection = connectionFor(url);
  try {
    // Reads the whole table of contents, so a damaged header is refused before the database is touched.
    await runTool(pgRestore, ['--list', '--file', '/dev/null', file], process.env, signal);
  } catch (error) {
    throw new Error(`${notAnArchive}: ${error.message}`);
  }
  try {
    const warnings = await runTool(
      pgRestore,
      ['--clean', '--if-exists', '--no-owner', '--single-transaction', '--exit-on-error', ...connection.args, file],
      connection.env,
      signal,
    );
    return { file, database: connection.database, warnings };
  } catch (error) {
    throw new Error(`restore of ${connection.database} failed and was rolled back, so the database is as it was before: ${error.message}`);
  }
}
