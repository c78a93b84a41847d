import type { UnitSystem } from '../core/api/api-types';
import { metresPerFootText, squareMetresPerSquareFootText } from '../../../../contract/editions';

/** 1 ft = 0.3048 m exactly, so 1 ft² = 0.09290304 m² (NIST SP 811, exact definitions), shared with the service. */
export const metresPerFoot = Number(metresPerFootText);
export const squareMetresPerSquareFoot = Number(squareMetresPerSquareFootText);

const tenths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
const hundredths = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

/** An area the code tables hold in ft², as a figure in the project's units (m² to 0.1). */
export function areaInUnits(squareFeet: string | number, units: UnitSystem): string {
  const value = Number(squareFeet);
  return units === 'ip' ? tenths.format(value) : tenths.format(value * squareMetresPerSquareFoot);
}

const number = String.raw`\d[\d,]*(?:\.\d+)?`;
const parse = (text: string) => Number(text.replace(/,/g, ''));

const length = (feet: number) => tenths.format(feet * metresPerFoot);
const lengthRange = new RegExp(String.raw`(${number})(\s*(?:-|–|to)\s*)(${number})\s*(?:ft|feet|foot)\b(?!²)`, 'g');

/** Replacements for IP quantities written in words, in the order they must run (areas before lengths). */
const quantities: [RegExp, (value: number) => string][] = [
  [
    new RegExp(String.raw`(${number})\s*W\s*(?:/|per)\s*(?:ft²|ft2|sq\.? ?ft|square f(?:oo|ee)t)`, 'g'),
    (value) => `${hundredths.format(value / squareMetresPerSquareFoot)} W/m²`,
  ],
  [
    new RegExp(String.raw`(${number})\s*W\s*(?:/|per)\s*(?:lin(?:ear|\.)?\s*)?(?:ft|foot|feet)\b`, 'g'),
    (value) => `${hundredths.format(value / metresPerFoot)} W/m`,
  ],
  [
    new RegExp(String.raw`(${number})\s*(?:ft²|ft2|sq\.? ?ft|square f(?:oo|ee)t)`, 'g'),
    (value) => `${tenths.format(value * squareMetresPerSquareFoot)} m²`,
  ],
  [new RegExp(String.raw`(${number})\s*(?:-foot|-ft|ft|feet|foot)\b(?!²)`, 'g'), (value) => `${length(value)} m`],
];

/** Units named without a figure: a rate's unit in a label, "linear ft" as a quantity's unit. */
const bareUnits: [RegExp, string][] = [
  [/W\/ft²|W\/ft2/g, 'W/m²'],
  [/W\/ft\b/g, 'W/m'],
  [/\blinear (?:ft|feet|foot)\b/g, 'linear m'],
  [/\bper (?:linear )?foot\b/g, 'per metre'],
];

/**
 * Text from the code tables (labels, notes, limits) in an SI project's units: "Walkways less than
 * 10 feet wide" reads "Walkways less than 3 m wide", "at most 5,000 ft²" reads "at most 464.5 m²".
 * IP projects read the text as the tables hold it.
 */
export function inProjectUnits(text: string, units: UnitSystem): string {
  if (units === 'ip') return text;
  // A range of lengths ("25 to 50 ft") names its unit once: both ends convert, the words between stay.
  let converted = text.replace(
    lengthRange,
    (_match, from: string, between: string, to: string) => `${length(parse(from))}${between}${length(parse(to))} m`,
  );
  for (const [pattern, convert] of quantities) converted = converted.replace(pattern, (_match, value: string) => convert(parse(value)));
  for (const [pattern, replacement] of bareUnits) converted = converted.replace(pattern, replacement);
  return converted;
}
