export interface Cluster {
  bin: string;
  baseDir: string;
  dataDir: string;
  runDir: string;
  port: number;
  started: boolean;
  url(database: string): string;
  ensureDatabase(name: string): void;
  stop(): void;
}
export function ensurePostgresBinaries(): string;
export function freePort(): Promise<number>;
export function clusterLocation(preferredDir: string): { baseDir: string; moved: boolean };
export function startCluster(options: { baseDir: string; port: number; password: string; fsync?: boolean }): Cluster;
