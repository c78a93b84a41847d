import { z } from 'zod';
import { Dec } from './numbers.js';

/**
 * The one set of limits every number and string of a design passes before anything computes with
 * it: the evaluation document and every design write share these schemas. A number is checked as
 * text first (length, shape, exponent), so no input can make the decimal library expand it; then
 * against a plausible range for what it measures. The ranges hold in either unit system (a value
 * in metres or square metres is smaller than the same value in feet), and their messages name no
 * unit for that reason.
 */

export interface NumberRange {
  /** 'zero' allows 0; 'above-zero' needs a value greater than 0. */
  min: 'zero' | 'above-zero';
  max: string;
  integer?: boolean;
}

/** Plausible ranges by what a number measures (common practice: generous, well past any real building). */
export const ranges = {
  /** Floor areas, zone sizes and sales areas, ft² or m²: a 5,000,000 ft² space is larger than any single room built. */
  area: { min: 'above-zero', max: '5000000' },
  /** Room dimensions, window widths, skylight sizes, track runs, ft or m. */
  length: { min: 'above-zero', max: '10000' },
  /** Where an opening sits along its wall or on the ceiling, ft or m. */
  offset: { min: 'zero', max: '10000' },
  /** Ceiling and window head heights, ft or m. */
  height: { min: 'above-zero', max: '1000' },
  /** Sill, luminaire and work-plane heights above the floor, ft or m. */
  heightAboveFloor: { min: 'zero', max: '1000' },
  /** Rated input watts of one luminaire (for track, of the luminaires on one run). */
  luminaireWatts: { min: 'zero', max: '100000' },
  /** Rating of a current limiter, breaker or transformer, W. */
  limitWatts: { min: 'above-zero', max: '1000000' },
  /** Luminaires of one type in one space. */
  count: { min: 'zero', max: '1000000', integer: true },
  /** An exterior application's quantity: ft², linear ft or a count (or m², m). */
  exteriorQuantity: { min: 'zero', max: '100000000' },
  /** Installed watts of one exterior application. */
  exteriorWatts: { min: 'zero', max: '10000000' },
  /** Like rooms one space entry stands for. */
  rooms: { min: 'above-zero', max: '100000', integer: true },
  /** A share of the lighting power, %. */
  percent: { min: 'zero', max: '100' },
  /** A control's time-out: a day at most. */
  timeoutMinutes: { min: 'zero', max: '1440' },
  /** A glazing's visible transmittance: the fraction of visible light it passes, 0 to 1. */
  visibleTransmittance: { min: 'zero', max: '1' },
} as const satisfies Record<string, NumberRange>;

/** A number arrives as text of at most this many characters (about 30 significant digits and an exponent). */
export const maxNumberLength = 40;
/** Decimal places kept: enough for an IP value with six places converted exactly to SI (× 0.09290304). */
export const maxDecimalPlaces = 20;
/** The largest version a row can reach (PostgreSQL integer). */
export const maxVersion = 2_147_483_647;

const decimalShape = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?(\d+))?$/;
/** An exponent of more than four digits is far outside every range, whichever its sign. */
const maxExponentDigits = 4;

function grouped(value: string): string {
  const [whole, fraction] = value.split('.');
  const withCommas = whole!.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return fraction === undefined ? withCommas : `${withCommas}.${fraction}`;
}

/** The range in words, as a person reads it beside the field. */
export function rangeInWords(range: NumberRange): string {
  const max = grouped(range.max);
  if (range.integer) return `a whole number from ${range.min === 'zero' ? '0' : '1'} to ${max}`;
  return range.min === 'zero' ? `a number from 0 to ${max}` : `a number greater than 0 and at most ${max}`;
}

export type BoundedDecimal = { ok: true; value: string } | { ok: false; message: string };

