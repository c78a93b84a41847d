import { metresPerFootText, squareMetresPerSquareFootText, type UnitSystem } from '../../../contract/editions.js';
import { type Dec, dec } from './numbers.js';

/** The document's unit system: IP (ft, ft², W/ft²) or SI (m, m², W/m²). The engine computes in IP. */
export type { UnitSystem } from '../../../contract/editions.js';

/** The exact factors the web app shares (contract/editions.ts). */
export const metresPerFoot = dec(metresPerFootText);
export const squareMetresPerSquareFoot = dec(squareMetresPerSquareFootText);

/** A length in the document's units, in feet. */
export function lengthToFeet(value: Dec, units: UnitSystem): Dec {
  return units === 'ip' ? value : value.dividedBy(metresPerFoot);
}

/** An area in the document's units, in square feet. */
export function areaToSquareFeet(value: Dec, units: UnitSystem): Dec {
  return units === 'ip' ? value : value.dividedBy(squareMetresPerSquareFoot);
}

export function lengthFromFeet(feet: Dec, units: UnitSystem): Dec {
  return units === 'ip' ? feet : feet.times(metresPerFoot);
}

export function areaFromSquareFeet(squareFeet: Dec, units: UnitSystem): Dec {
  return units === 'ip' ? squareFeet : squareFeet.times(squareMetresPerSquareFoot);
}

/** A power density in W/ft², in the document's units (W/ft² or W/m²). */
export function densityFromPerSquareFoot(wattsPerSquareFoot: Dec, units: UnitSystem): Dec {
  return units === 'ip' ? wattsPerSquareFoot : wattsPerSquareFoot.dividedBy(squareMetresPerSquareFoot);
}

/** W per linear foot, in the document's units (W/ft or W/m). */
export function linearDensityFromPerFoot(wattsPerFoot: Dec, units: UnitSystem): Dec {
  return units === 'ip' ? wattsPerFoot : wattsPerFoot.dividedBy(metresPerFoot);
}

/** An area held in ft², written in the document's units for a reason: ft² as held, m² to 0.1 m². */
export function areaWords(squareFeet: Dec, units: UnitSystem): string {
  return units === 'ip' ? `${squareFeet.toFixed()} ft²` : `${areaFromSquareFeet(squareFeet, units).toDecimalPlaces(1).toFixed()} m²`;
}

/** A power density held in W/ft², written in the document's units to 0.01. */
export function densityWords(wattsPerSquareFoot: Dec, units: UnitSystem): string {
  return `${densityFromPerSquareFoot(wattsPerSquareFoot, units).toDecimalPlaces(2).toFixed()} ${units === 'ip' ? 'W/ft²' : 'W/m²'}`;
}

/** A length held in feet, written in the document's units: ft as held, m to 0.01 m. */
export function lengthWords(feet: Dec, units: UnitSystem): string {
  return units === 'ip' ? `${feet.toFixed()} ft` : `${lengthFromFeet(feet, units).toDecimalPlaces(2).toFixed()} m`;
}

export function unitLabels(units: UnitSystem): { length: string; area: string; density: string } {
  return units === 'ip' ? { length: 'ft', area: 'ft²', density: 'W/ft²' } : { length: 'm', area: 'm²', density: 'W/m²' };
}
