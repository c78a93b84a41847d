import { describe, expect, it } from 'vitest';
import {
  areaFromSquareFeet,
  areaToSquareFeet,
  daylightAreas,
  lengthFromFeet,
  lengthToFeet,
  metresPerFoot,
  rectangularRoomCavityRatio,
  roomCavityRatio,
  squareMetresPerSquareFoot,
} from '../../service/src/compliance/index.js';
import { dec } from '../../service/src/compliance/numbers.js';
import { ashrae2019, iecc2021, run } from './fixtures.js';

describe('unit conversion (mathjs units)', () => {
  it('takes the exact international foot from mathjs: 1 ft = 0.3048 m, 1 ft² = 0.09290304 m²', () => {
    // International yard and pound agreement (1959), as mathjs units defines ft: 1 ft = 0.3048 m exactly.
    expect(metresPerFoot.toFixed()).toBe('0.3048');
    // 0.3048² = 0.09290304 exactly.
    expect(squareMetresPerSquareFoot.toFixed()).toBe('0.09290304');
  });

  it('converts both ways without loss', () => {
    // 10 ft = 3.048 m; 3.048 m = 10 ft (0.3048 m/ft, mathjs units).
    expect(lengthFromFeet(dec('10'), 'si').toFixed()).toBe('3.048');
    expect(lengthToFeet(dec('3.048'), 'si').toFixed()).toBe('10');
    // 100 ft² = 9.290304 m² and back.
    expect(areaFromSquareFeet(dec('100'), 'si').toFixed()).toBe('9.290304');
    expect(areaToSquareFeet(dec('9.290304'), 'si').toFixed()).toBe('100');
    expect(lengthToFeet(dec('7'), 'ip').toFixed()).toBe('7');
  });
});

describe('room cavity ratio (IES Lighting Handbook zonal-cavity method)', () => {
  it('gives 2.5 for a 20 ft × 30 ft room with a 6 ft cavity, in both forms', () => {
    // IES Lighting Handbook zonal-cavity method: RCR = 5 h (L + W) / (L W) = 5 × 6 × 50 / 600 = 2.5.
    expect(rectangularRoomCavityRatio(dec(6), dec(20), dec(30)).toFixed()).toBe('2.5');
    // General form RCR = 2.5 × h × P / A: P = 100 ft, A = 600 ft² → 2.5 × 6 × 100 / 600 = 2.5.
    expect(roomCavityRatio(dec(6), dec(100), dec(600)).toFixed()).toBe('2.5');
  });

  it('is computed from luminaire height above a 2.5 ft work plane when none is given', () => {
    // Work plane 2.5 ft (common practice); ceiling 9 ft → h = 6.5 ft; room 10 × 12:
    // RCR = 5 × 6.5 × 22 / 120 = 715 / 120 = 5.958333…, reported to 0.01.
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [],
        spaces: [
          { id: 'a', name: 'Office', spaceType: 'office-enclosed-small', area: '120', length: '10', width: '12', ceilingHeight: '9' },
        ],
      },
      ashrae2019,
    );
    expect(result.interior.spaces[0]!.rcr).toBe(dec(715).dividedBy(120).toDecimalPlaces(2).toFixed());
  });
});

