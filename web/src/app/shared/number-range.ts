/**
 * The service's plausible ranges (service/src/compliance/bounds.ts), so that a field refuses what
 * the service would refuse, in the same words, before anything is sent. The ranges hold in either
 * unit system, which is why their messages name no unit.
 */
export interface NumberRange {
  /** 'zero' allows 0; 'above-zero' needs a value greater than 0. */
  min: 'zero' | 'above-zero';
  max: number;
  integer?: boolean;
}

export const ranges = {
  area: { min: 'above-zero', max: 5_000_000 },
  length: { min: 'above-zero', max: 10_000 },
  height: { min: 'above-zero', max: 1_000 },
  luminaireWatts: { min: 'zero', max: 100_000 },
  limitWatts: { min: 'above-zero', max: 1_000_000 },
  count: { min: 'zero', max: 1_000_000, integer: true },
  /** Like rooms one space entry stands for. */
  rooms: { min: 'above-zero', max: 100_000, integer: true },
  /** A share of the lighting power, %. */
  percent: { min: 'zero', max: 100 },
} as const satisfies Record<string, NumberRange>;

/** A plain or exponent decimal, as the service reads one. */
export const decimalPattern = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
const maxNumberLength = 40;

const grouped = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

export function rangeInWords(range: NumberRange): string {
  const max = grouped.format(range.max);
  if (range.integer) return `a whole number from ${range.min === 'zero' ? '0' : '1'} to ${max}`;
  return range.min === 'zero' ? `a number from 0 to ${max}` : `a number greater than 0 and at most ${max}`;
}

/** Why the text is not a number in the range (the service's message), or null when it is. */
export function numberProblem(raw: string, range: NumberRange): string | null {
  const text = raw.trim();
  const expected = `Enter ${rangeInWords(range)}.`;
  if (text.length > maxNumberLength) return `Too many digits. ${expected}`;
  if (!decimalPattern.test(text)) return `“${text}” is not a number. ${expected}`;
  const value = Number(text);
  if (value < 0) return `Must not be negative. ${expected}`;
  if (!Number.isFinite(value) || value > range.max || (range.min === 'above-zero' && value === 0)) return `Out of range. ${expected}`;
  if (range.integer && !Number.isInteger(value)) return `Must be a whole number. ${expected}`;
  return null;
}
