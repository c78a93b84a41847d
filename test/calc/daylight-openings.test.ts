import { describe, expect, it } from 'vitest';
import type { ControlLine, EditionData, EvaluationDocumentInput, Provenance } from '../../service/src/compliance/index.js';
import { ashrae2019, iecc2021, run } from './fixtures.js';

/**
 * The glazing rules of the daylight controls: 90.1's exceptions (§9.4.1.1(e)/(f)) and the IECC's
 * minimum glazing of a daylight zone (C405.2.4.2). Every value is from memory, as in
 * reference/<edition>/rules.json, and flagged unverified there.
 */
const fromMemory = (note: string): Provenance => ({ source: 'from memory', confidence: 'from memory', verified: false, note });

const ashrae: EditionData = {
  ...ashrae2019,
  rules: {
    ...ashrae2019.rules,
    daylight: {
      ...ashrae2019.rules.daylight,
      openings: {
        // From memory: a primary sidelighted area blocked by an adjacent structure twice as high above the window as its distance needs no control (9.4.1.1(e)).
        blockedWindow: {
          excludes: 'primary',
          section: '9.4.1.1(e), exceptions',
          provenance: fromMemory('blocked primary sidelighted areas'),
        },
        // From memory: 1,500 daytime hours a year of blocked direct sun (9.4.1.1(f)).
        blockedSkylight: { hours: '1500', section: '9.4.1.1(f), exceptions', provenance: fromMemory('blocked skylights') },
        // From memory: skylights below VT 0.40 (9.4.1.1(f)).
        skylightMinimumVt: { vt: '0.4', section: '9.4.1.1(f), exceptions', provenance: fromMemory('low-transmittance skylights') },
      },
    },
  },
};

const iecc: EditionData = {
  ...iecc2021,
  rules: {
    ...iecc2021.rules,
    daylight: {
      ...iecc2021.rules.daylight,
      openings: {
        // From memory: IECC 2021 C405.2.4.2 item 4, nothing blocking the fenestration's daylight.
        blockedWindow: { excludes: 'all', section: 'C405.2.4.2, item 4', provenance: fromMemory('blocked fenestration') },
        // From memory: C405.2.4.2 item 3, at least 24 ft² of fenestration.
        windowMinimumAreaFt2: { ft2: '24', section: 'C405.2.4.2, item 3', provenance: fromMemory('fenestration area') },
        // From memory: C405.2.4.2 item 5, visible transmittance at least 0.20.
        windowMinimumVt: { vt: '0.2', section: 'C405.2.4.2, item 5', provenance: fromMemory('fenestration transmittance') },
      },
    },
  },
};

type SpaceInput = EvaluationDocumentInput['spaces'][number];
type WindowInput = SpaceInput['windows'] extends (infer W)[] | undefined ? W : never;
type SkylightInput = SpaceInput['skylights'] extends (infer S)[] | undefined ? S : never;

function evaluateSpace(edition: EditionData, space: Partial<SpaceInput>) {
  const document: EvaluationDocumentInput = {
    edition: edition.id,
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [{ tag: 'G', description: 'general', inputWatts: '50', use: 'general' }],
    spaces: [{ id: 's', name: 'Room', area: 600, spaceType: 'office-open', luminaires: [], ...space } as SpaceInput],
  };
  return run(document, edition);
}

function line(lines: ControlLine[], strategy: string): ControlLine {
  const found = lines.find((candidate) => candidate.strategy === strategy);
  if (!found) throw new Error(`no ${strategy} line`);
  return found;
}

/** A 30 × 20 ft room, ceiling 10 ft, one south window 10 ft wide, head 8 ft, sill 3 ft (50 ft² of glazing): invented. */
function sidelitRoom(window: Partial<WindowInput>, watts: { primary: number; secondary?: number }): Partial<SpaceInput> {
  return {
    length: 30,
    width: 20,
    ceilingHeight: 10,
    windows: [{ width: 10, headHeight: 8, sillHeight: 3, wall: 'south', offset: 10, ...window } as WindowInput],
    luminaires: [
      { tag: 'G', count: watts.primary, zone: 'primary-sidelit' },
      ...(watts.secondary ? [{ tag: 'G', count: watts.secondary, zone: 'secondary-sidelit' as const }] : []),
    ],
  };
}