describe('daylight zones', () => {
  const room = { length: dec(30), width: dec(20), ceilingHeight: dec(10) };

  it('clips a primary sidelit zone at the wall the window is next to (90.1: extension ½ head height)', () => {
    // 90.1 primary sidelit width = window width + ½ head height each side (control-rules.md §1.3 [S-ed]/[I]);
    // window 6 ft wide, head 8 ft, 1 ft from the west end of the south wall:
    // x from 1 − 4 = −3 → clipped to 0, to 1 + 6 + 4 = 11; depth 1 × 8 ft → 11 × 8 = 88 ft².
    // Secondary: depth 8 to 16 ft, same width → 11 × 8 = 88 ft².
    const areas = daylightAreas(
      { ...room, windows: [{ width: dec(6), headHeight: dec(8), offset: dec(1), wall: 'south' }], skylights: [] },
      ashrae2019.rules.daylight,
    );
    expect(areas.primarySidelit.toFixed()).toBe('88');
    expect(areas.secondarySidelit.toFixed()).toBe('88');
    const primary = areas.rectangles.find((rectangle) => rectangle.kind === 'primary-sidelit')!;
    expect(primary.x0.toFixed()).toBe('0');
    expect(primary.x1.toFixed()).toBe('11');
  });

  it('clips the secondary band at the opposite wall and uses 2 ft extensions under IECC', () => {
    // IECC primary sidelit width = window width + 2 ft each side (from memory, control-rules.md §2.9);
    // north wall window 10 ft wide, head 12 ft, centred on a 30 ft wall: x 10 − 2 = 8 to 22 → 14 ft.
    // Primary depth 12 ft (y 8..20) → 168 ft²; secondary 12..24 ft clipped by the 20 ft room → y 0..8 → 112 ft².
    const areas = daylightAreas(
      { ...room, windows: [{ width: dec(10), headHeight: dec(12), wall: 'north' }], skylights: [] },
      iecc2021.rules.daylight,
    );
    expect(areas.primarySidelit.toFixed()).toBe('168');
    expect(areas.secondarySidelit.toFixed()).toBe('112');
  });

  it('counts overlapping zones once: toplit over primary over secondary', () => {
    // Two south windows whose primary zones overlap: 4 ft wide at offsets 4 and 8, head 6 ft,
    // extension 3 ft: x 1..11 and 5..15 → union 1..15 = 14 ft × 6 ft = 84 ft² primary.
    // A 4 × 4 ft skylight at (13, 2), ceiling 10 ft: toplit reach 0.7 × 10 = 7 ft (control-rules.md §1.3 [I])
    // → x 6..24, y 0..13 (clipped) = 18 × 13 = 234 ft².
    // Primary outside the toplit zone: x 1..6 × y 0..6 = 30 ft².
    // Secondary band y 6..12, x 1..15, outside toplit: x 1..6 → 5 × 6 = 30 ft².
    const areas = daylightAreas(
      {
        ...room,
        windows: [
          { width: dec(4), headHeight: dec(6), offset: dec(4), wall: 'south' },
          { width: dec(4), headHeight: dec(6), offset: dec(8), wall: 'south' },
        ],
        skylights: [{ length: dec(4), width: dec(4), x: dec(13), y: dec(2) }],
      },
      ashrae2019.rules.daylight,
    );
    expect(areas.toplit.toFixed()).toBe('234');
    expect(areas.primarySidelit.toFixed()).toBe('30');
    expect(areas.secondarySidelit.toFixed()).toBe('30');
  });

  it('reports zone areas and rectangles in SI for an SI document', () => {
    // The 88 ft² primary zone above, entered in metres: 88 ft² × 0.09290304 = 8.17546752 m² (mathjs units).
    const ft = (feet: number) => dec(feet).times(metresPerFoot).toFixed();
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'space-by-space',
        units: 'si',
        spaces: [
          {
            id: 'r',
            name: 'Reading',
            spaceType: 'library-reading',
            area: dec(600).times(squareMetresPerSquareFoot).toFixed(),
            length: ft(30),
            width: ft(20),
            ceilingHeight: ft(10),
            windows: [{ width: ft(6), headHeight: ft(8), offset: ft(1), wall: 'south' }],
          },
        ],
      },
      ashrae2019,
    );
    // Reported to 0.01 m² and lengths to 0.001 m: 8.18 m²; 11 ft = 3.3528 m → 3.353 m.
    expect(result.interior.spaces[0]!.daylight.primarySidelitArea).toBe('8.18');
    expect(result.interior.spaces[0]!.daylight.zones[0]!.length).toBe('3.353');
  });
});
