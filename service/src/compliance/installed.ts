import type { LuminaireType } from './document.js';
import type { EditionRules } from './edition-data.js';
import { type Dec, dec, max } from './numbers.js';
import { type UnitSystem, lengthToFeet, lengthWords, linearDensityFromPerFoot } from './units.js';

export interface UnitWattage {
  watts: Dec;
  /** Words for the result: how the wattage was arrived at. */
  basis: string;
  /** true where the rule applied is from memory (low-voltage track). */
  fromMemory: boolean;
  usesTrackRule: boolean;
}

/** The track minimum (held per foot) in the document's units: "30 W/ft", or "98.43 W/m". */
function perLength(wattsPerFoot: string, units: UnitSystem): string {
  return units === 'ip' ? `${wattsPerFoot} W/ft` : `${linearDensityFromPerFoot(dec(wattsPerFoot), units).toDecimalPlaces(2).toFixed()} W/m`;
}

/**
 * The watts one luminaire (or one track run) counts for. Rated: its rated input watts. Line-voltage
 * track or busway: the rating of its current limiter where one is given, otherwise the greater of
 * the specified watts and the edition's minimum per linear foot × run length. Low-voltage track:
 * the transformer rating. A current-limited circuit: the limiter rating.
 */
export function unitWattage(type: LuminaireType, rules: EditionRules, units: UnitSystem): UnitWattage {
  const specified = dec(type.inputWatts);
  switch (type.basis) {
    case 'rated':
      return { watts: specified, basis: `rated input ${specified.toFixed()} W`, fromMemory: false, usesTrackRule: false };
    case 'line-voltage-track': {
      if (type.limitWatts !== undefined) {
        return {
          watts: dec(type.limitWatts),
          basis: `current limiter rating ${type.limitWatts} W`,
          fromMemory: false,
          usesTrackRule: true,
        };
      }
      const feet = lengthToFeet(dec(type.length ?? '0'), units);
      const minimum = dec(rules.trackMinimumWPerFt).times(feet);
      const watts = max(specified, minimum);
      return {
        watts,
        basis: `greater of specified ${specified.toFixed()} W and ${perLength(rules.trackMinimumWPerFt, units)} × ${lengthWords(feet, units)} = ${minimum.toFixed()} W`,
        fromMemory: false,
        usesTrackRule: true,
      };
    }
    case 'low-voltage-track':
      return {
        watts: dec(type.limitWatts ?? '0'),
        basis: `transformer rating ${type.limitWatts ?? '0'} W`,
        fromMemory: true,
        usesTrackRule: true,
      };
    case 'current-limited':
      return {
        watts: dec(type.limitWatts ?? '0'),
        basis: `current limiter rating ${type.limitWatts ?? '0'} W`,
        fromMemory: false,
        usesTrackRule: true,
      };
  }
}
