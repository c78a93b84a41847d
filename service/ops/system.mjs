// Set-up helpers for the two commands. Plain Node.js with no dependencies: they run before `npm ci`.
import { createHash } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

export const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function log(message) {
  console.log(`[allowlight] ${message}`);
}

/** Runs a command with inherited output; throws when it fails. */
export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.error) throw result.error;
  if (result.status !== 0) {
    throw new Error(`${command} ${args.join(' ')} exited with ${result.status ?? result.signal}`);
  }
  return result;
}

/** Runs a command quietly and returns its trimmed standard output, or null when it fails. */
export function capture(command, args, options = {}) {
  const result = spawnSync(command, args, { encoding: 'utf8', ...options });
  return result.status === 0 ? result.stdout.trim() : null;
}

let aptUpdated = false;

/** Installs Debian packages with apt-get (as root); a clear message otherwise. */
export function aptInstall(packages, why) {
  if (!isRoot) {
    throw new Error(
      `${why} needs the Debian package(s) ${packages.join(', ')}. Install them with: sudo apt-get install -y ${packages.join(' ')}`,
    );
  }
  log(`installing ${packages.join(', ')} from Debian's packages (${why})`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    run('apt-get', ['update', '-qq'], { env });
    aptUpdated = true;
  }
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], { env });
}

/** Installs the npm dependencies when node_modules is missing or older than package-lock.json. */
export function ensureDependencies(root) {
  const lockFile = path.join(root, 'package-lock.json');
  const stampFile = path.join(root, 'node_modules', '.allowlight-lock-hash');
  const lockHash = createHash('sha256').update(readFileSync(lockFile)).digest('hex');
  const installed = existsSync(stampFile) ? readFileSync(stampFile, 'utf8').trim() : '';
  if (installed === lockHash && existsSync(path.join(root, 'node_modules', '.bin', 'ng'))) {
    return;
  }
  log(
    existsSync(path.join(root, 'node_modules'))
      ? 'package-lock.json changed: reinstalling dependencies'
      : 'installing dependencies (npm ci)',
  );
  run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
  writeFileSync(stampFile, `${lockHash}\n`);
}

export const chromiumPath = '/usr/bin/chromium';

export function ensureChromium() {
  if (!existsSync(chromiumPath)) {
    aptInstall(['chromium'], 'the package PDF and the browser tests');
  }
}
