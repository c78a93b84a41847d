/** A time zone as a person looks for it: the city, its region, the zone's everyday name and standard offset. */
export interface TimeZoneChoice {
  /** The IANA name, the value stored; never shown. */
  id: string;
  city: string;
  region: string;
  /** "Pacific Time", or '' where the browser knows no name but the offset. */
  name: string;
  /** Minutes east of UTC outside daylight saving time. */
  standardOffset: number;
  /** "Los Angeles (America) — Pacific Time, UTC−8" */
  label: string;
  /** Lower-case words the search matches. */
  words: string;
}

function zoneName(id: string, style: 'longGeneric' | 'longOffset', at: Date): string {
  return (
    new Intl.DateTimeFormat('en-US', { timeZone: id, timeZoneName: style }).formatToParts(at).find((part) => part.type === 'timeZoneName')
      ?.value ?? ''
  );
}

/** "GMT-08:00" → −480; "GMT" → 0. */
function offsetMinutes(gmt: string): number {
  const match = /^GMT(?:([+-])(\d{1,2})(?::?(\d{2}))?)?$/.exec(gmt);
  if (!match || !match[1]) return 0;
  const minutes = Number(match[2]) * 60 + Number(match[3] ?? 0);
  return match[1] === '-' ? -minutes : minutes;
}

/** The zone's offset in January and in July of `year`, minutes east of UTC. */
export function seasonalOffsets(id: string, year: number): { january: number; july: number } {
  return {
    january: offsetMinutes(zoneName(id, 'longOffset', new Date(Date.UTC(year, 0, 15, 12)))),
    july: offsetMinutes(zoneName(id, 'longOffset', new Date(Date.UTC(year, 6, 15, 12)))),
  };
}

/** "UTC−8", "UTC+5:30", "UTC" (with a real minus sign). */
export function offsetInWords(minutes: number): string {
  if (minutes === 0) return 'UTC';
  const sign = minutes < 0 ? '−' : '+';
  const whole = Math.abs(minutes);
  const rest = whole % 60;
  return `UTC${sign}${Math.floor(whole / 60)}${rest ? `:${String(rest).padStart(2, '0')}` : ''}`;
}

function spelt(part: string): string {
  return part.replace(/_/g, ' ');
}

export function timeZoneChoice(id: string, year = new Date().getUTCFullYear()): TimeZoneChoice {
  const parts = id.split('/').map(spelt);
  const city = parts.at(-1) ?? id;
  const region = parts.slice(0, -1).join(', ');
  const generic = zoneName(id, 'longGeneric', new Date(Date.UTC(year, 0, 15, 12)));
  // Where the browser knows no name it answers with the offset again, which the label already carries.
  const name = generic.startsWith('GMT') ? '' : generic;
  const { january, july } = seasonalOffsets(id, year);
  const standardOffset = Math.min(january, july);
  const offset = offsetInWords(standardOffset);
  const label = `${city}${region ? ` (${region})` : ''} — ${name ? `${name}, ` : ''}${offset}`;
  const words = [id.replace(/[/_]/g, ' '), name, offset, offset.replace('−', '-')].join(' ').toLocaleLowerCase();
  return { id, city, region, name, standardOffset, label, words };
}

let allChoices: readonly TimeZoneChoice[] | null = null;

/** Every zone the browser knows, built once: a few hundred formatters are cheap, but not on every keystroke. */
export function timeZoneChoices(): readonly TimeZoneChoice[] {
  allChoices ??= (typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : ['UTC'])
    .map((id) => timeZoneChoice(id))
    .sort((a, b) => a.label.localeCompare(b.label));
  return allChoices;
}

export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

/** The label for a stored zone, or the text itself when it is not a zone (yet). */
export function timeZoneLabel(value: string | null | undefined): string {
  if (!value) return '';
  const known = timeZoneChoices().find((choice) => choice.id === value);
  if (known) return known.label;
  return isTimeZone(value) ? timeZoneChoice(value).label : value;
}

/**
 * Zones whose words hold every word of the query ("los angeles", "pacific", "utc-8"). Zones whose
 * everyday name or city begins with the query come first, so "pacific" offers Pacific Time before
 * the islands of the Pacific region.
 */
export function searchTimeZones(query: string, choices: readonly TimeZoneChoice[] = timeZoneChoices()): TimeZoneChoice[] {
  const text = query
    .trim()
    .toLocaleLowerCase()
    .replace(/[/_,()]+/g, ' ')
    .replace(/\s+/g, ' ');
  if (text === '' || choices.some((choice) => choice.id.toLocaleLowerCase() === query.trim().toLocaleLowerCase())) return [...choices];
  const tokens = text.split(' ');
  const rank = (choice: TimeZoneChoice): number => {
    if (choice.name.toLocaleLowerCase().startsWith(text)) return 0;
    if (choice.city.toLocaleLowerCase().startsWith(text)) return 1;
    return 2;
  };
  return choices
    .filter((choice) => tokens.every((token) => choice.words.includes(token)))
    .map((choice) => ({ choice, rank: rank(choice) }))
    .sort((a, b) => a.rank - b.rank)
    .map(({ choice }) => choice);
}
