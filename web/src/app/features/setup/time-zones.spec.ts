import { offsetInWords, searchTimeZones, timeZoneChoice, timeZoneLabel } from './time-zones';

describe('time zones picked by words', () => {
  it('names a zone by its city, region, everyday name and standard offset', () => {
    // America/Los_Angeles: standard time UTC−8 (IANA tz database); "Pacific Time" is the browser's (ICU) name.
    expect(timeZoneChoice('America/Los_Angeles', 2025)).toMatchObject({
      city: 'Los Angeles',
      region: 'America',
      name: 'Pacific Time',
      standardOffset: -480,
      label: 'Los Angeles (America) — Pacific Time, UTC−8',
    });
    expect(timeZoneLabel('America/Los_Angeles')).toBe(timeZoneChoice('America/Los_Angeles').label);
    expect(timeZoneLabel('somewhere')).toBe('somewhere');
    // Asia/Kathmandu keeps UTC+5:45 (IANA tz database).
    expect(offsetInWords(345)).toBe('UTC+5:45');
  });

  it('finds a zone by city words, region words or its everyday name', () => {
    expect(searchTimeZones('los angeles').map((zone) => zone.id)).toContain('America/Los_Angeles');
    expect(searchTimeZones('LOS_ANG').map((zone) => zone.id)).toContain('America/Los_Angeles');
    const pacific = searchTimeZones('pacific');
    // Pacific Time before the islands of the Pacific region.
    expect(pacific[0]!.name).toBe('Pacific Time');
    expect(pacific.some((zone) => zone.id === 'Pacific/Auckland')).toBe(true);
    expect(searchTimeZones('utc-8').map((zone) => zone.id)).toContain('America/Los_Angeles');
    expect(searchTimeZones('nowhere at all')).toEqual([]);
  });

  it('offers the whole list for an empty query or a chosen zone', () => {
    const all = searchTimeZones('');
    expect(all.length).toBe(Intl.supportedValuesOf('timeZone').length);
    expect(searchTimeZones('America/Los_Angeles').length).toBe(all.length);
  });
});
