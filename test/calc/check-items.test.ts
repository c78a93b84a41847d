import { describe, expect, it } from 'vitest';
import type { EvaluationDocumentInput } from '../../service/src/compliance/index.js';
import { strategyKeys } from '../../contract/editions.js';
import { checkItems, controlOutcome, figure, fingerprint, strategiesByKind } from '../../service/src/review/check-items.js';
import { ashrae2019, iecc2021, run } from './fixtures.js';

/**
 * The check items a submission generates, from the real engine over the calculation tests'
 * editions (test/calc/fixtures.ts; each table value is sourced there).
 */
function library(): EvaluationDocumentInput {
  return {
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [
      { tag: 'A', description: 'troffer', inputWatts: '40', use: 'general' },
      { tag: 'B', description: 'downlight', inputWatts: '20', use: 'general' },
    ],
    spaces: [
      {
        id: 'space-1',
        name: '101 Entry lobby',
        spaceType: 'lobby',
        area: '600',
        luminaires: [{ tag: 'B', count: '20' }],
        controls: [{ strategy: 'time-switch', provided: true, device: 'Panel schedule' }],
      },
      {
        id: 'space-2',
        name: '111 Corridor',
        spaceType: 'corridor',
        area: '400',
        enclosed: true,
        luminaires: [{ tag: 'B', count: '8' }],
        controls: [],
      },
      { id: 'space-3', name: '112 Store', spaceType: 'storage', area: '100', unlit: true },
    ],
    exterior: {
      lightingZone: '2',
      applications: [
        {
          key: 'parking',
          quantity: '10000',
          installedWatts: '350',
          controls: [
            { strategy: 'exterior-daylight-off', provided: true },
            { strategy: 'exterior-setback', provided: true },
          ],
        },
      ],
    },
  };
}

function byTitle(items: ReturnType<typeof checkItems>, title: string) {
  const item = items.find((candidate) => candidate.title === title);
  if (!item) throw new Error(`no item “${title}” among ${items.map((candidate) => candidate.title).join(', ')}`);
  return item;
}

