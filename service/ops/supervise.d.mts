import type { ChildProcess, SpawnOptions } from 'node:child_process';

export interface SupervisePolicy {
  firstDelayMs: number;
  maxDelayMs: number;
  healthyAfterMs: number;
  maxCrashes: number;
  crashWindowMs: number;
  stopTimeoutMs: number;
}
export interface SupervisedOutcome {
  reason: 'stopped' | 'gave-up';
  code: number | null;
  signal: NodeJS.Signals | null;
  runs: number;
}
export interface Supervised {
  stop(signal?: NodeJS.Signals): Promise<SupervisedOutcome>;
  done: Promise<SupervisedOutcome>;
  readonly child: ChildProcess | null;
}
export const defaultPolicy: SupervisePolicy;
export function restartDelay(consecutive: number, policy: Pick<SupervisePolicy, 'firstDelayMs' | 'maxDelayMs'>): number;
export function formatDuration(ms: number): string;
export function supervise(options: {
  name?: string;
  command: string;
  args?: string[];
  spawnOptions?: SpawnOptions;
  policy?: Partial<SupervisePolicy>;
  log?: (line: string) => void;
  onStart?: (child: ChildProcess, run: number) => void;
  now?: () => number;
}): Supervised;
