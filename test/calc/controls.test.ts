import { describe, expect, it } from 'vitest';
import type { ControlLine, EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { ashrae2019, ashrae2022, iecc2021, run } from './fixtures.js';

type SpaceInput = EvaluationDocumentInput['spaces'][number];

function line(lines: ControlLine[], strategy: string): ControlLine {
  const found = lines.find((candidate) => candidate.strategy === strategy);
  if (!found) throw new Error(`no ${strategy} line in ${lines.map((l) => l.strategy).join(', ')}`);
  return found;
}

/** A 30 × 20 ft room with one south window 10 ft wide, head 8 ft, sill 3 ft (50 ft² of glazing). */
function sidelitRoom(edition: string, spaceType: string, primaryWatts: string): EvaluationDocumentInput {
  return {
    edition,
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [{ tag: 'P', description: 'primary', inputWatts: primaryWatts, use: 'general' }],
    spaces: [
      {
        id: 'r',
        name: 'Room',
        spaceType,
        area: 600,
        length: 30,
        width: 20,
        ceilingHeight: 10,
        windows: [{ width: 10, headHeight: 8, sillHeight: 3, wall: 'south' }],
        luminaires: [{ tag: 'P', count: 1, zone: 'primary-sidelit' }],
      },
    ],
  };
}

describe('daylight thresholds', () => {
  it('90.1: sidelighting control required at ≥ 150 W in the primary sidelit zone (149 no, 150 and 151 yes)', () => {
    // ASHRAE 90.1-2019 §9.4.1.1(e) as read by openstudio-standards ashrae_90_1_2019.Space.rb [I]: ≥ 150 W.
    const at = (watts: string) => run(sidelitRoom('ashrae-90.1-2019', 'library-reading', watts), ashrae2019).interior.spaces[0]!;
    expect(at('149').daylight.sidelightingControlRequired).toBe(false);
    expect(at('150').daylight.sidelightingControlRequired).toBe(true);
    expect(at('151').daylight.sidelightingControlRequired).toBe(true);
    expect(line(at('149').controls, 'daylight-sidelighting').status).toBe('not-required');
    const required = line(at('150').controls, 'daylight-sidelighting');
    expect(required.status).toBe('not-met');
    expect(required.section).toBe('9.4.1.1(e)');
    expect(required.reason).toContain('150 W');
  });

  it('IECC: required only above 150 W (149 and 150 no, 151 yes)', () => {
    // IECC 2021 C405.2.4, from memory (control-rules.md §2.9 [M]): > 150 W.
    const at = (watts: string) => run(sidelitRoom('iecc-2021', 'library-reading', watts), iecc2021).interior.spaces[0]!;
    expect(at('149').daylight.sidelightingControlRequired).toBe(false);
    expect(at('150').daylight.sidelightingControlRequired).toBe(false);
    expect(at('151').daylight.sidelightingControlRequired).toBe(true);
    expect(line(at('151').controls, 'daylight-sidelighting').section).toBe('C405.2.4');
  });

  it('90.1: no sidelighting control where the window area is under 20 ft²; secondary at ≥ 300 W combined', () => {
    // 9.4.1.1(e) Exception 2 as read by openstudio-standards [I]: window area < 20 ft² → not required.
    // Window 3 ft × (8 − 2) ft = 18 ft² < 20 ft².
    const small = sidelitRoom('ashrae-90.1-2019', 'library-reading', '200');
    small.spaces[0]!.windows = [{ width: 3, headHeight: 8, sillHeight: 2, wall: 'south' }];
    const smallSpace = run(small, ashrae2019).interior.spaces[0]!;
    expect(smallSpace.daylight.windowArea).toBe('18');
    expect(smallSpace.daylight.sidelightingControlRequired).toBe(false);
    // 150 W primary + 150 W secondary = 300 W ≥ 300 W [I] → secondary control required too.
    const combined = sidelitRoom('ashrae-90.1-2019', 'library-reading', '150');
    combined.spaces[0]!.luminaires!.push({ tag: 'P', count: 1, zone: 'secondary-sidelit' });
    const combinedSpace = run(combined, ashrae2019).interior.spaces[0]!;
    expect(combinedSpace.daylight.secondarySidelitW).toBe('150');
    expect(combinedSpace.daylight.secondarySidelightingControlRequired).toBe(true);
  });

  it('toplighting control at ≥ 150 W in the toplit zone (90.1)', () => {
    // ASHRAE 90.1-2019 §9.4.1.1(f) [I]: ≥ 150 W toplit.
    const document = sidelitRoom('ashrae-90.1-2019', 'library-reading', '150');
    document.spaces[0]!.windows = [];
    document.spaces[0]!.skylights = [{ length: 4, width: 4 }];
    document.spaces[0]!.luminaires = [{ tag: 'P', count: 1, zone: 'toplit' }];
    const space = run(document, ashrae2019).interior.spaces[0]!;
    // Centred 4 × 4 skylight, reach 0.7 × 10 = 7 ft: 18 × 18 = 324 ft² (within the 30 × 20 room).
    expect(space.daylight.toplitArea).toBe('324');
    expect(space.daylight.toplightingControlRequired).toBe(true);
    expect(line(space.controls, 'daylight-toplighting').status).toBe('not-met');
  });
});

describe('90.1 table columns', () => {
  const corridor = (controls: SpaceInput['controls']): ControlLine[] =>
    run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'space-by-space',
        units: 'ip',
        spaces: [{ id: 'c', name: 'Corridor', spaceType: 'corridor', area: 400, controls }],
      },
      ashrae2019,
    ).interior.spaces[0]!.controls;

  it('meets a partial-OFF requirement with a full-OFF control, and the ADD2 group with it too', () => {
    // ASHRAE 90.1-2019 Table 9.6.1 via BESD: corridor (g) REQ, (h) ADD2, (i) ADD2.
    // "A full-OFF control satisfies a partial-OFF requirement" [S-ed], more/ashrae901-control-values.csv.
    const lines = corridor([{ strategy: 'automatic-full-off', provided: true, timeoutMinutes: 15 }]);
    expect(line(lines, 'automatic-partial-off').status).toBe('met');
    expect(line(lines, 'automatic-full-off').status).toBe('met');
    expect(line(lines, 'scheduled-shutoff').status).toBe('met');
    expect(line(lines, 'scheduled-shutoff').requirement).toBe('one-of:ADD2');
    expect(line(lines, 'local-control').status).toBe('to-verify');
  });

  it('fails the group when none of it is provided and a time-out longer than the strategy allows', () => {
    // Automatic partial OFF reduces the lighting by at least 50 % within 20 min [S-ed], more/ashrae901-control-values.csv.
    const none = corridor([{ strategy: 'automatic-partial-off', provided: true, timeoutMinutes: 20, reductionPercent: 50 }]);
    expect(line(none, 'automatic-partial-off').status).toBe('met');
    expect(line(none, 'automatic-full-off').status).toBe('not-met');
    // Automatic full OFF within 20 min ([I] PNNL ConStrain documentation): 30 min is too long.
    const slow = corridor([{ strategy: 'automatic-full-off', provided: true, timeoutMinutes: 30 }]);
    expect(line(slow, 'automatic-full-off').status).toBe('not-met');
    expect(line(slow, 'automatic-full-off').reason).toContain('30 min');
  });

  it('leaves a provided control open, not met, while what decides it is not recorded', () => {
    // The 50 % reduction and the 20 min time-out of partial OFF [S-ed], more/ashrae901-control-values.csv.
    const unrecorded = line(corridor([{ strategy: 'automatic-partial-off', provided: true }]), 'automatic-partial-off');
    expect(unrecorded.status).toBe('to-verify');
    expect(unrecorded.reason).toContain('time-out is not recorded');
    expect(unrecorded.reason).toContain('at least 50 %');
    const tooLittle = line(
      corridor([{ strategy: 'automatic-partial-off', provided: true, timeoutMinutes: 15, reductionPercent: 30 }]),
      'automatic-partial-off',
    );
    expect(tooLittle.status).toBe('not-met');
  });

  it('accepts a claimed general exception and fails the whole result without it', () => {
    const claimed = run(
      {
        edition: 'ashrae-90.1-2022',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [{ tag: 'E', description: 'strip', inputWatts: '20', use: 'general' }],
        spaces: [
          {
            id: 's',
            name: 'Storage',
            spaceType: 'storage-50-plus',
            area: 120,
            luminaires: [{ tag: 'E', count: 2 }],
            controls: [{ strategy: 'automatic-full-off', provided: false, exceptionReason: 'security-or-emergency-continuous' }],
          },
        ],
      },
      ashrae2022,
    );
    expect(line(claimed.interior.spaces[0]!.controls, 'automatic-full-off').status).toBe('exception-claimed');
    expect(claimed.controlsComply).toBe(true);
    expect(claimed.complies).toBe(true);
    const missing = run(
      {
        edition: 'ashrae-90.1-2022',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [{ tag: 'E', description: 'strip', inputWatts: '20', use: 'general' }],
        spaces: [{ id: 's', name: 'Storage', spaceType: 'storage-50-plus', area: 120, luminaires: [{ tag: 'E', count: 2 }] }],
      },
      ashrae2022,
    );
    expect(missing.controlsComply).toBe(false);
    expect(missing.complies).toBe(false);
  });
});

