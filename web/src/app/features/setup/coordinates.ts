import { seasonalOffsets, timeZoneChoice } from './time-zones';

export type Axis = 'latitude' | 'longitude';

export type ParsedCoordinate =
  { kind: 'empty' } | { kind: 'ok'; decimal: string; converted: boolean } | { kind: 'invalid'; message: string };

const limits: Record<Axis, number> = { latitude: 90, longitude: 180 };
const hemispheres: Record<Axis, { positive: string; negative: string }> = {
  latitude: { positive: 'N', negative: 'S' },
  longitude: { positive: 'E', negative: 'W' },
};
const hemisphereWords: Record<string, string> = { NORTH: 'N', SOUTH: 'S', EAST: 'E', WEST: 'W' };

/** Six decimal places of a degree are about 0.1 m on the ground: finer than any site needs. */
const decimalPlaces = 6;

function rangeMessage(axis: Axis): string {
  return axis === 'latitude'
    ? 'Latitude is from 90° S to 90° N: −90 to 90 in decimal degrees.'
    : 'Longitude is from 180° W to 180° E: −180 to 180 in decimal degrees.';
}

/** The demo scenario's invented site (NAMES.md), written each way. */
export const coordinateExamples: Record<Axis, string> = {
  latitude: '47.04, 47°02′24″N or 47 2 24 N',
  longitude: '−122.9, 122°54′W or 122 54 W',
};

function formatMessage(axis: Axis): string {
  return `Enter decimal degrees or degrees, minutes and seconds, e.g. ${coordinateExamples[axis]}.`;
}

/** A real minus sign for reading. */
function minus(text: string): string {
  return text.replace(/^-/, '−');
}

function trimmed(value: number): string {
  const fixed = value.toFixed(decimalPlaces).replace(/\.?0+$/, '');
  return fixed === '-0' ? '0' : fixed;
}

/**
 * A latitude or longitude as people write it: decimal degrees (−122.9), degrees and decimal minutes
 * (122 54.0 W), or degrees, minutes and seconds (47°02′24″N, 47 2 24 N, N 47:02:24), with a sign or a
 * hemisphere letter. A plain decimal is kept exactly as typed; the others become decimal degrees.
 */