/** The same room with one 4 × 4 ft skylight in the middle and 4 × 50 W in its toplit zone: invented. */
function toplitRoom(skylight: Partial<SkylightInput>): Partial<SpaceInput> {
  return {
    length: 30,
    width: 20,
    ceilingHeight: 10,
    skylights: [{ length: 4, width: 4, ...skylight } as SkylightInput],
    luminaires: [{ tag: 'G', count: 4, zone: 'toplit' }],
  };
}

describe('90.1-2019 sidelighting: a window blocked by an adjacent structure (9.4.1.1(e) exception, from memory)', () => {
  // 4 × 50 W = 200 W in the primary sidelit area: at least 150 W (9.4.1.1(e) [I], control-rules.md §1.2).
  it('needs no control in its primary sidelit area where blocked, and needs it where not', () => {
    const blocked = evaluateSpace(ashrae, sidelitRoom({ daylightBlocked: true, visibleTransmittance: '0.6' }, { primary: 4 })).interior
      .spaces[0]!;
    const sidelighting = line(blocked.controls, 'daylight-sidelighting');
    expect(sidelighting.status).toBe('not-required');
    expect(sidelighting.reason).toContain('blocked by an adjacent structure');
    expect(sidelighting.reason).toContain('§9.4.1.1(e), exceptions');
    expect(blocked.daylight.primarySidelitW).toBe('0');
    expect(blocked.daylight.zones.some((zone) => zone.kind === 'primary-sidelit')).toBe(false);

    const open = evaluateSpace(ashrae, sidelitRoom({ daylightBlocked: false }, { primary: 4 })).interior.spaces[0]!;
    expect(line(open.controls, 'daylight-sidelighting').status).toBe('not-met');
    expect(open.daylight.primarySidelitW).toBe('200');
  });

  it('is to verify where it is not recorded and it decides the answer', () => {
    const blank = evaluateSpace(ashrae, sidelitRoom({}, { primary: 4 }));
    const room = blank.interior.spaces[0]!;
    const sidelighting = line(room.controls, 'daylight-sidelighting');
    expect(sidelighting.status).toBe('to-verify');
    expect(sidelighting.reason).toContain('whether an adjacent structure blocks the daylight of window 1 (south wall) is not recorded');
    expect(room.daylight.reasons.some((reason) => reason.startsWith('Sidelighting, to verify:'))).toBe(true);
    // The zone is drawn and counted as entered: a blank never takes a zone away.
    expect(room.daylight.primarySidelitW).toBe('200');
    expect(
      blank.unverifiedValues.some(
        (value) => value.what === 'Daylight exception: primary sidelit areas of windows blocked by an adjacent structure',
      ),
    ).toBe(true);
  });

  it('a blank does not hold up an answer it cannot change', () => {
    // 2 × 50 W = 100 W primary, under 150 W; nothing secondary: not required however the blank is read.
    const under = evaluateSpace(ashrae, sidelitRoom({}, { primary: 2 })).interior.spaces[0]!;
    expect(line(under.controls, 'daylight-sidelighting').status).toBe('not-required');
    // 0 W primary + 6 × 50 W = 300 W secondary: at least 300 W together (9.4.1.1(e) [I]); the exception frees the primary area only.
    const secondary = evaluateSpace(ashrae, {
      ...sidelitRoom({}, { primary: 0, secondary: 6 }),
      luminaires: [{ tag: 'G', count: 6, zone: 'secondary-sidelit' }],
    }).interior.spaces[0]!;
    expect(line(secondary.controls, 'daylight-sidelighting').status).toBe('not-met');
  });

  it('a blank decides where the primary area carries the combined threshold', () => {
    // 2 × 50 W primary + 4 × 50 W secondary = 300 W: required as entered; without the blocked primary area, 200 W: not.
    const room = evaluateSpace(ashrae, sidelitRoom({}, { primary: 2, secondary: 4 })).interior.spaces[0]!;
    expect(line(room.controls, 'daylight-sidelighting').status).toBe('to-verify');
    const settled = evaluateSpace(ashrae, sidelitRoom({ daylightBlocked: true }, { primary: 2, secondary: 4 })).interior.spaces[0]!;
    expect(line(settled.controls, 'daylight-sidelighting').status).toBe('not-required');
  });
});

