// `npm run bench`: the set-up the tests need, then the performance targets (test/bench/run.ts).
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensurePostgresBinaries } from './postgres.mjs';
import { ensureChromium, ensureDependencies, log, run } from './system.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
ensureDependencies(root);
ensurePostgresBinaries();
ensureChromium();
log('building the web app for the browser figures');
run(path.join(root, 'node_modules', '.bin', 'ng'), ['build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
const result = spawnSync(process.execPath, ['--import', 'tsx', 'test/bench/run.ts'], { cwd: root, stdio: 'inherit' });
process.exit(result.status ?? 1);
