// `npm test`: the whole set-up on a fresh machine, then every test. Exits non-zero if any fails.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensurePostgresBinaries } from './postgres.mjs';
import { ensureChromium, ensureDependencies, log } from './system.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const output = path.join(root, 'test-output');
const bin = (name) => path.join(root, 'node_modules', '.bin', name);

ensureDependencies(root);
ensurePostgresBinaries();
ensureChromium();
mkdirSync(output, { recursive: true });

/** Vitest's JSON report: the counts for the closing line. */
function counts(reportFile) {
  if (!existsSync(reportFile)) return { passed: 0, failed: 0, skipped: 0 };
  const report = JSON.parse(readFileSync(reportFile, 'utf8'));
  return {
    passed: report.numPassedTests ?? 0,
    // A file that failed without a failing test (it did not load, a hook threw) counts once; vitest's
    // numFailedTestSuites also counts the describe blocks around a failing test, so it is not used.
    failed: (report.numFailedTests ?? 0) + countFailedFilesWithoutFailedTests(report),
    skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
  };
}

function countFailedFilesWithoutFailedTests(report) {
  return (report.testResults ?? []).filter(
    (file) => file.status === 'failed' && !(file.assertionResults ?? []).some((test) => test.status === 'failed'),
  ).length;
}

const steps = [
  {
    // tsx, vitest and the web test runner strip types without checking them: the checker runs first.
    name: 'type checks of service, schema, tests and web (tsc)',
    command: process.platform === 'win32' ? 'npm.cmd' : 'npm',
    args: () => ['run', '--silent', 'typecheck'],
  },
  {
    // ESLint (typescript-eslint, angular-eslint) and Prettier in check mode: `npm run format` fixes the layout.
    name: 'lint and formatting (eslint, prettier --check)',
    command: process.platform === 'win32' ? 'npm.cmd' : 'npm',
    args: () => ['run', '--silent', 'lint'],
  },
  {
    name: 'web unit tests (ng test)',
    report: path.join(output, 'web-unit.json'),
    command: bin('ng'),
    args: (report) => ['test', '--watch=false', '--reporters=json', '--reporters=default', `--output-file=${report}`],
  },
  {
    name: 'web build (ng build)',
    command: bin('ng'),
    args: () => ['build'],
  },
  {
    name: 'calculation, reference, schema, service and browser tests (vitest)',
    report: path.join(output, 'vitest.json'),
    command: bin('vitest'),
    args: (report) => [
      'run',
      '--config',
      'test/vitest.config.ts',
      '--reporter=default',
      '--reporter=json',
      `--outputFile.json=${report}`,
      ...process.argv.slice(2),
    ],
  },
];

const totals = { passed: 0, failed: 0, skipped: 0 };
const failedSteps = [];
for (const step of steps) {
  log(step.name);
  if (step.report) rmSync(step.report, { force: true });
  const result = spawnSync(step.command, step.args(step.report), {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, FORCE_COLOR: process.env.CI ? '0' : '1' },
  });
  if (step.report) {
    const stepCounts = counts(step.report);
    totals.passed += stepCounts.passed;
    totals.failed += stepCounts.failed;
    totals.skipped += stepCounts.skipped;
  }
  if (result.status !== 0) {
    failedSteps.push(step.name);
    if (!step.report) totals.failed += 1;
  }
}

if (failedSteps.length) {
  log(`failed: ${failedSteps.join('; ')}`);
  if (totals.failed === 0) totals.failed = failedSteps.length;
}
console.log(`tests: ${totals.passed} passed, ${totals.failed} failed, ${totals.skipped} skipped`);
process.exit(failedSteps.length ? 1 : 0);
