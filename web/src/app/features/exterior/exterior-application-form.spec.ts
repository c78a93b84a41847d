import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { ExteriorApplicationRecord, ExteriorApplicationView, UnitSystem } from '../../core/api/api-types';
import { loadMath } from '../../shared/measure';
import { ExteriorApplicationForm } from './exterior-application-form';

// ASHRAE 90.1-2019 Table 9.4.2-2 (reference/ashrae-90.1-2019/exterior-applications.json): the units each application is allowed by.
const row = {
  source: 'ASHRAE 90.1-2019 Table 9.4.2-2',
  confidence: 'medium',
  verified: true,
  citation: { short: 'Table 9.4.2-2', layer: 'model-code', checked: true, note: null },
} as const;
const catalogue: ExteriorApplicationView[] = [
  {
    key: 'parking-lots-and-drives',
    label: 'Parking lots and drives',
    sourceLabel: '',
    unit: 'W/ft2',
    tradable: true,
    isBaseSiteAllowance: false,
    allowanceByZone: { '2': '0.04' },
    ...row,
  },
  {
    key: 'walkways-less-than-10-feet-wide',
    label: 'Walkways less than 10 feet wide',
    sourceLabel: '',
    unit: 'W/ft',
    tradable: true,
    isBaseSiteAllowance: false,
    allowanceByZone: { '2': '0.5' },
    ...row,
  },
  {
    key: 'automated-teller-machines-and-night-depositories-w-per-location',
    label: 'ATMs and night depositories',
    sourceLabel: '',
    unit: 'W/location',
    tradable: false,
    isBaseSiteAllowance: false,
    allowanceByZone: { '2': '135' },
    ...row,
  },
];

describe('ExteriorApplicationForm quantity', () => {
  let fixture: ComponentFixture<ExteriorApplicationForm>;
  // mathjs, read on first use, takes a while to load in jsdom.
  beforeAll(() => loadMath().then(() => undefined), 60_000);

  async function open(key: string, units: UnitSystem = 'ip'): Promise<HTMLInputElement> {
    TestBed.configureTestingModule({ imports: [ExteriorApplicationForm], providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(ExteriorApplicationForm);
    const record: ExteriorApplicationRecord = {
      id: 'x1',
      key,
      description: '',
      quantity: '1',
      installedWatts: '100',
      controls: [],
      version: 1,
      updatedAt: '',
      updatedBy: null,
    };
    fixture.componentRef.setInput('catalogue', catalogue);
    fixture.componentRef.setInput('record', record);
    fixture.componentRef.setInput('units', units);
    await fixture.whenStable();
    return Array.from((fixture.nativeElement as HTMLElement).querySelectorAll<HTMLInputElement>('input')).find(
      (input) => input.getAttribute('formcontrolname') === 'quantity',
    )!;
  }

  async function type(input: HTMLInputElement, text: string): Promise<void> {
    input.value = text;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
    await fixture.whenStable();
  }

  it('reads an area in site notation for an application allowed per square foot', async () => {
    const input = await open('parking-lots-and-drives');
    await type(input, '120 ft * 40 ft');
    await vi.waitFor(() => expect(input.value).toBe('4800'));
  });

  it('reads a length for an application allowed per foot, in metres in an SI project', async () => {
    const input = await open('walkways-less-than-10-feet-wide', 'si');
    // 1 ft = 0.3048 m exactly (NIST SP 811, B.8): 100 ft is 30.48 m.
    await type(input, '100 ft');
    await vi.waitFor(() => expect(input.value).toBe('30.48'));
  });

  it('reads arithmetic for a count of locations, and refuses a length there with what to write', async () => {
    const input = await open('automated-teller-machines-and-night-depositories-w-per-location');
    await type(input, '4*3');
    await vi.waitFor(() => expect(input.value).toBe('12'));
    await type(input, '12 ft');
    await vi.waitFor(() => expect((fixture.nativeElement as HTMLElement).textContent).toContain('Write a number (for example 4 * 6).'));
  });
});