describe('check items from an evaluation', () => {
  const document = library();
  const result = run(document, iecc2021);
  const items = checkItems(document, result);

  it('gives each space its power allowance and one item per control area the engine assessed, and the site its two', () => {
    const lobby = items.filter((item) => item.spaceId === 'space-1').map((item) => item.kind);
    // The fixture edition assesses occupant sensors, time switches, light reduction and daylight for every space (C405.2.1–C405.2.4).
    expect(lobby).toEqual(['power-allowance', 'occupancy-sensing', 'automatic-shutoff', 'daylight-response', 'light-reduction']);
    expect(items.filter((item) => item.spaceId === null).map((item) => item.title)).toEqual([
      'Site: Exterior power',
      'Site: Exterior controls',
    ]);
    expect(new Set(items.map((item) => item.key)).size).toBe(items.length);
    expect(byTitle(items, '101 Entry lobby: Occupancy sensing').key).toBe('occupancy-sensing:space-1');
  });

  it('states the power allowance with the values, units and section the engine used', () => {
    const power = byTitle(items, '101 Entry lobby: Power allowance');
    // IECC 2021 Table C405.3.2(2), via the fixture (BESD): lobby 0.84 W/ft²; 0.84 × 600 = 504 W; 20 × 20 W = 400 W installed.
    expect(power.section).toBe('IECC 2021 §C405.3.2.2');
    expect(power.outcome).toBe('met');
    expect(power.values).toEqual(
      expect.arrayContaining([
        { label: 'Floor area', value: '600 ft²' },
        { label: 'Allowed density', value: '0.84 W/ft²' },
        { label: 'Allowance', value: '504 W' },
        { label: 'Installed', value: '400 W' },
        { label: 'Margin', value: '104 W (20.6 %)' },
      ]),
    );
    expect(power.reasoning).toBe(
      'Installed 400 W is within the allowance of 504 W (0.84 W/ft² for Lobby over 600 ft²), a margin of 104 W.',
    );
  });

  it('carries the engine’s own control reasoning and outcome, with the section and the rule’s standing', () => {
    const sensing = byTitle(items, '111 Corridor: Occupancy sensing');
    // IECC 2021 C405.2.1 (fixture): corridors need occupant sensors; none is recorded here.
    expect(sensing.outcome).toBe('not-met');
    expect(sensing.section).toBe('IECC 2021 §C405.2.1');
    const line = result.interior.spaces[1]!.controls.find((candidate) => candidate.strategy === 'occupant-sensor')!;
    expect(sensing.reasoning).toContain(line.reason);
    expect(sensing.values).toContainEqual({ label: 'Occupant sensor control', value: 'Not met' });
    const shutoff = byTitle(items, '101 Entry lobby: Automatic shutoff');
    expect(shutoff.outcome).toBe('met');
    // The fixture's time-switch row rests on a state's text, so the item says its rule is not yet checked.
    expect(shutoff.reasoning).toMatch(/not yet checked against the printed code/);
  });

  it('says not required for a space confirmed unlit', () => {
    expect(byTitle(items, '112 Store: Power allowance')).toMatchObject({
      outcome: 'not-required',
      reasoning: expect.stringMatching(/confirmed unlit/),
    });
    expect(byTitle(items, '112 Store: Occupancy sensing').outcome).toBe('not-required');
  });

  it('states the exterior power with each application and the controls of the site', () => {
    const power = byTitle(items, 'Site: Exterior power');
    // IECC 2021 Table C405.5.2(2) via the fixture: zone 2 parking 0.04 W/ft² × 10,000 ft² = 400 W; base site 400 W.
    expect(power.section).toBe('IECC 2021 §C405.5.2');
    expect(power.outcome).toBe('met');
    expect(power.values).toContainEqual({ label: 'Parking lots and drives', value: '350 W of 400 W (10,000 ft² at 0.04 W/ft²)' });
    expect(power.values).toContainEqual({ label: 'Base site allowance', value: '400 W' });
    const controls = byTitle(items, 'Site: Exterior controls');
    expect(controls.values).toContainEqual({ label: 'Parking lots and drives: Exterior daylight shutoff', value: 'Met' });
    expect(controls.section).toContain('§C405.2.7.1');
  });

  it('has no exterior items without exterior lighting', () => {
    const { exterior: _exterior, ...inside } = library();
    expect(checkItems(inside, run(inside, iecc2021)).some((item) => item.spaceId === null)).toBe(false);
  });

  it('changes a space’s fingerprints when the space changes, and leaves the others as they were', () => {
    const changed = library();
    changed.spaces[1]!.controls = [{ strategy: 'occupant-sensor', provided: true, timeoutMinutes: '15', autoOn: 'partial' }];
    const again = checkItems(changed, run(changed, iecc2021));
    const prints = (list: typeof items) => new Map(list.map((item) => [item.key, item.fingerprint]));
    const before = prints(items);
    const after = prints(again);
    for (const [key, print] of after) {
      if (key.endsWith(':space-2')) expect(print, key).not.toBe(before.get(key));
      else expect(print, key).toBe(before.get(key));
    }
    // The same data gives the same print, whatever the order of its keys.
    expect(fingerprint({ a: 1, b: [1, { c: 2, d: 3 }] })).toBe(fingerprint({ b: [1, { d: 3, c: 2 }], a: 1 }));
  });

  it('keeps the print of a space over its own allowance when only the building’s totals move', () => {
    const over = library();
    // 30 × 20 W = 600 W in the 504 W lobby: over its own allowance, covered by the building's total while that has room.
    over.spaces[0]!.luminaires = [{ tag: 'B', count: '30' }];
    over.spaces.push({
      id: 'space-4',
      name: '201 Office',
      spaceType: 'office-enclosed',
      area: '1000',
      luminaires: [{ tag: 'A', count: '2' }],
    });
    const first = checkItems(over, run(over, iecc2021));
    const lobby = first.find((item) => item.key === 'power-allowance:space-1')!;
    expect(lobby.outcome).toBe('met');
    expect(lobby.reasoning).toMatch(/building’s total allowance of [\d,]+ W covers it/);
    const more = structuredClone(over);
    more.spaces[3]!.luminaires = [{ tag: 'A', count: '3' }];
    const second = checkItems(more, run(more, iecc2021)).find((item) => item.key === 'power-allowance:space-1')!;
    expect(second.reasoning).not.toBe(lobby.reasoning);
    expect(second.fingerprint).toBe(lobby.fingerprint);
  });

  it('a luminaire type’s new wattage changes the items of the spaces that use it', () => {
    const changed = library();
    changed.luminaireTypes![1]!.inputWatts = '22';
    const again = checkItems(changed, run(changed, iecc2021));
    const lobbyPower = again.find((item) => item.key === 'power-allowance:space-1')!;
    expect(lobbyPower.fingerprint).not.toBe(byTitle(items, '101 Entry lobby: Power allowance').fingerprint);
    expect(again.find((item) => item.key === 'power-allowance:space-3')!.fingerprint).toBe(
      byTitle(items, '112 Store: Power allowance').fingerprint,
    );
  });
});

