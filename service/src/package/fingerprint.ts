import { createHash } from 'node:crypto';
import { decimalPattern } from '../../../contract/editions.js';
import { evaluationResultSchema, type EvaluationResult } from '../../../contract/result.js';

/**
 * The canonical JSON of a value, the text a package's fingerprint is the SHA-256 of:
 *
 * - `null`, `true`, `false` as in JSON; a string as `JSON.stringify` writes it (UTF-8 when hashed);
 * - a number only when it is a safe integer, written in plain decimal digits (`-0` as `0`); any
 *   other number is refused, since a fraction's binary form has no single decimal spelling (the
 *   result carries its figures as decimal strings for that reason);
 * - an array's elements in their order; an object's members sorted by key (JavaScript's string
 *   order: UTF-16 code units), members whose value is `undefined` left out;
 * - no whitespace anywhere.
 */
export function canonicalJson(value: unknown): string {
  if (value === null) return 'null';
  switch (typeof value) {
    case 'boolean':
      return value ? 'true' : 'false';
    case 'string':
      return JSON.stringify(value);
    case 'number':
      if (!Number.isSafeInteger(value)) throw new TypeError(`canonical JSON takes integers only, not ${value}`);
      return String(value === 0 ? 0 : value);
    case 'object': {
      if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
      const members = Object.entries(value as Record<string, unknown>)
        .filter(([, member]) => member !== undefined)
        .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
      return `{${members.map(([key, member]) => `${JSON.stringify(key)}:${canonicalJson(member)}`).join(',')}}`;
    }
    default:
      throw new TypeError(`canonical JSON has no form for a ${typeof value}`);
  }
}

/**
 * A decimal in one fixed spelling: no leading zeros before the point, no trailing zeros after it,
 * no point without digits after it, and zero without a sign (`"007.50"` → `"7.5"`, `"-0.0"` → `"0"`).
 */
export function fixedDecimal(text: string): string {
  const negative = text.startsWith('-');
  const [whole = '', fraction = ''] = (negative ? text.slice(1) : text).split('.');
  const integer = whole.replace(/^0+(?=\d)/, '');
  const decimals = fraction.replace(/0+$/, '');
  const plain = decimals ? `${integer}.${decimals}` : integer;
  return negative && plain !== '0' ? `-${plain}` : plain;
}

/** The parts of a zod schema's definition the walk reads (zod 4's `_zod.def`). */
interface Schema {
  _zod: {
    def: {
      type: string;
      shape?: Record<string, Schema>;
      element?: Schema;
      innerType?: Schema;
      checks?: { _zod: { def: { pattern?: RegExp } } }[];
    };
  };
}

/** The result with every decimal field (the fields the result's schema types as decimals, and only those) in its fixed spelling. */
function withFixedDecimals(schema: Schema, value: unknown): unknown {
  const def = schema._zod.def;
  if (value === null || value === undefined) return value;
  switch (def.type) {
    case 'nullable':
    case 'optional':
      return withFixedDecimals(def.innerType!, value);
    case 'array':
      return Array.isArray(value) ? value.map((item) => withFixedDecimals(def.element!, item)) : value;
    case 'object': {
      if (typeof value !== 'object' || Array.isArray(value)) return value;
      const shape = def.shape!;
      return Object.fromEntries(
        Object.entries(value as Record<string, unknown>).map(([key, member]) => [
          key,
          shape[key] ? withFixedDecimals(shape[key], member) : member,
        ]),
      );
    }
    case 'string':
      return typeof value === 'string' &&
        def.checks?.some((check) => check._zod.def.pattern === decimalPattern) &&
        decimalPattern.test(value)
        ? fixedDecimal(value)
        : value;
    default:
      return value;
  }
}

/** The canonical text of an evaluation result: its decimals in their fixed spelling, then {@link canonicalJson}. */
export function canonicalResult(result: EvaluationResult): string {
  return canonicalJson(withFixedDecimals(evaluationResultSchema as unknown as Schema, result));
}

/** A package's fingerprint: the SHA-256 of the canonical result, in lower-case hex (64 characters). */
export function resultFingerprint(result: EvaluationResult): string {
  return createHash('sha256').update(canonicalResult(result), 'utf8').digest('hex');
}