describe('IECC 2021 occupant sensors and time switches', () => {
  const space = (input: Partial<SpaceInput>) =>
    run(
      {
        edition: 'iecc-2021',
        method: 'space-by-space',
        units: 'ip',
        spaces: [{ id: 'x', name: 'Room', area: 100, spaceType: 'lobby', ...input }],
      },
      iecc2021,
    ).interior.spaces[0]!.controls;

  it('requires occupant sensors in listed space types', () => {
    // IECC 2021 C405.2.1 [S] (zmVault transcription): enclosed offices are listed.
    const lines = space({ spaceType: 'office-enclosed', area: 2000, enclosed: true });
    expect(line(lines, 'occupant-sensor').requirement).toBe('required');
    expect(line(lines, 'occupant-sensor').section).toBe('C405.2.1');
    expect(line(lines, 'time-switch').requirement).toBe('not-required');
  });

  it('requires them in any other enclosed space of 300 ft² but not 301 ft² (then a time switch)', () => {
    // IECC 2021 C405.2.1 item 12 [S]: other spaces ≤ 300 ft² enclosed by floor-to-ceiling partitions.
    const at300 = space({ spaceType: 'library-reading', area: 300, enclosed: true });
    expect(line(at300, 'occupant-sensor').requirement).toBe('required');
    expect(line(at300, 'occupant-sensor').reason).toContain('300 ft²');
    const at301 = space({ spaceType: 'library-reading', area: 301, enclosed: true });
    expect(line(at301, 'occupant-sensor').requirement).toBe('not-required');
    expect(line(at301, 'time-switch').requirement).toBe('required');
    const open = space({ spaceType: 'library-reading', area: 200, enclosed: false });
    expect(line(open, 'occupant-sensor').requirement).toBe('not-required');
  });

  it('checks the 20 min time-out and the full automatic-on limit', () => {
    // IECC 2021 C405.2.1.1 [S]: off within 20 min; manual-on or automatic-on to ≤ 50 % except listed spaces.
    const slow = space({ spaceType: 'conference', controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 25 }] });
    expect(line(slow, 'occupant-sensor').status).toBe('not-met');
    const full = space({
      spaceType: 'conference',
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 20, autoOn: 'full' }],
    });
    expect(line(full, 'occupant-sensor').status).toBe('not-met');
    // Restrooms may be full automatic-on (C405.2.1.1 exception [S]).
    const restroom = space({
      spaceType: 'restroom',
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 20, autoOn: 'full' }],
    });
    expect(line(restroom, 'occupant-sensor').status).toBe('met');
  });

  it('needs no time switch where occupant sensors are provided though not required', () => {
    // IECC C405.2.2 (Washington text, WAC 51-11C-405022) [S-ed]: time switches in spaces without occupant sensor controls.
    const sensed = space({
      spaceType: 'library-reading',
      area: 2000,
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 20, autoOn: 'manual' }],
    });
    expect(line(sensed, 'time-switch').requirement).toBe('not-required');
    expect(line(sensed, 'time-switch').reason).toContain('occupant sensor controls that meet the sensor rules are provided');
    const unsensed = space({ spaceType: 'library-reading', area: 2000 });
    expect(line(unsensed, 'time-switch').requirement).toBe('required');
  });

  it('lets only a sensor that meets C405.2.1.1 stand in for the time switch', () => {
    // C405.2.1.1: off within 20 min; manual-on or automatic-on to at most 50 % (transcription of IECC 2021 C405, named in the data).
    const slow = space({
      spaceType: 'library-reading',
      area: 2000,
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 30, autoOn: 'manual' }],
    });
    expect(line(slow, 'time-switch').requirement).toBe('required');
    expect(line(slow, 'time-switch').reason).toContain('30 min');
    const unknownOn = space({
      spaceType: 'library-reading',
      area: 2000,
      controls: [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: 15 }],
    });
    expect(line(unknownOn, 'time-switch').requirement).toBe('required');
    expect(line(unknownOn, 'time-switch').reason).toContain('not recorded');
  });

  it('checks the area one time-switch override serves against the 5,000 ft² limit, in either unit system', () => {
    // Time-switch override controls at most 5,000 ft²: Washington State Energy Code, WAC 51-11C-405022 [S-ed].
    const withZone = (zoneSize: number, units: 'ip' | 'si' = 'ip') =>
      run(
        {
          edition: 'iecc-2021',
          method: 'space-by-space',
          units,
          spaces: [
            {
              id: 'x',
              name: 'Reading room',
              area: 6000,
              spaceType: 'library-reading',
              controls: [{ strategy: 'time-switch', provided: true, zoneSize }],
            },
          ],
        },
        iecc2021,
      ).interior.spaces[0]!.controls;
    expect(line(withZone(5000), 'time-switch').status).toBe('met');
    expect(line(withZone(5001), 'time-switch').status).toBe('not-met');
    // 500 m² = 5,381.96 ft² (1 ft² = 0.09290304 m², mathjs units): over the limit, and an SI project reads both in m²
    // (5,000 ft² = 464.5152 m²).
    expect(line(withZone(500, 'si'), 'time-switch').reason).toContain('one device or zone serves 500 m², more than 464.5 m²');
  });

  it('applies the light-reduction exceptions held in the data', () => {
    // IECC C405.2.3 exceptions as the Washington 2021 text states them (WAC 51-11C-405024) [S-ed]:
    // corridors and lobbies; one luminaire under 60 W; an installed density under 0.45 W/ft².
    const withLuminaires = (spaceType: string, area: number, watts: number, count: number) =>
      run(
        {
          edition: 'iecc-2021',
          method: 'space-by-space',
          units: 'ip',
          luminaireTypes: [{ tag: 'L', description: 'luminaire', inputWatts: watts, use: 'general' }],
          spaces: [{ id: 'x', name: 'Room', area, spaceType, luminaires: [{ tag: 'L', count }] }],
        },
        iecc2021,
      ).interior.spaces[0]!.controls;
    expect(line(withLuminaires('corridor', 400, 30, 6), 'light-reduction').requirement).toBe('not-required');
    expect(line(withLuminaires('lobby', 400, 30, 6), 'light-reduction').requirement).toBe('not-required');
    // One 59 W luminaire in 100 ft² (0.59 W/ft²): excepted; one 60 W luminaire: not by that rule.
    expect(line(withLuminaires('office-enclosed', 100, 59, 1), 'light-reduction').requirement).toBe('not-required');
    expect(line(withLuminaires('office-enclosed', 100, 60, 1), 'light-reduction').requirement).toBe('required');
    // 0.44 W/ft² installed (44 W in 100 ft²) is excepted; 0.45 W/ft² is not (two luminaires, so not the one-luminaire rule).
    expect(line(withLuminaires('office-enclosed', 100, 22, 2), 'light-reduction').requirement).toBe('not-required');
    expect(line(withLuminaires('office-enclosed', 100, 22.5, 2), 'light-reduction').requirement).toBe('required');
  });

  it('lets a general exception claimed on one control cover every control of the space', () => {
    // IECC 2021 C405.2 exceptions [S]: interior exit stairways need no lighting controls at all.
    const lines = run(
      {
        edition: 'iecc-2021',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [{ tag: 'S', description: 'stair luminaire', inputWatts: 30, use: 'general' }],
        spaces: [
          {
            id: 's',
            name: 'Exit stair',
            spaceType: 'office-enclosed',
            area: 200,
            enclosed: true,
            luminaires: [{ tag: 'S', count: 4 }],
            controls: [{ strategy: 'occupant-sensor', provided: false, exceptionReason: 'exit-stairway-ramp-passageway' }],
          },
        ],
      },
      iecc2021,
    ).interior.spaces[0]!.controls;
    expect(line(lines, 'occupant-sensor').status).toBe('exception-claimed');
    expect(line(lines, 'light-reduction').status).toBe('exception-claimed');
    expect(line(lines, 'light-reduction').reason).toContain('exit stairway');
  });

  it('requires specific application control where decorative or display lighting exists', () => {
    // IECC 2021 C405.2.5 (from memory): display and accent lighting controlled apart from general lighting.
    const result = run(
      {
        edition: 'iecc-2021',
        method: 'space-by-space',
        units: 'ip',
        luminaireTypes: [{ tag: 'D', description: 'accent', inputWatts: 12, use: 'display' }],
        spaces: [{ id: 'l', name: 'Lobby', spaceType: 'lobby', area: 400, luminaires: [{ tag: 'D', count: 4 }] }],
      },
      iecc2021,
    );
    const specific = line(result.interior.spaces[0]!.controls, 'specific-application');
    expect(specific.requirement).toBe('required');
    expect(specific.reason).toContain('display 48 W');
  });
});

