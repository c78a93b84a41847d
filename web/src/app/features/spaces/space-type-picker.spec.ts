import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { FormControl, Validators } from '@angular/forms';
import type { SpaceTypeView } from '../../core/api/api-types';
import { groupSpaceTypes, SpaceTypePicker } from './space-type-picker';

// IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data: office enclosed 0.74 W/ft², office open plan 0.61,
// library reading area 0.96; the atrium row is unverified in that source (reference/iecc-2021/space-types.json).
const types = [
  {
    key: 'office-enclosed',
    label: 'Office — Enclosed',
    sourceLabel: 'Office | Enclosed',
    category: 'common',
    lpdWPerFt2: '0.74',
    verified: true,
    source: 'PNNL',
    confidence: 'high',
  },
  {
    key: 'office-open-plan',
    label: 'Office — Open plan',
    sourceLabel: 'Office | Open plan',
    category: 'common',
    lpdWPerFt2: '0.61',
    verified: true,
    source: 'PNNL',
    confidence: 'high',
  },
  {
    key: 'atrium-less-than-40-ft-in-height',
    label: 'Atrium — Less than 40 ft in height',
    sourceLabel: 'Atrium | Less than 40 ft in height',
    category: 'common',
    lpdWPerFt2: '0.48',
    verified: false,
    source: 'PNNL',
    confidence: 'low',
    note: 'Only two atrium rows in the source.',
  },
  {
    key: 'library-in-a-reading-area',
    label: 'Library — In a Reading area',
    sourceLabel: 'Library | In a Reading area',
    category: 'building-specific',
    lpdWPerFt2: '0.96',
    verified: true,
    source: 'PNNL',
    confidence: 'high',
  },
] as SpaceTypeView[];

describe('groupSpaceTypes', () => {
  it('groups by category and filters on every word typed', () => {
    expect(groupSpaceTypes(types, '').map((group) => [group.label, group.types.length])).toEqual([
      ['Common space types', 3],
      ['Building-specific space types', 1],
    ]);
    expect(groupSpaceTypes(types, 'office open').flatMap((group) => group.types.map((type) => type.key))).toEqual(['office-open-plan']);
    expect(groupSpaceTypes(types, 'reading')[0]!.label).toBe('Building-specific space types');
  });
});

