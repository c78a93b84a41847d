// Keeps one child process running for `npm start`. Plain Node.js: it runs before `npm ci` may have.
import { spawn } from 'node:child_process';

export const defaultPolicy = {
  firstDelayMs: 1_000,
  maxDelayMs: 30_000,
  // A run at least this long was healthy: the next crash is a new problem, not the same one again.
  healthyAfterMs: 60_000,
  // This many exits within the window means restarting does not help; someone has to look.
  maxCrashes: 5,
  crashWindowMs: 120_000,
  // The service closes its connections within 5 s of SIGTERM; past this it is hung, not stopping.
  stopTimeoutMs: 10_000,
};

/** The pause before restart number `consecutive` of a run of crashes: doubling from the first, up to the cap. */
export function restartDelay(consecutive, { firstDelayMs, maxDelayMs }) {
  return Math.min(maxDelayMs, firstDelayMs * 2 ** (consecutive - 1));
}

export function formatDuration(ms) {
  return ms < 1_000 ? `${ms} ms` : `${Number((ms / 1_000).toFixed(1))} s`;
}

function describeExit(code, signal, error) {
  if (error) return `could not be started (${error.message})`;
  return signal ? `was ended by ${signal}` : `exited with code ${code}`;
}

/**
 * Spawns `command` and restarts it whenever it ends without having been asked to, after a pause
 * that grows with each crash in a row. `stop()` ends it for good; `done` resolves with
 * `{ reason: 'stopped' | 'gave-up', code, signal, runs }` once nothing is running or pending.
 */
export function supervise({
  name = 'the service',
  command,
  args = [],
  spawnOptions = {},
  policy = {},
  log = console.log,
  onStart = () => {},
  now = Date.now,
}) {
  const settings = { ...defaultPolicy, ...policy };
  const recentCrashes = [];
  let consecutive = 0;
  let runs = 0;
  let child = null;
  let restartTimer = null;
  let killTimer = null;
  let stopping = false;
  let finish;
  const done = new Promise((resolve) => {
    finish = resolve;
  });

  function start() {
    runs += 1;
    const startedAt = now();
    const current = spawn(command, args, spawnOptions);
    child = current;
    let ended = false;
    const end = (code, signal, error) => {
      if (ended) return;
      ended = true;
      child = null;
      clearTimeout(killTimer);
      if (stopping) finish({ reason: 'stopped', code, signal, runs });
      else crashed(now() - startedAt, code, signal, error);
    };
    current.on('error', (error) => {
      // Without a pid it never ran; otherwise this is a failed kill() and the process lives on.
      if (current.pid === undefined) end(null, null, error);
      else log(`${name}: ${error.message}`);
    });
    current.once('exit', (code, signal) => end(code, signal, null));
    onStart(current, runs);
  }

  function crashed(ranMs, code, signal, error) {
    const at = now();
    consecutive = ranMs >= settings.healthyAfterMs ? 1 : consecutive + 1;
    recentCrashes.push(at);
    while (at - recentCrashes[0] > settings.crashWindowMs) recentCrashes.shift();
    const what = `${name} ${describeExit(code, signal, error)} after ${formatDuration(ranMs)}`;
    if (recentCrashes.length >= settings.maxCrashes) {
      log(`${what}; it ended ${recentCrashes.length} times within ${formatDuration(settings.crashWindowMs)}, so it is not restarted again`);
      finish({ reason: 'gave-up', code, signal, runs });
      return;
    }
    const delay = restartDelay(consecutive, settings);
    log(`${what}; restarting in ${formatDuration(delay)}`);
    restartTimer = setTimeout(() => {
      restartTimer = null;
      start();
    }, delay);
  }

  function stop(signal = 'SIGTERM') {
    if (stopping) return done;
    stopping = true;
    if (restartTimer) {
      clearTimeout(restartTimer);
      restartTimer = null;
      finish({ reason: 'stopped', code: null, signal: null, runs });
    } else if (child) {
      const current = child;
      current.kill(signal);
      killTimer = setTimeout(() => {
        log(`${name} did not stop within ${formatDuration(settings.stopTimeoutMs)} of ${signal}; killing it`);
        current.kill('SIGKILL');
      }, settings.stopTimeoutMs);
    }
    return done;
  }

  start();
  return {
    stop,
    done,
    get child() {
      return child;
    },
  };
}
