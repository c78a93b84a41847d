import { FormControl } from '@angular/forms';
import type { AdditionalAllowanceView, AllowanceClaim, SpaceRecord } from '../../core/api/api-types';
import { formatWatts } from '../../shared/format';
import { evaluated } from '../../../testing/evaluate';
import { claimAreaValidator, claimLines, usageWords } from './claim-lines';

// ASHRAE 90.1-2022 §9.5.2.2(b), via pnnl/ruleset-checking-tool (the calculation tests' edition, test/calc/fixtures.ts):
// retail area 3 adds 0.70 W/ft² of the area claimed. The sales floors, claims and display watts are invented.
const allowance = { key: 'retail-area-3', label: 'Retail display, retail area 3', lpdWPerFt2: '0.70' } as AdditionalAllowanceView;
const claim = (id: string, spaceId: string, key: string, area: string): AllowanceClaim => ({
  id,
  spaceId,
  allowance: key,
  area,
  version: 1,
  updatedAt: '',
  updatedBy: null,
});
const result = evaluated({
  edition: 'ashrae-90.1-2022',
  method: 'space-by-space',
  units: 'ip',
  luminaireTypes: [{ tag: 'D', description: 'Display spot', inputWatts: '100', use: 'display' }],
  spaces: [
    { id: 's1', name: 'Sales 1', spaceType: 'sales-area', area: '1000', luminaires: [{ tag: 'D', count: '10' }] },
    { id: 's2', name: 'Sales 2', spaceType: 'sales-area', area: '500', luminaires: [{ tag: 'D', count: '5' }] },
  ],
  retailDisplay: {
    claims: [
      { allowance: 'retail-area-3', spaceId: 's1', area: '800' },
      { allowance: 'retail-area-3', spaceId: 's2', area: '100' },
    ],
  },
});
const watts = (value: number) => formatWatts(String(value));

describe('a space’s claims on the additional allowances', () => {
  it('pairs each claim of the space with its allowance and what the evaluation counted', () => {
    const lines = claimLines(
      's1',
      [claim('c1', 's1', 'retail-area-3', '800'), claim('c2', 's2', 'retail-area-3', '100'), claim('c3', 's1', 'gone', '50')],
      [allowance],
      result,
    );
    expect(lines.map((line) => [line.claim.id, line.allowance?.label ?? null, line.claimedW, line.usableW])).toEqual([
      // 800 ft² × 0.70 W/ft² = 560 W.
      ['c1', 'Retail display, retail area 3', '560', '560'],
      ['c3', null, null, null],
    ]);
  });

  it('says how much of a claim the display lighting uses', () => {
    expect(usageWords(0, 0, 0, watts)).toBe('Nothing claimed yet.');
    expect(usageWords(840, 840, 1000, watts)).toBe('All 840 W claimed is used, against 1,000 W of display lighting.');
    expect(usageWords(1050, 1000, 1000, watts)).toBe(
      '1,000 W of the 1,050 W claimed is used: the display lighting here is 1,000 W, and the allowance covers display lighting only.',
    );
    expect(usageWords(840, 0, 0, watts)).toContain('none used');
  });

  it('says the same of a decorative claim and the decorative lighting', () => {
    expect(usageWords(300, 50, 50, watts, 'decorative')).toBe(
      '50 W of the 300 W claimed is used: the decorative lighting here is 50 W, and the allowance covers decorative lighting only.',
    );
    expect(usageWords(150, 0, 0, watts, 'decorative')).toBe(
      '150 W claimed, none used: no luminaire in this space is entered as decorative lighting, and the allowance covers decorative lighting only.',
    );
  });

  it('takes at most the space’s floor area', () => {
    const space = { area: '2000' } as SpaceRecord;
    const area = new FormControl('', {
      nonNullable: true,
      validators: [
        claimAreaValidator(
          () => space,
          () => 'ip',
        ),
      ],
    });
    area.setValue('2500');
    expect(area.errors).toEqual({ area: 'At most 2,000 ft², the space’s floor area.' });
    area.setValue('-1');
    expect(area.errors).toEqual({ area: 'Must not be negative. Enter a number greater than 0 and at most 5,000,000.' });
    area.setValue('2000');
    expect(area.errors).toBeNull();
  });
});