describe('SpaceTypePicker', () => {
  let fixture: ComponentFixture<SpaceTypePicker>;
  let control: FormControl<string>;
  let input: HTMLInputElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [SpaceTypePicker], providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(SpaceTypePicker);
    control = new FormControl('', { nonNullable: true, validators: [Validators.required] });
    fixture.componentRef.setInput('control', control);
    fixture.componentRef.setInput('spaceTypes', types);
    await fixture.whenStable();
    input = (fixture.nativeElement as HTMLElement).querySelector('input')!;
  });

  async function typeText(text: string): Promise<void> {
    input.focus();
    input.dispatchEvent(new Event('focusin'));
    input.value = text;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  const overlay = () => document.querySelector('.cdk-overlay-container') as HTMLElement;

  it('shows the options grouped by category, with the LPD, the edition label and a verify badge', async () => {
    await typeText('');
    const groups = Array.from(overlay().querySelectorAll('mat-optgroup')).map((group) =>
      group.querySelector('.mat-mdc-optgroup-label')?.textContent?.trim(),
    );
    expect(groups).toEqual(['Common space types', 'Building-specific space types']);
    const atrium = Array.from(overlay().querySelectorAll('mat-option')).find((option) => option.textContent?.includes('Atrium'))!;
    expect(atrium.querySelector('al-verify-badge')).not.toBeNull();
    expect(atrium.textContent).toContain('0.48 W/ft²');
    expect(atrium.textContent).toContain('Atrium | Less than 40 ft in height');
    const office = Array.from(overlay().querySelectorAll('mat-option')).find((option) =>
      option.textContent?.includes('Office — Enclosed'),
    )!;
    expect(office.querySelector('al-verify-badge')).toBeNull();
  });

  it('filters as you type and sets the key when an option is chosen', async () => {
    await typeText('open');
    const options = Array.from(overlay().querySelectorAll<HTMLElement>('mat-option'));
    expect(options.map((option) => option.querySelector('.name')?.textContent?.trim())).toEqual(['Office — Open plan']);
    options[0]!.click();
    await fixture.whenStable();
    expect(control.value).toBe('office-open-plan');
    expect(input.value).toBe('Office — Open plan');
  });

  it('shows densities in W/m² for an SI project', async () => {
    fixture.componentRef.setInput('units', 'si');
    await typeText('enclosed');
    // 0.74 W/ft² × 10.7639 ft²/m² (1 ft = 0.3048 m exactly, NIST SP 811) = 7.97 W/m².
    expect(overlay().textContent).toContain('7.97 W/m²');
  });

  it('accepts an exact key typed by hand and refuses text that names no row', async () => {
    await typeText('library-in-a-reading-area');
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
    expect(control.value).toBe('library-in-a-reading-area');

    await typeText('gymnasium');
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
    expect(control.value).toBe('');
    expect((fixture.nativeElement as HTMLElement).querySelector('mat-error')?.textContent).toContain('Choose a space type from the list.');
  });

  describe('an atrium row whose allowance grows with height', () => {
    // ASHRAE 90.1-2016 Table 9.6.1, via PNNL building-energy-standards-data: the source stores 0.03 (W/ft) and 0.4 + 0.02,
    // read as W/ft² per ft of total atrium height (the row notes of shared/reference-data/ashrae901-2016-sbs.csv; from memory).
    const atria = [
      {
        key: 'atrium-ge-20-ft-and-le-40-ft-in-height',
        label: 'Atrium — ≥ 20 ft and ≤ 40 ft in height',
        sourceLabel: 'Atrium | >= 20 ft and <= 40 ft in height',
        category: 'common',
        lpdWPerFt2: '0.03',
        lpdFormula: { kind: 'per-foot-of-height', wPerFt2PerFt: '0.03', heightFt: { atLeast: '20', atMost: '40' } },
        verified: false,
        source: 'PNNL',
        confidence: 'medium',
      },
      {
        key: 'atrium-gt-40-ft-in-height',
        label: 'Atrium — > 40 ft in height',
        sourceLabel: 'Atrium | > 40 ft in height',
        category: 'common',
        lpdWPerFt2: '0.4',
        lpdFormula: { kind: 'base-plus-per-foot-of-height', baseWPerFt2: '0.4', wPerFt2PerFt: '0.02', heightFt: { above: '40' } },
        verified: false,
        source: 'PNNL',
        confidence: 'medium',
      },
    ] as SpaceTypeView[];

    it('shows the allowance per foot of height, never the bare number as a flat density', async () => {
      fixture.componentRef.setInput('spaceTypes', atria);
      await typeText('atrium');
      const options = Array.from(overlay().querySelectorAll('mat-option')).map((option) =>
        option.querySelector('.lpd')?.textContent?.trim(),
      );
      expect(options).toEqual(['0.03 W/ft² per ft of height', '0.40 W/ft² + 0.02 W/ft² per ft of height']);
    });

    it('speaks per metre of height in an SI project', async () => {
      fixture.componentRef.setInput('spaceTypes', atria);
      fixture.componentRef.setInput('units', 'si');
      await typeText('atrium');
      // 0.03 W/ft² per ft × 10.7639 ft²/m² ÷ 0.3048 m/ft = 1.06 W/m² per m; 0.4 W/ft² = 4.31 W/m²; 0.02 → 0.71 W/m² per m (1 ft = 0.3048 m exactly, NIST SP 811).
      const options = Array.from(overlay().querySelectorAll('mat-option')).map((option) =>
        option.querySelector('.lpd')?.textContent?.trim(),
      );
      expect(options).toEqual(['1.06 W/m² per m of height', '4.31 W/m² + 0.71 W/m² per m of height']);
    });
  });
});
