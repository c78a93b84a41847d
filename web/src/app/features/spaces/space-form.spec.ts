import type { SpaceTypeView } from '../../core/api/api-types';
import { fieldMessage } from '../../shared/field-message';
import { requireHeightForFormula, spaceForm } from './space-form';

// ASHRAE 90.1-2016 Table 9.6.1, via PNNL building-energy-standards-data: the atrium row's allowance is 0.03 W/ft² per ft of
// total height (the row notes of shared/reference-data/ashrae901-2016-sbs.csv; from memory); open office 0.81 W/ft², flat.
const types = [
  {
    key: 'atrium-lt-20-ft-in-height',
    label: 'Atrium — < 20 ft in height',
    sourceLabel: 'Atrium | < 20 ft in height',
    category: 'common',
    lpdWPerFt2: '0.03',
    lpdFormula: { kind: 'per-foot-of-height', wPerFt2PerFt: '0.03', heightFt: { below: '20' } },
    verified: false,
    source: 'PNNL',
    confidence: 'medium',
  },
  {
    key: 'office-open-plan',
    label: 'Office — Open plan',
    sourceLabel: 'Office | Open Plan',
    category: 'common',
    lpdWPerFt2: '0.81',
    verified: true,
    source: 'PNNL',
    confidence: 'medium',
  },
] as SpaceTypeView[];

describe('requireHeightForFormula', () => {
  it('asks for the ceiling height once an atrium row whose allowance grows with height is chosen, as the service does', () => {
    const form = spaceForm('space-by-space');
    requireHeightForFormula(form, types);
    const ceiling = form.controls.ceilingHeight;
    form.controls.spaceType.setValue('office-open-plan');
    expect(ceiling.valid).toBe(true);

    form.controls.spaceType.setValue('atrium-lt-20-ft-in-height');
    expect(ceiling.valid).toBe(false);
    expect(ceiling.touched).toBe(true);
    expect(fieldMessage(ceiling, 'Ceiling height')).toBe("The atrium's allowance depends on its height: give the ceiling height.");

    ceiling.setValue('18');
    expect(ceiling.valid).toBe(true);
  });
});
