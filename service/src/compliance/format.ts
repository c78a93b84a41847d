import { Decimal } from 'decimal.js';
import { dec } from './numbers.js';

/**
 * Display rounding only: results carry exact decimal strings, and these helpers round them for
 * people (watts to 1 W, power densities to 0.01, percentages to 0.1), half away from zero.
 */
function rounded(value: string, places: number): string {
  const fixed = dec(value).toDecimalPlaces(places, Decimal.ROUND_HALF_UP).toFixed(places);
  return /^-0(\.0*)?$/.test(fixed) ? fixed.slice(1) : fixed;
}

export function formatWatts(watts: string): string {
  return rounded(watts, 0);
}

export function formatLpd(density: string): string {
  return rounded(density, 2);
}

export function formatPercent(percent: string | null): string {
  return percent === null ? '—' : rounded(percent, 1);
}
