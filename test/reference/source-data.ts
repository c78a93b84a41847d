import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Papa from 'papaparse';

/** The repository root, and the shared check data beside it (CI clones the repo with shared/ next to it). */
export const repoRoot = fileURLToPath(new URL('../..', import.meta.url));
export const sharedReferenceData = path.resolve(repoRoot, '..', 'shared', 'reference-data');
export const referenceRoot = path.join(repoRoot, 'reference');

export function sourceCsv(name: string): Record<string, string>[] {
  return Papa.parse<Record<string, string>>(readFileSync(path.join(sharedReferenceData, name), 'utf8'), { header: true, skipEmptyLines: true }).data;
}

/** The label a space-by-space row carries as its sourceLabel: "space type | subtype". */
export function spaceSourceLabel(row: Record<string, string>): string {
  return row['subtype'] ? `${row['space_type']} | ${row['subtype']}` : row['space_type']!;
}

export function bySourceLabel<Row extends { sourceLabel: string }>(rows: Row[], label: string): Row {
  const found = rows.filter((row) => row.sourceLabel === label);
  if (found.length !== 1) throw new Error(`${found.length} rows labelled ${label}`);
  return found[0]!;
}

export function byKey<Row extends { key: string }>(rows: Row[], key: string): Row {
  const found = rows.find((row) => row.key === key);
  if (!found) throw new Error(`no row ${key}`);
  return found;
}
