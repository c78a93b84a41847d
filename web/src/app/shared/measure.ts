import type { UnitSystem } from '../core/api/api-types';

/** What a numeric field holds: a length, an area, or a plain number (a count, watts). */
export type MeasureKind = 'length' | 'area' | 'number';

export type MeasureReading = { kind: 'value'; value: string } | { kind: 'problem'; message: string };

/** A plain decimal needs no reading. */
const plainDecimal = /^[+-]?\d+(\.\d+)?$/;
/** Longer than anyone types on site: refused before parsing. */
const maxExpressionLength = 60;
/** Places kept after a conversion (0.0001 ft is far below any drawing's precision). */
const places = 4;

type MathInstance = import('mathjs').MathJsInstance;
let loaded: Promise<MathInstance> | null = null;

/** mathjs, loaded on first use (its own chunk), with exact decimals: 1 ft = 0.3048 m and 1 in = 1/12 ft exactly. */
export function loadMath(): Promise<MathInstance> {
  loaded ??= import('mathjs').then(({ all, create }) => create(all!, { number: 'BigNumber', precision: 64 }));
  return loaded;
}

/** True when the text is an expression to read, not a plain number already. */
export function needsReading(text: string): boolean {
  const trimmed = text.trim();
  return trimmed !== '' && !plainDecimal.test(trimmed);
}

/**
 * Site notation to mathjs's: feet and inch marks become units, ² and ³ powers, and a unit followed
 * by a number adds ("12 ft 6 in" is 12 ft + 6 in, never their product).
 */
export function siteNotation(text: string): string {
  return text
    .replace(/[′’']/g, ' ft ')
    .replace(/[″”"]/g, ' in ')
    .replace(/×/g, '*')
    .replace(/²/g, '^2')
    .replace(/³/g, '^3')
    .replace(/([a-zA-Z](?:\^[23])?)\s+(?=\d)/g, '$1 + ')
    .trim();
}

const allowedOperators = new Set(['add', 'subtract', 'multiply', 'divide', 'unaryMinus', 'unaryPlus']);

function words(kind: MeasureKind, units: UnitSystem): string {
  if (kind === 'length')
    return units === 'si' ? 'a length (for example 3.2 m, or 12 ft 6 in)' : 'a length (for example 12 ft 6 in, or 3.2 m)';
  if (kind === 'area')
    return units === 'si' ? 'an area (for example 12 * 8.5, or 20 m²)' : 'an area (for example 30 * 20, or 20 ft * 30 ft)';
  return 'a number (for example 4 * 6)';
}

/**
 * Reads what someone typed into a numeric field: a plain number, arithmetic ("30*20"), or a
 * measure with units ("12 ft 6 in", "3.2 m", "20 ft * 30 ft"), converted to the project's units
 * (ft and ft², or m and m²) and written as a decimal. Only numbers, units and + − × ÷ are read:
 * no functions, names or assignments.
 */
export async function readMeasure(text: string, kind: MeasureKind, units: UnitSystem): Promise<MeasureReading> {
  const trimmed = text.trim();
  if (!needsReading(trimmed)) return { kind: 'value', value: trimmed };
  const cannot = { kind: 'problem' as const, message: `Write ${words(kind, units)}.` };
  if (trimmed.length > maxExpressionLength) return cannot;
  const math = await loadMath();
  let node: import('mathjs').MathNode;
  try {
    node = math.parse(siteNotation(trimmed));
  } catch {
    return cannot;
  }
  let safe = true;
  node.traverse((part) => {
    if (math.isConstantNode(part) || math.isParenthesisNode(part)) return;
    if (math.isOperatorNode(part) && allowedOperators.has(part.fn)) return;
    // Powers only of a unit, squared or cubed (ft², m³): never a number's, which could be made to cost anything.
    if (math.isOperatorNode(part) && part.fn === 'pow') {
      const [base, exponent] = part.args;
      if (
        base &&
        exponent &&
        math.isSymbolNode(base) &&
        math.Unit.isValuelessUnit(base.name) &&
        math.isConstantNode(exponent) &&
        ['2', '3'].includes(String(exponent.value))
      )
        return;
    }
    if (math.isSymbolNode(part) && math.Unit.isValuelessUnit(part.name)) return;
    safe = false;
  });
  if (!safe) return cannot;
  let value: unknown;
  try {
    value = node.evaluate();
  } catch {
    return cannot;
  }
  let amount: import('mathjs').BigNumber;
  if (math.isUnit(value)) {
    const target = kind === 'length' ? (units === 'si' ? 'm' : 'ft') : kind === 'area' ? (units === 'si' ? 'm^2' : 'ft^2') : null;
    if (!target || !value.equalBase(math.unit(`1 ${target}`))) return cannot;
    amount = math.bignumber(value.toNumeric(target) as import('mathjs').BigNumber);
  } else if (math.isBigNumber(value)) {
    amount = value;
  } else {
    return cannot;
  }
  if (!amount.isFinite()) return cannot;
  const fixed = amount.toDecimalPlaces(places).toFixed(places);
  const written = fixed.includes('.') ? fixed.replace(/\.?0+$/, '') : fixed;
  return { kind: 'value', value: written === '-0' ? '0' : written };
}
