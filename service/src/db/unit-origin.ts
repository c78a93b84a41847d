import { dec } from '../compliance/numbers.js';

/**
 * The values a row's lengths and areas had before the last change of units, in the units they
 * were in: converting back restores them exactly, where dividing by 0.3048 would not terminate.
 * Each value stays only while the column still holds the converted value.
 */
export interface UnitOrigin {
  units: 'ip' | 'si';
  values: Record<string, string | number | null>;
}

function sameNumber(a: unknown, b: unknown): boolean {
  if (a === null || a === undefined || b === null || b === undefined) return (a ?? null) === (b ?? null);
  return dec(String(a)).equals(dec(String(b)));
}

/**
 * The origin a row keeps after a write: only the columns the write left as they were. The write
 * itself often resends every value (a full PUT from a form), so an untouched value keeps its origin.
 */
export function carriedOrigin(
  origin: UnitOrigin | null | undefined,
  stored: Record<string, unknown>,
  written: Record<string, unknown>,
): string | null {
  if (!origin) return null;
  const kept = Object.entries(origin.values).filter(([column]) => column in written && sameNumber(stored[column], written[column]));
  return kept.length === 0 ? null : JSON.stringify({ units: origin.units, values: Object.fromEntries(kept) });
}