export function parseCoordinate(raw: string, axis: Axis): ParsedCoordinate {
  let text = raw.trim().toUpperCase();
  if (text === '') return { kind: 'empty' };
  if (/^[+-]?\d+(\.\d+)?$/.test(text)) {
    return Math.abs(Number(text)) <= limits[axis]
      ? { kind: 'ok', decimal: text.replace(/^\+/, ''), converted: false }
      : { kind: 'invalid', message: rangeMessage(axis) };
  }
  text = text.replace(/[−–]/g, '-').replace(/\b(NORTH|SOUTH|EAST|WEST)\b/g, (word) => hemisphereWords[word]!);

  let hemisphere: string | null = null;
  const letter = /^([NSEW])\s*(.+)$/.exec(text) ?? /^(.+?)\s*([NSEW])$/.exec(text);
  if (letter) {
    const [first, second] = [letter[1]!, letter[2]!];
    hemisphere = /^[NSEW]$/.test(first) ? first : second;
    text = (hemisphere === first ? second : first).trim();
  }
  if (hemisphere) {
    const { positive, negative } = hemispheres[axis];
    if (hemisphere !== positive && hemisphere !== negative) {
      return {
        kind: 'invalid',
        message:
          axis === 'latitude'
            ? 'N or S for a latitude; E and W are for the longitude.'
            : 'E or W for a longitude; N and S are for the latitude.',
      };
    }
  }

  let sign = 1;
  if (/^[+-]/.test(text)) {
    if (hemisphere) return { kind: 'invalid', message: 'Give a minus sign or a hemisphere letter, not both.' };
    sign = text.startsWith('-') ? -1 : 1;
    text = text.slice(1).trim();
  }
  if (hemisphere === hemispheres[axis].negative) sign = -1;

  // Degree, minute and second marks in their usual spellings, or plain spaces and colons between the parts.
  const parts = text
    .replace(/DEG|[°º˚D]/g, ' ')
    .replace(/''|["″”“S]/g, ' ')
    .replace(/['′’‘M]/g, ' ')
    .replace(/:/g, ' ')
    .trim()
    .split(/\s+/);
  if (parts.length > 3 || parts.some((part) => !/^\d+(\.\d+)?$/.test(part))) return { kind: 'invalid', message: formatMessage(axis) };
  const [degrees, minutes = 0, seconds = 0] = parts.map(Number) as [number, number?, number?];
  // Only the last part may carry decimals: 47.5 30 is no way to write an angle.
  if (parts.slice(0, -1).some((part) => part.includes('.'))) return { kind: 'invalid', message: formatMessage(axis) };
  if (minutes >= 60 || seconds >= 60) return { kind: 'invalid', message: 'Minutes and seconds are each less than 60.' };
  const value = degrees + minutes / 60 + seconds / 3600;
  if (value > limits[axis]) return { kind: 'invalid', message: rangeMessage(axis) };
  return { kind: 'ok', decimal: trimmed(sign * value), converted: true };
}

/** "47.04° N", "122.9° W": the sign in words, so a flipped hemisphere shows. */
export function coordinateInWords(decimal: string, axis: Axis): string {
  const value = Number(decimal);
  const { positive, negative } = hemispheres[axis];
  if (value === 0) return axis === 'latitude' ? '0° (the equator)' : '0° (Greenwich)';
  return `${trimmed(Math.abs(value))}° ${value < 0 ? negative : positive}`;
}

/** The solar offset of a longitude: the sun crosses 15° of longitude an hour. */
const degreesPerHour = 15;
/** Zones rarely keep a clock more than about this far from the sun at the places they cover. */
const plausibleHours = 2;

/** How far apart two offsets are around the clock, in hours (UTC+14 and UTC−10 are 0 h apart, not 24). */
function hoursApart(a: number, b: number): number {
  const difference = Math.abs(a - b) % 24;
  return Math.min(difference, 24 - difference);
}

function hours(value: number): string {
  const rounded = Math.round(value * 2) / 2;
  return `${String(rounded).replace('.5', '½')} ${rounded === 1 ? 'hour' : 'hours'}`;
}

/**
 * Warnings (never refusals) when the time zone and the coordinates disagree, without a map: the zone's
 * standard offset against longitude ÷ 15° per hour, and the season in which the zone keeps daylight
 * saving time against the latitude's hemisphere. Either value may be missing; then nothing is said.
 */
export function siteWarnings(
  latitude: string | null,
  longitude: string | null,
  timeZone: string | null,
  year = new Date().getUTCFullYear(),
): string[] {
  if (!timeZone) return [];
  const zone = timeZoneChoice(timeZone, year);
  const warnings: string[] = [];
  if (longitude !== null) {
    const lon = Number(longitude);
    const zoneHours = zone.standardOffset / 60;
    const solarHours = lon / degreesPerHour;
    if (hoursApart(zoneHours, solarHours) > plausibleHours) {
      const suits = `the time zone “${zone.label}” suits longitudes near ${coordinateInWords(String(zoneHours * degreesPerHour), 'longitude')}`;
      warnings.push(
        hoursApart(zoneHours, -solarHours) <= plausibleHours
          ? `The longitude may have the wrong sign: ${suits}, but ${coordinateInWords(longitude, 'longitude')} is on the other side of Greenwich. West is negative: did you mean ${minus(trimmed(-lon))}?`
          : `Check the time zone and the longitude: ${suits}, and the sun at ${coordinateInWords(longitude, 'longitude')} keeps a time ${hours(hoursApart(zoneHours, solarHours))} away from it.`,
      );
    }
  }
  if (latitude !== null && Number(latitude) !== 0) {
    const { january, july } = seasonalOffsets(timeZone, year);
    const zoneNorth = july > january;
    const north = Number(latitude) > 0;
    if (january !== july && zoneNorth !== north) {
      warnings.push(
        `The latitude may have the wrong sign: ${zone.city} keeps daylight saving time in the ${zoneNorth ? 'northern' : 'southern'} summer, so it lies ${zoneNorth ? 'north' : 'south'} of the equator, but ${coordinateInWords(latitude, 'latitude')} is ${north ? 'north' : 'south'} of it. South is negative.`,
      );
    }
  }
  return warnings;
}
