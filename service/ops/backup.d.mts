export interface Connection {
  args: string[];
  env: NodeJS.ProcessEnv;
  database: string;
}
export function connectionFor(url: string): Connection;
export function backupTimestamp(date?: Date): string;
export function formatSize(bytes: number): string;
export function backupDatabase(options: {
  url: string;
  bin: string;
  file: string;
  now?: Date;
  signal?: AbortSignal;
}): Promise<{ file: string; bytes: number }>;
export function restoreDatabase(options: {
  url: string;
  bin: string;
  file: string;
  signal?: AbortSignal;
}): Promise<{ file: string; database: string; warnings: string }>;