/** Checks one number, given as a string or a JSON number, against a range; the value comes back in plain decimal notation. */
export function boundedDecimal(input: string | number, range: NumberRange): BoundedDecimal {
  const expected = `Enter ${rangeInWords(range)}.`;
  if (typeof input === 'number' && !Number.isFinite(input)) return { ok: false, message: `Must be a finite number. ${expected}` };
  const raw = typeof input === 'number' ? String(input) : input.trim();
  if (raw.length > maxNumberLength) return { ok: false, message: `Too many digits. ${expected}` };
  const shape = decimalShape.exec(raw);
  if (!shape) return { ok: false, message: `“${raw}” is not a number. ${expected}` };
  if ((shape[4]?.replace(/^0+/, '').length ?? 0) > maxExponentDigits) return { ok: false, message: `Out of range. ${expected}` };
  const value = new Dec(raw);
  if (value.isNegative() && !value.isZero()) return { ok: false, message: `Must not be negative. ${expected}` };
  if (value.greaterThan(range.max) || (range.min === 'above-zero' && value.isZero()))
    return { ok: false, message: `Out of range. ${expected}` };
  if (range.integer && !value.isInteger()) return { ok: false, message: `Must be a whole number. ${expected}` };
  if (value.decimalPlaces() > maxDecimalPlaces) return { ok: false, message: `Use at most ${maxDecimalPlaces} decimal places.` };
  const plain = value.toFixed();
  return { ok: true, value: plain === '-0' ? '0' : plain };
}

/** A zod schema for one bounded number; it leaves the parser as a plain decimal string. */
export function decimalField(range: NumberRange) {
  // z.custom rather than z.number(), so that NaN and Infinity reach the transform and get a message of their own.
  return z
    .custom<string | number>((value) => typeof value === 'string' || typeof value === 'number', {
      message: `Enter ${rangeInWords(range)}.`,
    })
    .transform((value, ctx) => {
      const checked = boundedDecimal(value, range);
      if (checked.ok) return checked.value;
      ctx.addIssue({ code: 'custom', message: checked.message });
      return z.NEVER;
    });
}

/** Lengths of text fields, in characters. */
export const textLimits = {
  /** Keys of the code tables and ids inside a document. */
  key: 100,
  tag: 40,
  name: 200,
  level: 100,
  device: 200,
  description: 500,
  note: 1000,
  address: 500,
  email: 320,
} as const;

/**
 * PostgreSQL text cannot hold NUL, and an unpaired UTF-16 surrogate is not a character at all;
 * other control characters have no place in a name either (tabs and line breaks only in notes).
 */
const loneSurrogate = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function textProblem(value: string, multiline = false): string | null {
  if (loneSurrogate.test(value)) return 'Contains a broken character (an unpaired surrogate).';
  // Control characters are what this pattern is for.
  // eslint-disable-next-line no-control-regex
  const controls = multiline ? /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/ : /[\u0000-\u001f\u007f]/;
  if (controls.test(value)) return value.includes('\u0000') ? 'Contains a NUL character.' : 'Contains a control character.';
  return null;
}

/** A trimmed, bounded, storable string; `required` also refuses the empty string. */
export function textField(max: number, options: { required?: boolean; multiline?: boolean } = {}) {
  let schema = z
    .string()
    .trim()
    .max(max, `Use at most ${grouped(String(max))} characters.`);
  if (options.required) schema = schema.min(1, 'Required.');
  return schema.superRefine((value, ctx) => {
    const problem = textProblem(value, options.multiline);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  });
}

/** A row version a writer read: a whole number from 1 to the largest a row can reach. */
export const versionField = z
  .number({ message: 'Send the version you read, a whole number.' })
  .int('Send the version you read, a whole number.')
  .min(1, 'Versions start at 1.')
  .max(maxVersion, 'No row has a version that large.');

/** Limits on the work one document or import may ask for (a 5,000-space project is normal). */
export const documentLimits = {
  spaces: 10_000,
  luminaireTypes: 2_000,
  luminaireGroupsPerSpace: 200,
  controlsPerSpace: 50,
  windowsPerSpace: 200,
  skylightsPerSpace: 500,
  exteriorApplications: 500,
  retailClaims: 10_000,
  /** Problems listed in one answer; the rest are counted. */
  problemsListed: 500,
} as const;

/** At most 10 jurisdiction amendments on one project, each once (common practice: a jurisdiction rarely layers more than two). */
export const maxAmendments = 10;

/** A list of keys that names each key once; a repeat is refused at its own place (`amendments.2`). */
export function distinctKeys(schema: z.ZodType<string>, max: number, what: string) {
  return z
    .array(schema)
    .max(max, listLimit(max, what))
    .superRefine((keys, ctx) => {
      keys.forEach((key, index) => {
        if (keys.indexOf(key) !== index) ctx.addIssue({ code: 'custom', path: [index], message: `“${key}” is chosen more than once.` });
      });
    });
}

export function listLimit(max: number, what: string): string {
  return `At most ${grouped(String(max))} ${what}.`;
}
