import { describe, expect, it } from 'vitest';
import { formatLpd, formatPercent, formatWatts, validateDocument } from '../../service/src/compliance/index.js';
import type { EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { ashrae2019, ashrae2022, iecc2021, run } from './fixtures.js';

const led = (tag: string, watts: string, use: 'general' | 'decorative' | 'display' | 'exempt' = 'general') => ({
  tag,
  description: tag,
  inputWatts: watts,
  use,
});

describe('building area method', () => {
  it('sums LPD × area over several building area types (90.1-2019)', () => {
    // D-BAM-2 (shared/reference-data/more/external-test-cases.csv, derived from ASHRAE 90.1-2019 Table 9.5.1):
    // office 8000 ft² × 0.64 + retail 2000 ft² × 0.84 = 5120 + 1680 = 6800 W.
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'building-area',
        units: 'ip',
        luminaireTypes: [led('A', '40')],
        spaces: [
          { id: 'o', name: 'Offices', buildingAreaType: 'office', area: '8000', luminaires: [{ tag: 'A', count: 120 }] },
          { id: 'r', name: 'Shop', buildingAreaType: 'retail', area: 2000, luminaires: [{ tag: 'A', count: 40 }] },
        ],
      },
      ashrae2019,
    );
    expect(result.interior.allowanceW).toBe('6800');
    // Installed 160 × 40 W = 6400 W; margin 400 / 6800 = 5.882…%.
    expect(result.interior.installedW).toBe('6400');
    expect(formatPercent(result.interior.marginPct)).toBe('5.9');
    expect(result.interior.complies).toBe(true);
    expect(result.interior.section).toBe('9.5.1');
  });

  it('uses each edition’s own table: office 9500 ft² (90.1-2019 and IECC 2021 0.64; 90.1-2022 0.62)', () => {
    // D-BAM-1: 0.64 × 9500 = 6080 W (ASHRAE 90.1-2019 Table 9.5.1 = IECC 2021 Table C405.3.2(1), via BESD).
    // ASHRAE 90.1-2022 Table 9.5.1, via BESD: Office 0.62 → 0.62 × 9500 = 5890 W.
    const document = (edition: string): EvaluationDocumentInput => ({
      edition,
      method: 'building-area',
      units: 'ip',
      spaces: [{ id: 'b', name: 'Building', buildingAreaType: 'office', area: '9500' }],
    });
    expect(run(document('ashrae-90.1-2019'), ashrae2019).interior.allowanceW).toBe('6080');
    expect(run(document('iecc-2021'), iecc2021).interior.allowanceW).toBe('6080');
    expect(run(document('ashrae-90.1-2022'), ashrae2022).interior.allowanceW).toBe('5890');
  });
});