describe('90.1-2019 sidelighting: less than 20 ft² of glazing in the space (9.4.1.1(e) Exception 2 [I], control-rules.md §1.2)', () => {
  it('needs no control under 20 ft² and needs it at 20 ft² or more', () => {
    // 4 ft wide, head 8 ft, sill 4 ft: 16 ft² of glazing.
    const small = evaluateSpace(ashrae, sidelitRoom({ width: 4, sillHeight: 4, daylightBlocked: false }, { primary: 4 })).interior
      .spaces[0]!;
    expect(line(small.controls, 'daylight-sidelighting').status).toBe('not-required');
    expect(line(small.controls, 'daylight-sidelighting').reason).toContain('is below 20 ft²');
    // 5 ft wide, head 8 ft, sill 4 ft: 20 ft², not below 20 ft².
    const enough = evaluateSpace(ashrae, sidelitRoom({ width: 5, sillHeight: 4, daylightBlocked: false }, { primary: 4 })).interior
      .spaces[0]!;
    expect(line(enough.controls, 'daylight-sidelighting').status).toBe('not-met');
  });
});

describe('90.1-2019 toplighting exceptions (9.4.1.1(f), from memory)', () => {
  // 4 × 50 W = 200 W in the toplit area: at least 150 W (9.4.1.1(f) [I]).
  it('a skylight whose sun is blocked for more than 1,500 daytime hours a year needs no control; one that is not does', () => {
    const blocked = evaluateSpace(ashrae, toplitRoom({ daylightBlocked: true, visibleTransmittance: '0.6' })).interior.spaces[0]!;
    const toplighting = line(blocked.controls, 'daylight-toplighting');
    expect(toplighting.status).toBe('not-required');
    expect(toplighting.reason).toContain('for more than 1,500 daytime hours a year');
    expect(toplighting.reason).toContain('§9.4.1.1(f), exceptions');
    const open = evaluateSpace(ashrae, toplitRoom({ daylightBlocked: false, visibleTransmittance: '0.6' })).interior.spaces[0]!;
    expect(line(open.controls, 'daylight-toplighting').status).toBe('not-met');
  });

  it('a skylight below a visible transmittance of 0.40 needs no control; one at 0.40 does', () => {
    const low = evaluateSpace(ashrae, toplitRoom({ daylightBlocked: false, visibleTransmittance: '0.35' })).interior.spaces[0]!;
    expect(line(low.controls, 'daylight-toplighting').status).toBe('not-required');
    expect(line(low.controls, 'daylight-toplighting').reason).toContain('visible transmittance of 0.35, below 0.4');
    const at = evaluateSpace(ashrae, toplitRoom({ daylightBlocked: false, visibleTransmittance: '0.4' })).interior.spaces[0]!;
    expect(line(at.controls, 'daylight-toplighting').status).toBe('not-met');
  });

  it('a blank transmittance or blocking is to verify where it decides, and lists the values from memory', () => {
    const blank = evaluateSpace(ashrae, toplitRoom({ daylightBlocked: false }));
    const toplighting = line(blank.interior.spaces[0]!.controls, 'daylight-toplighting');
    expect(toplighting.status).toBe('to-verify');
    expect(toplighting.reason).toContain('the visible transmittance of skylight 1 is not recorded');
    expect(blank.unverifiedValues.map((value) => value.what)).toEqual(
      expect.arrayContaining([
        'Daylight exception: skylights of visible transmittance below 0.4',
        'Daylight exception: skylights whose direct sunlight is blocked for more than 1,500 daytime hours a year',
      ]),
    );
    // 2 × 50 W = 100 W toplit, under 150 W: the blanks change nothing.
    const under = evaluateSpace(ashrae, { ...toplitRoom({}), luminaires: [{ tag: 'G', count: 2, zone: 'toplit' }] }).interior.spaces[0]!;
    expect(line(under.controls, 'daylight-toplighting').status).toBe('not-required');
  });
});

