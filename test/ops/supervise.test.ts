import type { ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { defaultPolicy, restartDelay, supervise, type Supervised, type SupervisePolicy } from '../../service/ops/supervise.mjs';

let folder: string;
let script: string;
let counter: string;
const supervised: Supervised[] = [];

// Each run counts itself in a file, then follows the plan's step for that run (the last step
// repeats): exit with a code, end itself with a signal, keep running, or keep running and ignore
// SIGTERM. A running child says so on stdout and records a SIGTERM before it exits.
const child = `
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
const [counter, plan] = process.argv.slice(2);
const run = existsSync(counter) ? Number(readFileSync(counter, 'utf8')) + 1 : 1;
writeFileSync(counter, String(run));
const steps = plan.split(',');
const [step, value] = steps[Math.min(run, steps.length) - 1].split(':');
if (step === 'exit') process.exit(Number(value));
if (step === 'signal') process.kill(process.pid, value);
process.on('SIGTERM', () => {
  if (step === 'stubborn') return;
  writeFileSync(counter + '.stopped', String(run));
  process.exit(0);
});
setInterval(() => {}, 1 << 30);
console.log('running');
`;

beforeAll(() => {
  folder = mkdtempSync(path.join(os.tmpdir(), 'allowlight-supervise-test-'));
  script = path.join(folder, 'child.mjs');
  writeFileSync(script, child);
});

afterAll(() => {
  rmSync(folder, { recursive: true, force: true });
});

beforeEach(({ task }) => {
  counter = path.join(folder, `${task.id}.count`);
});

// A failed assertion must not leave a running child behind.
afterEach(async () => {
  await Promise.all(supervised.splice(0).map((service) => service.stop('SIGKILL')));
});

const runsCounted = () => Number(readFileSync(counter, 'utf8'));

function whenRunning(child: ChildProcess): Promise<ChildProcess> {
  return new Promise((resolve) => {
    child.stdout?.setEncoding('utf8');
    child.stdout?.on('data', (text: string) => {
      if (text.includes('running')) resolve(child);
    });
  });
}

function superviseChild(
  plan: string,
  policy: Partial<SupervisePolicy>,
  options: { now?: () => number; onLog?: (line: string) => void; onStart?: (run: number) => void } = {},
) {
  const lines: string[] = [];
  let announceRunning: (child: ChildProcess) => void = () => {};
  const running = new Promise<ChildProcess>((resolve) => {
    announceRunning = resolve;
  });
  const service = supervise({
    name: 'the test child',
    command: process.execPath,
    args: [script, counter, plan],
    spawnOptions: { stdio: ['ignore', 'pipe', 'inherit'] },
    policy,
    now: options.now,
    log: (line) => {
      lines.push(line);
      options.onLog?.(line);
    },
    onStart: (started, run) => {
      options.onStart?.(run);
      void whenRunning(started).then(announceRunning);
    },
  });
  supervised.push(service);
  return { service, lines, running };
}

describe('restartDelay', () => {
  it('doubles from one second up to thirty by default', () => {
    expect([1, 2, 3, 4, 5, 6, 7].map((crash) => restartDelay(crash, defaultPolicy))).toEqual([
      1_000, 2_000, 4_000, 8_000, 16_000, 30_000, 30_000,
    ]);
  });
});

describe('supervise', () => {
  it('restarts a child that exits or is killed, logging how it ended, and a stop ends it without a restart', async () => {
    const { service, lines, running } = superviseChild('exit:3,signal:SIGKILL,run', { firstDelayMs: 5, maxDelayMs: 50 });
    const third = await running;
    expect(runsCounted()).toBe(3);
    expect(lines).toEqual([
      expect.stringMatching(/^the test child exited with code 3 after \d+ m?s; restarting in 5 ms$/),
      expect.stringMatching(/^the test child was ended by SIGKILL after \d+ m?s; restarting in 10 ms$/),
    ]);
    expect(service.child).toBe(third);

    const outcome = await service.stop();
    expect(outcome).toEqual({ reason: 'stopped', code: 0, signal: null, runs: 3 });
    expect(readFileSync(`${counter}.stopped`, 'utf8')).toBe('3');
    expect(() => process.kill(third.pid!, 0)).toThrow(/ESRCH/);
    expect(lines).toHaveLength(2);
    expect(service.child).toBeNull();
  });

  it('gives up with a clear message when the child keeps ending within a short time, the pauses doubling up to the cap', async () => {
    const { service, lines } = superviseChild('exit:1', { firstDelayMs: 2, maxDelayMs: 8, maxCrashes: 5, crashWindowMs: 60_000 });
    const outcome = await service.done;
    expect(outcome).toEqual({ reason: 'gave-up', code: 1, signal: null, runs: 5 });
    expect(runsCounted()).toBe(5);
    expect(lines.map((line) => /restarting in (\d+ ms)$/.exec(line)?.[1])).toEqual(['2 ms', '4 ms', '8 ms', '8 ms', undefined]);
    expect(lines[4]).toMatch(
      /^the test child exited with code 1 after \d+ m?s; it ended 5 times within 60 s, so it is not restarted again$/,
    );
  });

  it('starts the pauses over after a healthy run, and forgets crashes older than the window', async () => {
    // The supervisor's clock, moved on by an hour while the third run is up.
    let clock = 0;
    const { service, lines, running } = superviseChild(
      'exit:1,exit:1,exit:1,exit:1,run',
      { firstDelayMs: 2, maxDelayMs: 1_000, healthyAfterMs: 60_000, maxCrashes: 3, crashWindowMs: 120_000 },
      {
        now: () => clock,
        onStart: (run) => {
          if (run === 3) clock += 3_600_000;
        },
      },
    );
    await running;
    expect(lines.map((line) => /after (.+); restarting in (\d+ ms)$/.exec(line)?.slice(1))).toEqual([
      ['0 ms', '2 ms'],
      ['0 ms', '4 ms'],
      ['3600 s', '2 ms'],
      ['0 ms', '4 ms'],
    ]);
    expect(await service.stop()).toMatchObject({ reason: 'stopped', runs: 5 });
  });

  it('stops at once during the pause before a restart, and does not start the child again', async () => {
    let paused: () => void = () => {};
    const pause = new Promise<void>((resolve) => {
      paused = resolve;
    });
    const { service, lines } = superviseChild(
      'exit:4,run',
      { firstDelayMs: 600_000, maxDelayMs: 600_000 },
      { onLog: (line) => line.includes('restarting in 600 s') && paused() },
    );
    await pause;
    expect(await service.stop()).toEqual({ reason: 'stopped', code: null, signal: null, runs: 1 });
    expect(runsCounted()).toBe(1);
    expect(lines).toHaveLength(1);
  });

  it('kills a child that does not stop within the stop timeout', async () => {
    const { service, lines, running } = superviseChild('stubborn', { stopTimeoutMs: 100 });
    await running;
    expect(await service.stop()).toEqual({ reason: 'stopped', code: null, signal: 'SIGKILL', runs: 1 });
    expect(lines).toEqual(['the test child did not stop within 100 ms of SIGTERM; killing it']);
    expect(existsSync(`${counter}.stopped`)).toBe(false);
  });

  it('counts a command that cannot be started as a crash', async () => {
    const service = supervise({
      name: 'nothing',
      command: path.join(folder, 'no-such-program'),
      policy: { firstDelayMs: 1, maxCrashes: 2 },
      log: () => {},
    });
    expect(await service.done).toEqual({ reason: 'gave-up', code: null, signal: null, runs: 2 });
  });
});