describe('space-by-space method', () => {
  const smallOffice = (edition: string, types: string[]): EvaluationDocumentInput => ({
    edition,
    method: 'space-by-space',
    units: 'ip',
    spaces: [
      // One entry for ten enclosed offices of 200 ft² each, so each is within the "≤ 250 ft²" row.
      { id: 'eo', name: 'Enclosed offices', spaceType: types[0], area: 2000, rooms: 10 },
      { id: 'op', name: 'Open office', spaceType: types[1], area: 5000 },
      { id: 'cf', name: 'Conference', spaceType: types[2], area: 600 },
      { id: 'co', name: 'Corridor', spaceType: types[3], area: 1200 },
      { id: 'rr', name: 'Restrooms', spaceType: types[4], area: 400 },
      { id: 'st', name: 'Storage', spaceType: types[5], area: 300 },
    ],
  });

  it('reproduces D-SBS-1 and D-SBS-2 (same spaces under 90.1-2019 and IECC 2021): 5970 W', () => {
    // external-test-cases.csv D-SBS-1, from ASHRAE 90.1-2019 Table 9.6.1 via BESD:
    // 0.74×2000 + 0.61×5000 + 0.97×600 + 0.41×1200 + 0.63×400 + 0.38×300 = 1480 + 3050 + 582 + 492 + 252 + 114 = 5970 W.
    const ashrae = run(
      smallOffice('ashrae-90.1-2019', ['office-enclosed-small', 'office-open', 'conference', 'corridor', 'restroom', 'storage-50-plus']),
      ashrae2019,
    );
    expect(ashrae.interior.allowanceW).toBe('5970');
    expect(ashrae.interior.spaces.map((space) => space.allowanceW)).toEqual(['1480', '3050', '582', '492', '252', '114']);
    // D-SBS-2, IECC 2021 Table C405.3.2(2) via BESD: same LPDs → 5970 W.
    const iecc = run(
      smallOffice('iecc-2021', ['office-enclosed', 'office-open', 'conference', 'corridor', 'restroom', 'storage']),
      iecc2021,
    );
    expect(iecc.interior.allowanceW).toBe('5970');
    // Area-weighted LPD 5970 / 9500 = 0.6284… W/ft² (D-SBS-1).
    expect(formatLpd(String(5970 / 9500))).toBe('0.63');
  });

  it('lets spaces trade: one space over its own allowance, the total within (90.1-2022)', () => {
    // ASHRAE 90.1-2022 Table 9.5.2.1-1 via BESD: conference 0.88, corridor 0.44.
    // Conference 500 ft² → 440 W allowed, 12 × 40 = 480 W installed (40 W over).
    // Corridor 1000 ft² → 440 W allowed, 10 × 30 = 300 W installed (140 W under).
    // Total 880 W allowed, 780 W installed: complies; margin 100 W = 11.36 %.
    const result = run(
      {
        edition: 'ashrae-90.1-2022',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [led('C', '40'), led('K', '30')],
        spaces: [
          { id: 'cf', name: 'Conference', spaceType: 'conference', area: 500, luminaires: [{ tag: 'C', count: 12 }] },
          { id: 'co', name: 'Corridor', spaceType: 'corridor', area: 1000, luminaires: [{ tag: 'K', count: 10 }] },
        ],
      },
      ashrae2022,
    );
    const [conference, corridor] = result.interior.spaces;
    expect(conference!.withinAllowance).toBe(false);
    expect(conference!.marginW).toBe('-40');
    expect(corridor!.withinAllowance).toBe(true);
    expect(corridor!.marginW).toBe('140');
    expect(result.interior.complies).toBe(true);
    expect(result.interior.marginW).toBe('100');
    expect(formatPercent(result.interior.marginPct)).toBe('11.4');
    expect(conference!.section).toBe('9.5.2.1');
  });

  it('reports exempt lighting with its reason and leaves it out of the total; decorative and display apart', () => {
    // Enclosed office 200 ft² × 0.74 = 148 W (ASHRAE 90.1-2019 Table 9.6.1 via BESD).
    // General 3 × 30 = 90 W, decorative 1 × 20 W, exempt exit sign 2 × 5 W (excluded), total 110 W.
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [led('G', '30'), led('D', '20', 'decorative'), { ...led('X', '5', 'exempt'), exemptReason: 'exit sign' }],
        spaces: [
          {
            id: 'o',
            name: 'Office',
            spaceType: 'office-enclosed-small',
            area: 200,
            luminaires: [
              { tag: 'G', count: 3 },
              { tag: 'D', count: 1 },
              { tag: 'X', count: 2 },
            ],
          },
        ],
      },
      ashrae2019,
    );
    const space = result.interior.spaces[0]!;
    expect(space.installedW).toBe('110');
    expect(space.decorativeW).toBe('20');
    expect(space.exempt).toEqual([{ tag: 'X', count: '2', watts: '10', reason: 'exit sign', section: '9.2.2.3' }]);
    expect(result.interior.exemptW).toBe('10');
    expect(space.allowanceW).toBe('148');
    // Installed LPD 110 / 200 = 0.55 W/ft².
    expect(space.installedLpd).toBe('0.55');
  });

  it('counts line-voltage track at the greater of its watts and 30 W/ft, or its limiter rating', () => {
    // ASHRAE 90.1 §9.1.4(c) [S-ed]: specified wattage with a minimum of 30 W per linear ft, or the current limiter rating.
    // Run T1: 8 ft, 150 W specified → max(150, 30 × 8 = 240) = 240 W.
    // Run T2: 4 ft, 200 W specified → max(200, 120) = 200 W.
    // Run T3: 20 ft with a 300 W current limiter → 300 W.
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [
          { ...led('T1', '150'), basis: 'line-voltage-track', length: '8' },
          { ...led('T2', '200'), basis: 'line-voltage-track', length: '4' },
          { ...led('T3', '400'), basis: 'line-voltage-track', length: '20', limitWatts: '300' },
        ],
        spaces: [
          {
            id: 'g',
            name: 'Gallery',
            spaceType: 'library-reading',
            area: 1000,
            luminaires: [
              { tag: 'T1', count: 1 },
              { tag: 'T2', count: 1 },
              { tag: 'T3', count: 1 },
            ],
          },
        ],
      },
      ashrae2019,
    );
    expect(result.interior.spaces[0]!.luminaires.map((line) => line.watts)).toEqual(['240', '200', '300']);
    expect(result.interior.spaces[0]!.luminaires[0]!.section).toBe('9.1.4(c)');
    expect(result.unverifiedValues.some((value) => value.what.includes('track'))).toBe(true);
  });

  it('applies the room-geometry increase at RCR ≥ threshold and not below it (flagged from memory)', () => {
    // Enclosed office ≤ 250 ft², RCR threshold 8 (ASHRAE 90.1-2019 Table 9.6.1 via BESD); increase 20 % (from memory).
    // 10 × 10 ft, luminaires 10.5 ft, work plane 2.5 ft → h = 8: RCR = 5 × 8 × 20 / 100 = 8 → applies:
    // 0.74 × 1.2 = 0.888 W/ft² × 100 = 88.8 W.
    // Luminaires at 10.4 ft → h = 7.9: RCR = 7.9 < 8 → 0.74 × 100 = 74 W.
    const office = (height: string) =>
      run(
        {
          edition: 'ashrae-90.1-2019',
          method: 'space-by-space',
          units: 'ip',
          spaces: [
            {
              id: 'o',
              name: 'Office',
              spaceType: 'office-enclosed-small',
              area: 100,
              length: 10,
              width: 10,
              luminaireHeight: height,
              ceilingHeight: '11',
            },
          ],
        },
        ashrae2019,
      );
    const at = office('10.5');
    expect(at.interior.spaces[0]!.rcr).toBe('8');
    expect(at.interior.spaces[0]!.roomGeometryIncreaseApplied).toBe(true);
    expect(at.interior.spaces[0]!.allowedLpd).toBe('0.888');
    expect(at.interior.spaces[0]!.allowanceW).toBe('88.8');
    expect(at.unverifiedValues.some((value) => value.what.startsWith('Room-geometry increase'))).toBe(true);
    const below = office('10.4');
    expect(below.interior.spaces[0]!.rcr).toBe('7.9');
    expect(below.interior.spaces[0]!.roomGeometryIncreaseApplied).toBe(false);
    expect(below.interior.spaces[0]!.allowanceW).toBe('74');
  });

  it('limits the retail display allowance to the display watts it covers (90.1-2022 formula)', () => {
    // D-RETAIL-2022 (external-test-cases.csv, 90.1-2022 §9.5.2.2(b)): 750 + 1000 × 0.40 + 500 × 0.70 = 1500 W available.
    // Display lighting installed 1200 W, so only 1200 W of it may be used (use it or lose it).
    // Base: sales area 0.85 W/ft² (90.1-2022 Table 9.5.2.1-2, via BESD): 1000 × 0.85 + 500 × 0.85 = 1275 W.
    // Claims per space: 400 W (space s1), 350 W (space s2); display 800 W in s1, 400 W in s2.
    // Space s1 uses min(400, 800) = 400; s2 min(350, 400) = 350; fixed 750 W covers min(750, 400 + 50) = 450 W.
    const result = run(
      {
        edition: 'ashrae-90.1-2022',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [led('S', '100', 'display')],
        spaces: [
          { id: 's1', name: 'Sales 1', spaceType: 'sales-area', area: 1000, luminaires: [{ tag: 'S', count: 8 }] },
          { id: 's2', name: 'Sales 2', spaceType: 'sales-area', area: 500, luminaires: [{ tag: 'S', count: 4 }] },
        ],
        retailDisplay: {
          claims: [
            { allowance: 'retail-area-1', spaceId: 's1', area: 1000 },
            { allowance: 'retail-area-3', spaceId: 's2', area: 500 },
          ],
        },
      },
      ashrae2022,
    );
    expect(result.interior.additional!.claimedW).toBe('1500');
    expect(result.interior.additional!.usableW).toBe('1200');
    expect(result.interior.displayW).toBe('1200');
    // 1275 + 1200 = 2475 W allowed; 1200 W installed.
    expect(result.interior.allowanceW).toBe('2475');
  });

  it('refuses a display claim off the sales floor, larger than its space, or made twice', () => {
    const document = (claims: { allowance: string; spaceId: string; area: number }[]): EvaluationDocumentInput => ({
      edition: 'ashrae-90.1-2022',
      method: 'space-by-space',
      units: 'ip',
      luminaireTypes: [led('S', '100', 'display')],
      spaces: [
        { id: 's1', name: 'Sales floor', spaceType: 'sales-area', area: 1000, luminaires: [{ tag: 'S', count: 2 }] },
        { id: 'c', name: 'Meeting room', spaceType: 'conference', area: 300, luminaires: [{ tag: 'S', count: 1 }] },
      ],
      retailDisplay: { claims },
    });
    const problems = (claims: Parameters<typeof document>[0]) =>
      validateDocument(document(claims), ashrae2022).problems.map((problem) => problem.path);
    expect(problems([{ allowance: 'retail-area-1', spaceId: 'c', area: 300 }])).toEqual(['retailDisplay.claims.0.spaceId']);
    expect(problems([{ allowance: 'retail-area-1', spaceId: 's1', area: 1200 }])).toEqual(['retailDisplay.claims.0.area']);
    expect(
      problems([
        { allowance: 'retail-area-1', spaceId: 's1', area: 400 },
        { allowance: 'retail-area-1', spaceId: 's1', area: 400 },
      ]),
    ).toEqual(['retailDisplay.claims.1.allowance']);
    expect(
      problems([
        { allowance: 'retail-area-1', spaceId: 's1', area: 400 },
        { allowance: 'retail-area-3', spaceId: 's1', area: 600 },
      ]),
    ).toEqual([]);
  });

  it('sums per level', () => {
    const result = run(
      {
        edition: 'iecc-2021',
        method: 'space-by-space',
        units: 'ip',
        spaces: [
          { id: 'a', name: 'A', level: 'L1', spaceType: 'lobby', area: 100 },
          { id: 'b', name: 'B', level: 'L1', spaceType: 'corridor', area: 100 },
          { id: 'c', name: 'C', level: 'L2', spaceType: 'corridor', area: 100 },
        ],
      },
      iecc2021,
    );
    // IECC 2021 Table C405.3.2(2) via BESD: lobby 0.84, corridor 0.41 → L1 84 + 41 = 125 W, L2 41 W.
    expect(result.interior.levels).toEqual([
      { level: 'L1', area: '200', allowanceW: '125', installedW: '0', marginW: '125' },
      { level: 'L2', area: '100', allowanceW: '41', installedW: '0', marginW: '41' },
    ]);
  });
});

