import { coordinateInWords, parseCoordinate, siteWarnings } from './coordinates';

describe('coordinates as people write them', () => {
  it('keeps a plain decimal exactly as typed', () => {
    expect(parseCoordinate('-122.90', 'longitude')).toEqual({ kind: 'ok', decimal: '-122.90', converted: false });
    expect(parseCoordinate(' 47.04 ', 'latitude')).toEqual({ kind: 'ok', decimal: '47.04', converted: false });
    expect(parseCoordinate('', 'latitude')).toEqual({ kind: 'empty' });
  });

  // Worked by hand (common practice): 47° 02′ 24″ = 47 + 2/60 + 24/3600 = 47.04; 122° 54′ = 122 + 54/60 = 122.9,
  // the demo scenario's invented site (NAMES.md).
  it('converts degrees, minutes and seconds to decimal degrees', () => {
    for (const text of ['47°02′24″N', '47° 2\' 24" N', '47 2 24 N', 'N 47:02:24', '47d 2m 24s north', '47 2.4 N']) {
      expect(parseCoordinate(text, 'latitude'), text).toEqual({ kind: 'ok', decimal: '47.04', converted: true });
    }
    for (const text of ['122 54 W', '122°54′W', 'W122°54′00″', '−122.9', '122.9 W']) {
      expect(parseCoordinate(text, 'longitude'), text).toEqual({ kind: 'ok', decimal: '-122.9', converted: true });
    }
    // Worked by hand (common practice): 33° 51′ 35.9″ S = −(33 + 51/60 + 35.9/3600) = −33.859972 to six places.
    expect(parseCoordinate('33°51′35.9″S', 'latitude')).toEqual({ kind: 'ok', decimal: '-33.859972', converted: true });
  });

  it('says what is wrong in words', () => {
    expect(parseCoordinate('-222', 'longitude')).toEqual({
      kind: 'invalid',
      message: 'Longitude is from 180° W to 180° E: −180 to 180 in decimal degrees.',
    });
    expect(parseCoordinate('91 N', 'latitude')).toEqual({
      kind: 'invalid',
      message: 'Latitude is from 90° S to 90° N: −90 to 90 in decimal degrees.',
    });
    expect(parseCoordinate('47 61 N', 'latitude')).toEqual({ kind: 'invalid', message: 'Minutes and seconds are each less than 60.' });
    expect(parseCoordinate('122 54 N', 'longitude')).toEqual({
      kind: 'invalid',
      message: 'E or W for a longitude; N and S are for the latitude.',
    });
    expect(parseCoordinate('-122 54 W', 'longitude')).toEqual({
      kind: 'invalid',
      message: 'Give a minus sign or a hemisphere letter, not both.',
    });
    expect(parseCoordinate('47.5 30 N', 'latitude').kind).toBe('invalid');
    expect(parseCoordinate('4e1', 'latitude').kind).toBe('invalid');
    expect(parseCoordinate('forty-seven', 'latitude')).toEqual({
      kind: 'invalid',
      message: 'Enter decimal degrees or degrees, minutes and seconds, e.g. 47.04, 47°02′24″N or 47 2 24 N.',
    });
  });

  it('reads a decimal back with its hemisphere', () => {
    expect(coordinateInWords('-122.9', 'longitude')).toBe('122.9° W');
    expect(coordinateInWords('47.04', 'latitude')).toBe('47.04° N');
  });
});

describe('the map-free check of the site', () => {
  // America/Los_Angeles keeps UTC−8 as standard time and daylight saving time in the northern summer (IANA tz database).
  it('is silent when the time zone fits the coordinates', () => {
    expect(siteWarnings('47.04', '-122.9', 'America/Los_Angeles', 2025)).toEqual([]);
    expect(siteWarnings(null, null, 'America/Los_Angeles', 2025)).toEqual([]);
    expect(siteWarnings('47.04', '-122.9', null, 2025)).toEqual([]);
  });

  it('warns of a longitude on the wrong side of Greenwich', () => {
    const [warning] = siteWarnings('47.04', '122.9', 'America/Los_Angeles', 2025);
    expect(warning).toContain('The longitude may have the wrong sign');
    expect(warning).toContain('near 120° W');
    expect(warning).toContain('did you mean −122.9?');
  });

  it('warns when the zone and the longitude are hours apart', () => {
    // 75° W ÷ 15° per hour = 5 h west of UTC, 3 h from UTC−8 (common practice: the sun moves 15° an hour).
    const [warning] = siteWarnings('40.7', '-75', 'America/Los_Angeles', 2025);
    expect(warning).toContain('Check the time zone and the longitude');
    expect(warning).toContain('3 hours');
  });

  it('counts around the date line: UTC+14 suits 150° W', () => {
    // Pacific/Kiritimati keeps UTC+14 (IANA tz database); 157.4° W ÷ 15 = −10.5 h, 0.5 h from +14 around the clock.
    expect(siteWarnings(null, '-157.4', 'Pacific/Kiritimati', 2025)).toEqual([]);
  });

  it("warns of a latitude in the other hemisphere from the zone's summer time", () => {
    const [warning] = siteWarnings('-47.04', '-122.9', 'America/Los_Angeles', 2025);
    expect(warning).toContain('The latitude may have the wrong sign');
    expect(warning).toContain('47.04° S');
    // Australia/Sydney keeps daylight saving time in the southern summer (IANA tz database).
    expect(siteWarnings('33.86', '151.21', 'Australia/Sydney', 2025)[0]).toContain('southern summer');
    expect(siteWarnings('-33.86', '151.21', 'Australia/Sydney', 2025)).toEqual([]);
  });
});