describe('IECC 2021 minimum glazing of a sidelit zone (C405.2.4.2, from memory)', () => {
  // 4 × 50 W = 200 W in the sidelit zones: more than 150 W (C405.2.4, from memory).
  it('a window below a visible transmittance of 0.20 makes no sidelit zone; one at 0.20 does', () => {
    const low = evaluateSpace(iecc, sidelitRoom({ visibleTransmittance: '0.15', daylightBlocked: false }, { primary: 4 })).interior
      .spaces[0]!;
    expect(line(low.controls, 'daylight-sidelighting').status).toBe('not-required');
    expect(line(low.controls, 'daylight-sidelighting').reason).toContain('so it makes no sidelit zone (§C405.2.4.2, item 5)');
    expect(low.daylight.zones).toEqual([]);
    const enough = evaluateSpace(iecc, sidelitRoom({ visibleTransmittance: '0.2', daylightBlocked: false }, { primary: 4 })).interior
      .spaces[0]!;
    expect(line(enough.controls, 'daylight-sidelighting').status).toBe('not-met');
  });

  it('a window of less than 24 ft² makes no sidelit zone; one of 24 ft² does', () => {
    // 4 ft wide, head 8 ft, sill 3 ft: 20 ft².
    const small = evaluateSpace(iecc, sidelitRoom({ width: 4, visibleTransmittance: '0.5', daylightBlocked: false }, { primary: 4 }))
      .interior.spaces[0]!;
    expect(line(small.controls, 'daylight-sidelighting').status).toBe('not-required');
    expect(line(small.controls, 'daylight-sidelighting').reason).toContain('20 ft² of glazing, less than 24 ft²');
    // 6 ft wide, head 8 ft, sill 4 ft: 24 ft².
    const enough = evaluateSpace(
      iecc,
      sidelitRoom({ width: 6, sillHeight: 4, visibleTransmittance: '0.5', daylightBlocked: false }, { primary: 4 }),
    ).interior.spaces[0]!;
    expect(line(enough.controls, 'daylight-sidelighting').status).toBe('not-met');
  });

  it('a blocked window makes no sidelit zone, primary or secondary', () => {
    const blocked = evaluateSpace(iecc, sidelitRoom({ visibleTransmittance: '0.5', daylightBlocked: true }, { primary: 2, secondary: 2 }))
      .interior.spaces[0]!;
    expect(line(blocked.controls, 'daylight-sidelighting').status).toBe('not-required');
    expect(blocked.daylight.secondarySidelitW).toBe('0');
  });

  it('a blank transmittance is to verify only where it decides', () => {
    const blank = evaluateSpace(iecc, sidelitRoom({ daylightBlocked: false }, { primary: 4 })).interior.spaces[0]!;
    expect(line(blank.controls, 'daylight-sidelighting').status).toBe('to-verify');
    expect(line(blank.controls, 'daylight-sidelighting').reason).toContain(
      'the visible transmittance of window 1 (south wall) is not recorded',
    );
    // 2 × 50 W = 100 W: not more than 150 W either way.
    const under = evaluateSpace(iecc, sidelitRoom({}, { primary: 2 })).interior.spaces[0]!;
    expect(line(under.controls, 'daylight-sidelighting').status).toBe('not-required');
    // A glazing rule that already takes the zone away leaves the blank nothing to decide: 20 ft² of glazing.
    const small = evaluateSpace(iecc, sidelitRoom({ width: 4 }, { primary: 4 })).interior.spaces[0]!;
    expect(line(small.controls, 'daylight-sidelighting').status).toBe('not-required');
  });
});
