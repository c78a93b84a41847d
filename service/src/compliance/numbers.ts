import { Decimal } from 'decimal.js';

/**
 * The engine's own decimal type: a private clone so that no other module's settings change it.
 * 40 significant digits keeps every quotient (LPD, RCR, margins) far below any display rounding.
 */
export const Dec = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });
export type Dec = Decimal;

export const ZERO = new Dec(0);

/** A decimal from a decimal string (the form every table value and document value arrives in). */
export function dec(value: string | number | Decimal): Decimal {
  return new Dec(typeof value === 'number' ? String(value) : value);
}

/** The exact decimal string a result carries: plain notation, no exponent, no trailing zeros. */
export function text(value: Decimal): string {
  const plain = value.toFixed();
  return plain === '-0' ? '0' : plain;
}

export function sum(values: readonly Decimal[]): Decimal {
  return values.reduce((total, value) => total.plus(value), ZERO);
}

export function min(a: Decimal, b: Decimal): Decimal {
  return a.lessThan(b) ? a : b;
}

export function max(a: Decimal, b: Decimal): Decimal {
  return a.greaterThan(b) ? a : b;
}

/**
 * How a result reports its numbers: computed exactly, rounded once on the way out (watts to 0.1 W,
 * power densities to 0.001, shares to 0.01 %, ratios to 0.01, areas to 0.01 and lengths to 0.001
 * of their unit). Verdicts are decided on the exact values, never on these.
 */
export const reported = {
  watts: (value: Decimal) => text(value.toDecimalPlaces(1)),
  density: (value: Decimal) => text(value.toDecimalPlaces(3)),
  percent: (value: Decimal) => text(value.toDecimalPlaces(2)),
  ratio: (value: Decimal) => text(value.toDecimalPlaces(2)),
  area: (value: Decimal) => text(value.toDecimalPlaces(2)),
  length: (value: Decimal) => text(value.toDecimalPlaces(3)),
};
