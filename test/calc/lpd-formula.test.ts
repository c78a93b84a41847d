import { describe, expect, it } from 'vitest';
import { validateDocument } from '../../service/src/compliance/index.js';
import type { EditionData, SpaceType } from '../../service/src/compliance/edition-data.js';
import { formulaLpd } from '../../service/src/compliance/lpd-formula.js';
import { dec } from '../../service/src/compliance/numbers.js';
import { ashrae2019, run } from './fixtures.js';

/**
 * The atrium rows of ASHRAE 90.1-2016 Table 9.6.1 (via PNNL building-energy-standards-data): the
 * source stores 0.03 with the unit W/ft and, above 40 ft, 0.4 plus a supplemental 0.02. The row
 * notes of shared/reference-data/ashrae901-2016-sbs.csv read them as W/ft² per foot of the atrium's
 * total height; from memory the printed rows say "0.03 per ft total height" and "0.40 + 0.02 per ft
 * total height" (unverified, so the rows are flagged).
 */
const formulaRow = (key: string, label: string, lpd: string, lpdFormula: SpaceType['lpdFormula']): SpaceType => ({
  key,
  label,
  sourceLabel: label,
  category: 'common space type',
  lpdWPerFt2: lpd,
  lpdFormula,
  rcrThreshold: null,
  controls: {},
  provenance: {
    source: 'ASHRAE 90.1-2016 Table 9.6.1, via PNNL building-energy-standards-data',
    confidence: 'medium',
    verified: false,
    note: 'per-foot reading from the row notes; from memory',
  },
});

const atriumMid = formulaRow('atrium-mid', 'Atrium — ≥ 20 ft and ≤ 40 ft in height', '0.03', {
  kind: 'per-foot-of-height',
  wPerFt2PerFt: '0.03',
  heightFt: { atLeast: '20', atMost: '40' },
});
const atriumTall = formulaRow('atrium-tall', 'Atrium — > 40 ft in height', '0.4', {
  kind: 'base-plus-per-foot-of-height',
  baseWPerFt2: '0.4',
  wPerFt2PerFt: '0.02',
  heightFt: { above: '40' },
});

const edition: EditionData = { ...ashrae2019, spaceTypes: [...ashrae2019.spaceTypes, atriumMid, atriumTall] };

const atrium = (type: string, area: string, ceilingHeight: string | undefined, units: 'ip' | 'si' = 'ip') => ({
  edition: 'ashrae-90.1-2019',
  method: 'space-by-space' as const,
  units,
  luminaireTypes: [{ tag: 'A', inputWatts: '100', use: 'general' as const }],
  spaces: [
    {
      id: 'a',
      name: 'Atrium',
      spaceType: type,
      area,
      ...(ceilingHeight === undefined ? {} : { ceilingHeight }),
      luminaires: [{ tag: 'A', count: 10 }],
    },
  ],
});

describe('an allowance per foot of height (90.1-2013/2016 and IECC 2018 atrium rows)', () => {
  it('multiplies W/ft² per foot by the total height, and adds the base above 40 ft', () => {
    expect(formulaLpd(atriumMid.lpdFormula!, dec('30')).toFixed()).toBe('0.9'); // 0.03 × 30 ft (the row notes; from memory)
    expect(formulaLpd(atriumTall.lpdFormula!, dec('50')).toFixed()).toBe('1.4'); // 0.4 + 0.02 × 50 ft (the row notes; from memory)
    // At 40 ft the two rows meet: 0.03 × 40 = 1.2 and 0.4 + 0.02 × 40 = 1.2, so "per ft of total height" is continuous (the reading the notes give).
    expect(formulaLpd(atriumMid.lpdFormula!, dec('40')).toFixed()).toBe(formulaLpd(atriumTall.lpdFormula!, dec('40')).toFixed());
  });

  it('gives a space its allowance from its ceiling height, flagged unverified', () => {
    const result = run(atrium('atrium-mid', '2000', '30'), edition);
    const space = result.interior.spaces[0]!;
    expect(space.allowedLpd).toBe('0.9');
    expect(space.allowanceW).toBe('1800'); // 0.9 W/ft² × 2,000 ft²
    expect(result.unverifiedValues.map((value) => value.what)).toContain('Space type LPD: Atrium — ≥ 20 ft and ≤ 40 ft in height');
    // The table's own number, 0.03, is never used as a flat W/ft²: that would allow 60 W here.
    expect(space.allowanceW).not.toBe('60');
  });

  it('reads the height in metres for an SI project', () => {
    // 50 ft = 15.24 m and 1,000 ft² = 92.90304 m² exactly (1 ft = 0.3048 m): 1.4 W/ft² × 1,000 ft² = 1,400 W.
    const result = run(atrium('atrium-tall', '92.90304', '15.24', 'si'), edition);
    expect(result.interior.spaces[0]!.allowanceW).toBe('1400');
  });

  it('refuses the space without its height, or on the row for another height', () => {
    expect(validateDocument(atrium('atrium-tall', '1000', undefined), edition).problems).toEqual([
      { path: 'spaces.0.ceilingHeight', message: "The atrium's allowance depends on its height: give the ceiling height." },
    ]);
    expect(validateDocument(atrium('atrium-tall', '1000', '40'), edition).problems).toEqual([
      {
        path: 'spaces.0.ceilingHeight',
        message: 'This space type is for atria more than 40 ft high; choose the atrium row for a height of 40 ft.',
      },
    ]);
    expect(validateDocument(atrium('atrium-mid', '1000', '40'), edition).valid).toBe(true); // "≤ 40 ft" includes 40
    expect(validateDocument(atrium('atrium-mid', '1000', '19.9'), edition).problems[0]!.message).toBe(
      'This space type is for atria at least 20 ft and at most 40 ft high; choose the atrium row for a height of 19.9 ft.',
    );
  });

  it('asks nothing of the building area method, which reads the building area type', () => {
    const document = { ...atrium('atrium-tall', '1000', undefined), method: 'building-area' as const };
    const outcome = validateDocument({ ...document, spaces: [{ ...document.spaces[0]!, buildingAreaType: 'office' }] }, edition);
    expect(outcome.valid).toBe(true);
  });
});
