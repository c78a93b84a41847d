import { type Dec, dec } from './numbers.js';
import { areaWords, lengthWords, type UnitSystem } from './units.js';

/**
 * Some space types carry a size in their name (an enclosed office of at most 250 ft², a storage
 * room of at least 50 ft², a high-bay area 25 to 50 ft tall). The condition is read from the
 * table's own label, so a space can be checked against the row it names.
 */
export interface SizeCondition {
  quantity: 'area' | 'height';
  min?: { value: Dec; inclusive: boolean };
  max?: { value: Dec; inclusive: boolean };
}

const number = String.raw`(\d+(?:\.\d+)?)`;
const unitOf = (text: string): SizeCondition['quantity'] => (/ft2|ft²|square/i.test(text) ? 'area' : 'height');

/** The size condition a source label states, or null where it states none. */
export function sizeCondition(sourceLabel: string): SizeCondition | null {
  const label = sourceLabel.replace(/≤/g, '<=').replace(/≥/g, '>=');
  const between = new RegExp(`(>=|>)\\s*${number}\\s*(?:ft2|ft²|ft|feet)?\\s*and\\s*(<=|<)\\s*${number}\\s*(ft2|ft²|ft|feet)`, 'i').exec(
    label,
  );
  if (between) {
    return {
      quantity: unitOf(between[5]!),
      min: { value: dec(between[2]!), inclusive: between[1] === '>=' },
      max: { value: dec(between[4]!), inclusive: between[3] === '<=' },
    };
  }
  const range = new RegExp(`${number}\\s*(?:to|-|–)\\s*${number}\\s*(ft2|ft²|ft|feet)`, 'i').exec(label);
  if (range)
    return {
      quantity: unitOf(range[3]!),
      min: { value: dec(range[1]!), inclusive: true },
      max: { value: dec(range[2]!), inclusive: true },
    };
  const single = new RegExp(`(<=|>=|<|>|less than|greater than)\\s*${number}\\s*(ft2|ft²|ft|feet)`, 'i').exec(label);
  if (!single) return null;
  const operator = single[1]!.toLowerCase();
  const value = dec(single[2]!);
  const quantity = unitOf(single[3]!);
  if (operator === '<=' || operator === '<' || operator === 'less than') return { quantity, max: { value, inclusive: operator === '<=' } };
  return { quantity, min: { value, inclusive: operator === '>=' } };
}

export function satisfies(condition: SizeCondition, value: Dec): boolean {
  const { min, max } = condition;
  if (min && (min.inclusive ? value.lessThan(min.value) : value.lessThanOrEqualTo(min.value))) return false;
  if (max && (max.inclusive ? value.greaterThan(max.value) : value.greaterThanOrEqualTo(max.value))) return false;
  return true;
}

/**
 * The condition in words, in the project's units: "at most 250 ft²", "more than 150 ft² and at most
 * 300 ft²", "from 25 to 50 ft"; in SI "at most 23.2 m²", "from 7.62 to 15.24 m".
 */
export function conditionWords(condition: SizeCondition, units: UnitSystem = 'ip'): string {
  const words = (value: Dec) => (condition.quantity === 'area' ? areaWords(value, units) : lengthWords(value, units));
  const figure = (value: Dec) => words(value).replace(/ \S+$/, '');
  const unit = words(dec(1)).replace(/^\S+ /, '');
  const { min, max } = condition;
  if (min && max && min.inclusive && max.inclusive) return `from ${figure(min.value)} to ${figure(max.value)} ${unit}`;
  const parts = [
    min ? `${min.inclusive ? 'at least' : 'more than'} ${words(min.value)}` : '',
    max ? `${max.inclusive ? 'at most' : 'less than'} ${words(max.value)}` : '',
  ].filter(Boolean);
  return parts.join(' and ');
}