describe('external test cases (mechanics of area-weighting)', () => {
  it('RCT-6-1-c/d: space-by-space pass and fail on the total (pnnl/ruleset-checking-tool section6 tests)', () => {
    // external-test-cases.csv RCT-6-1-c/-d (github:pnnl/ruleset-checking-tool@dea6a04, Appendix G LPDs, used for mechanics only):
    // allowance = guest room 1.14 W/ft² + hotel lobby 1.10 W/ft²; c: design 100 × 0.41 + 1000 × 1.10 = 1141 W
    // against 1.14 × 100 + 1.10 × 1000 = 1214 W → pass; d: 40 × 1.30 + 1000 × 1.50 = 1552 W against
    // 1.14 × 40 + 1100 = 1145.6 W → fail.
    const edition = {
      ...ashrae2019,
      spaceTypes: [
        { ...ashrae2019.spaceTypes[0]!, key: 'guest-room', sourceLabel: 'Guest Room', rcrThreshold: null, lpdWPerFt2: '1.14' },
        { ...ashrae2019.spaceTypes[0]!, key: 'hotel-lobby', sourceLabel: 'Lobby | Hotel', rcrThreshold: null, lpdWPerFt2: '1.10' },
      ],
    };
    const hotel = (guestArea: number, guestDensity: string, lobbyDensity: string) =>
      run(
        {
          edition: 'ashrae-90.1-2019',
          method: 'space-by-space',
          units: 'ip',
          luminaireTypes: [led('G', guestDensity), led('L', lobbyDensity)],
          // One "luminaire" per ft² at the case's density gives the case's design watts.
          spaces: [
            { id: 'g', name: 'Guest room', spaceType: 'guest-room', area: guestArea, luminaires: [{ tag: 'G', count: guestArea }] },
            { id: 'l', name: 'Lobby', spaceType: 'hotel-lobby', area: 1000, luminaires: [{ tag: 'L', count: 1000 }] },
          ],
        },
        edition,
      );
    const pass = hotel(100, '0.41', '1.10');
    expect(pass.interior.installedW).toBe('1141');
    expect(pass.interior.allowanceW).toBe('1214');
    expect(pass.interior.complies).toBe(true);
    const fail = hotel(40, '1.30', '1.50');
    expect(fail.interior.installedW).toBe('1552');
    expect(fail.interior.allowanceW).toBe('1145.6');
    expect(fail.interior.complies).toBe(false);
  });

  it('OSSTD-LPD-1: area-weighted LPD 1.5 × 0.8 + 0.89 × 0.2 = 1.378 W/ft² (NREL openstudio-standards set_space_lpd.md)', () => {
    // external-test-cases.csv OSSTD-LPD-1 (github:NREL/openstudio-standards@6ce07803, App. G LPDs): 1.378 W/ft² = 14.83267494 W/m².
    const edition = {
      ...ashrae2019,
      buildingAreaTypes: [
        { ...ashrae2019.buildingAreaTypes[0]!, key: 'retail-whole', lpdWPerFt2: '1.5' },
        { ...ashrae2019.buildingAreaTypes[0]!, key: 'dressing', lpdWPerFt2: '0.89' },
      ],
    };
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'building-area',
        units: 'ip',
        spaces: [
          { id: 'a', name: 'Sales', buildingAreaType: 'retail-whole', area: 80 },
          { id: 'b', name: 'Dressing', buildingAreaType: 'dressing', area: 20 },
        ],
      },
      edition,
    );
    expect(Number(result.interior.allowanceW) / 100).toBeCloseTo(1.378, 12);
    // In SI: 1.378 / 0.09290304 = 14.83267494 W/m² (mathjs units factor).
    expect(formatLpd(String(1.378 / 0.09290304))).toBe('14.83');
  });
});