describe('result framing', () => {
  it('carries the standing cautions and, without a control space type under the building area method, a line to verify', () => {
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'building-area',
        units: 'ip',
        luminaireTypes: [{ tag: 'A', description: 'troffer', inputWatts: '30', use: 'general' }],
        spaces: [{ id: 'b', name: 'Building', buildingAreaType: 'office', area: 5000, luminaires: [{ tag: 'A', count: 40 }] }],
      },
      ashrae2019,
    );
    expect(result.cautions.join(' ')).toMatch(/energy-code compliance only/);
    expect(result.cautions.join(' ')).toMatch(/authority having jurisdiction/);
    expect(result.cautions.join(' ')).toMatch(/engineer of record/);
    const first = result.interior.spaces[0]!.controls[0]!;
    expect(first.strategy).toBe('control-space-type');
    expect(first.status).toBe('to-verify');
    expect(first.section).toBe('9.4.1.1');
    // A to-verify line does not fail the evaluation, but it holds the verdict back; it is listed among the unverified values.
    expect(result.verdict).toBe('incomplete');
    expect(result.complies).toBe(false);
    expect(result.openItems.controlsToVerify).toBeGreaterThan(0);
    expect(result.unverifiedValues.some((value) => value.what.includes('Control space type'))).toBe(true);
  });

  it('applies the control space type’s columns under the building area method', () => {
    // ASHRAE 90.1-2019 Table 9.6.1 via BESD: restroom (h) automatic full OFF REQ.
    const result = run(
      {
        edition: 'ashrae-90.1-2019',
        method: 'building-area',
        units: 'ip',
        spaces: [{ id: 'b', name: 'Restroom', buildingAreaType: 'office', controlSpaceType: 'restroom', area: 200 }],
      },
      ashrae2019,
    );
    expect(line(result.interior.spaces[0]!.controls, 'automatic-full-off').status).toBe('not-met');
    expect(result.complies).toBe(false);
  });
});
