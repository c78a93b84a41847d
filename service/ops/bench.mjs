// `npm run bench`: the set-up the tests need, then the performance targets (test/bench/run.ts).
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensurePostgresBinaries } from './postgres.mjs';
import { ensureDependencies } from './system.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
ensureDependencies(root);
ensurePostgresBinaries();
const result = spawnSync(process.execPath, ['--import', 'tsx', 'test/bench/run.ts'], { cwd: root, stdio: 'inherit' });
process.exit(result.status ?? 1);