describe('display helpers', () => {
  it('round only for display: watts to 1 W, LPD to 0.01, percent to 0.1', () => {
    expect(formatWatts('1234.5')).toBe('1235');
    expect(formatWatts('-0.4')).toBe('0');
    expect(formatLpd('0.888')).toBe('0.89');
    expect(formatPercent('11.3636')).toBe('11.4');
    expect(formatPercent(null)).toBe('—');
  });
});

describe('spaces without luminaires', () => {
  // IECC 2021 Table C405.3.2(2), via BESD: office enclosed 0.74 W/ft², storage 0.38 W/ft².
  const document = (unlit?: boolean): EvaluationDocumentInput => ({
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [led('A', '30')],
    spaces: [
      {
        id: 'o',
        name: 'Office',
        spaceType: 'office-enclosed',
        area: 200,
        luminaires: [{ tag: 'A', count: 4 }],
        controls: [
          { strategy: 'occupant-sensor', provided: true, timeoutMinutes: '20', autoOn: 'manual' },
          // IECC 2021 C405.2.3: reduce the connected load by at least 50 % [S-ed, Washington text].
          { strategy: 'light-reduction', provided: true, reductionPercent: '50' },
        ],
      },
      {
        id: 's',
        name: 'Shaft room',
        spaceType: 'storage',
        area: 1000,
        controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', autoOn: 'manual' }],
        ...(unlit === undefined ? {} : { unlit }),
      },
    ],
  });

  it('hold the verdict back, named in the cautions, until each is entered or confirmed unlit', () => {
    const result = run(document(), iecc2021);
    const shaft = result.interior.spaces.find((space) => space.id === 's')!;
    expect(shaft.lighting).toBe('none-entered');
    expect(result.interior.spaces.find((space) => space.id === 'o')!.lighting).toBe('entered');
    // 4 × 30 = 120 W against 148 + 380 W would pass; with a space still empty there is no verdict yet.
    expect(result.interior.complies).toBe(true);
    expect(result.verdict).toBe('incomplete');
    expect(result.complies).toBe(false);
    expect(result.openItems).toEqual({ spacesWithoutLuminaires: 1, controlsToVerify: 0 });
    // Its control lines still say what its lighting will need.
    expect(shaft.controls.find((control) => control.strategy === 'occupant-sensor')!.status).toBe('met');
    expect(result.cautions.some((caution) => caution.includes('“Shaft room” has no luminaires entered'))).toBe(true);
  });

  it('keep their control requirements out of the verdict while they wait: listed, not failing', () => {
    const empty = document();
    empty.spaces[1] = { ...empty.spaces[1]!, controls: [] };
    const result = run(empty, iecc2021);
    const shaft = result.interior.spaces.find((space) => space.id === 's')!;
    // IECC 2021 C405.2.1 lists storage rooms for occupant sensors: required, and nothing is recorded yet.
    expect(shaft.controls.find((control) => control.strategy === 'occupant-sensor')!.status).toBe('not-met');
    expect(result.controlsComply).toBe(true);
    expect(result.verdict).toBe('incomplete');
  });

  it('once confirmed unlit, have no lighted floor area: they add no allowance, and the verdict is settled', () => {
    const result = run(document(true), iecc2021);
    const shaft = result.interior.spaces.find((space) => space.id === 's')!;
    expect(shaft.lighting).toBe('unlit');
    expect(shaft.controls.every((control) => control.status === 'not-required')).toBe(true);
    // Only the office counts: 0.74 × 200 = 148 W.
    expect(result.interior.allowanceW).toBe('148');
    expect(result.verdict).toBe('complies');
    expect(result.cautions.some((caution) => caution.includes('Shaft room'))).toBe(false);
  });

  it('cannot hide a failure: a design over its allowance does not comply whatever is still empty', () => {
    const over = document();
    over.spaces[0]!.luminaires = [{ tag: 'A', count: 30 }];
    // 30 × 30 = 900 W against 148 + 380 = 528 W.
    expect(run(over, iecc2021).verdict).toBe('does-not-comply');
  });
});