describe('the edition decides which control items exist', () => {
  it('90.1 spaces get items only for the control areas its table assesses', () => {
    const document: EvaluationDocumentInput = {
      edition: 'ashrae-90.1-2019',
      method: 'space-by-space',
      units: 'ip',
      luminaireTypes: [{ tag: 'A', inputWatts: '30', use: 'general' }],
      spaces: [{ id: 's', name: 'Office 1', spaceType: 'office-enclosed-small', area: '150', luminaires: [{ tag: 'A', count: '2' }] }],
    };
    const result = run(document, ashrae2019);
    const items = checkItems(document, result);
    // The fixture's Table 9.6.1 row (BESD) gives this office columns (a)–(h): local control, manual ON, partial auto ON and
    // bilevel to verify, daylight not required at this size, automatic full OFF required.
    expect(items.map((item) => item.kind)).toEqual([
      'power-allowance',
      'occupancy-sensing',
      'automatic-shutoff',
      'daylight-response',
      'light-reduction',
      'other-controls',
    ]);
    expect(items.find((item) => item.kind === 'other-controls')).toMatchObject({ title: 'Office 1: Other controls', outcome: 'to-verify' });
    expect(items.find((item) => item.kind === 'occupancy-sensing')!.section).toBe('ASHRAE 90.1-2019 §9.4.1.1(b), §9.4.1.1(c)');
    expect(items[0]!.section).toMatch(/^ASHRAE 90\.1-2019 §/);
  });

  it('puts every interior control strategy in one item, so no line the engine assessed goes unreviewed', () => {
    const covered = Object.values(strategiesByKind).flat();
    const interior = strategyKeys.filter((key) => !key.startsWith('exterior-'));
    for (const key of interior)
      expect(
        covered.filter((strategy) => strategy === key),
        key,
      ).toHaveLength(1);
  });
});

describe('the words of an item', () => {
  it('takes the worst of its lines: not met, then to verify (a claimed exception included), then met', () => {
    expect(controlOutcome([{ status: 'met' }, { status: 'not-met' }])).toBe('not-met');
    expect(controlOutcome([{ status: 'met' }, { status: 'exception-claimed' }])).toBe('to-verify');
    expect(controlOutcome([{ status: 'not-required' }, { status: 'met' }])).toBe('met');
    expect(controlOutcome([{ status: 'not-required' }])).toBe('not-required');
  });

  it('rounds half away from zero and groups thousands', () => {
    expect(figure('12345.5', 0)).toBe('12,346');
    expect(figure('0.6', 2, true)).toBe('0.60');
    expect(figure('-104.25', 1)).toBe('-104.3');
    expect(figure('2.50', 2)).toBe('2.5');
  });
});
