import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { FormControl, Validators } from '@angular/forms';
import type { SpaceTypeView } from '../../core/api/api-types';
import { groupSpaceTypes, SpaceTypePicker } from './space-type-picker';

// IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data: office enclosed 0.74 W/ft², office open plan 0.61,
// library reading area 0.96; the atrium row is unverified in that source (reference/iecc-2021/space-types.json).
const types = [
  { key: 'office-enclosed', label: 'Office — Enclosed', sourceLabel: 'Office | Enclosed', category: 'common', lpdWPerFt2: '0.74', verified: true, source: 'PNNL', confidence: 'high' },
  { key: 'office-open-plan', label: 'Office — Open plan', sourceLabel: 'Office | Open plan', category: 'common', lpdWPerFt2: '0.61', verified: true, source: 'PNNL', confidence: 'high' },
  { key: 'atrium-less-than-40-ft-in-height', label: 'Atrium — Less than 40 ft in height', sourceLabel: 'Atrium | Less than 40 ft in height', category: 'common', lpdWPerFt2: '0.48', verified: false, source: 'PNNL', confidence: 'low', note: 'Only two atrium rows in the source.' },
  { key: 'library-in-a-reading-area', label: 'Library — In a Reading area', sourceLabel: 'Library | In a Reading area', category: 'building-specific', lpdWPerFt2: '0.96', verified: true, source: 'PNNL', confidence: 'high' },
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
    const groups = Array.from(overlay().querySelectorAll('mat-optgroup')).map((group) => group.querySelector('.mat-mdc-optgroup-label')?.textContent?.trim());
    expect(groups).toEqual(['Common space types', 'Building-specific space types']);
    const atrium = Array.from(overlay().querySelectorAll('mat-option')).find((option) => option.textContent?.includes('Atrium'))!;
    expect(atrium.querySelector('al-verify-badge')).not.toBeNull();
    expect(atrium.textContent).toContain('0.48 W/ft²');
    expect(atrium.textContent).toContain('Atrium | Less than 40 ft in height');
    const office = Array.from(overlay().querySelectorAll('mat-option')).find((option) => option.textContent?.includes('Office — Enclosed'))!;
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
});
