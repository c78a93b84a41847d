import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ControlStrategyView, ProjectDetail, SpaceRecord, SpaceTypeView } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { evaluated, lineOf } from '../../../testing/evaluate';
import { ProjectStore } from '../workspace/project-store';
import { BulkControlPanel } from './bulk-control-panel';

// Invented office floor: three open-plan offices on two levels and a corridor.
const project = {
  id: 'p1',
  name: 'Harbour Offices',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'si',
  version: 1,
  members: [],
} as unknown as ProjectDetail;

function space(id: string, name: string, level: string, spaceType: string, version = 1): SpaceRecord {
  return {
    id,
    name,
    level,
    position: 1,
    area: '20',
    spaceType,
    luminaires: [],
    controls: [],
    windows: [],
    skylights: [],
    version,
    updatedAt: '',
    updatedBy: null,
  };
}

const spaces = [
  space('o1', 'Open office 1', 'Level 2', 'office-open'),
  space('o2', 'Open office 2', 'Level 2', 'office-open'),
  space('o3', 'Open office 3', 'Level 1', 'office-open'),
  space('c1', 'Corridor', 'Level 1', 'corridor'),
];
// The labels of the calculation tests' IECC 2021 edition (test/calc/fixtures.ts), which evaluates these spaces below.
const spaceTypes = [
  { key: 'office-open', label: 'Office, open plan', verified: true },
  { key: 'corridor', label: 'Corridor', verified: true },
] as SpaceTypeView[];
// IECC 2021 C405.2.2 (as the reference data holds it, [S-ed] Washington text): one override serves at most 5,000 ft².
const strategies = [
  { key: 'occupant-sensor', label: 'Occupant sensor', section: 'C405.2.1', parameters: { timeoutMinutes: '20' } },
  { key: 'time-switch', label: 'Time-switch control', section: 'C405.2.2', parameters: { zoneSizeLimitFt2: '5000' } },
  // IECC 2021 C405.2.1.2–C405.2.1.4 as the reference data holds it ([S-ed] secondary summaries): at least 50 % in warehouses and corridors.
  {
    key: 'automatic-partial-off',
    label: 'Automatic partial OFF',
    section: 'C405.2.1.2–C405.2.1.4',
    parameters: { timeoutMinutes: '20', reductionPercent: '50' },
  },
] as unknown as ControlStrategyView[];

// The spaces as the engine evaluates them, nothing provided yet. Open offices and corridors are listed for occupant
// sensors, so no time switch is needed (IECC 2021 C405.2.1, C405.2.2), and their occupant-sensor function asks for an
// automatic partial OFF (C405.2.1.2–C405.2.1.4, as the edition holds them).
const result = evaluated({
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'si',
  spaces: spaces.map((entry) => ({ id: entry.id, name: entry.name, level: entry.level, spaceType: entry.spaceType, area: entry.area })),
});

describe('BulkControlPanel', () => {
  let fixture: ComponentFixture<BulkControlPanel>;
  let element: HTMLElement;
  let store: ProjectStore;
  let http: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [BulkControlPanel],
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    http = TestBed.inject(HttpTestingController);
    store.seed({ project });
    store.seed({ spaces });
    store.seed({
      tables: { spaceTypes, buildingAreaTypes: [], controlStrategies: strategies, exteriorApplications: [], lightingZones: [] },
    });
    store.seed({ results: { status: 'ready', result } });
    fixture = TestBed.createComponent(BulkControlPanel);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    element.querySelector<HTMLElement>('mat-expansion-panel-header')!.click();
    await fixture.whenStable();
  });

  const checkbox = (label: string) =>
    Array.from(element.querySelectorAll<HTMLElement>('mat-checkbox'))
      .find((box) => box.textContent?.includes(label))!
      .querySelector<HTMLInputElement>('input')!;

  async function choose(label: string, option: string): Promise<void> {
    const field = Array.from(element.querySelectorAll('mat-form-field')).find(
      (entry) => entry.querySelector('mat-label')?.textContent?.trim() === label,
    )!;
    field.querySelector<HTMLElement>('mat-select')!.click();
    await fixture.whenStable();
    Array.from(document.querySelectorAll<HTMLElement>('mat-option'))
      .find((entry) => entry.textContent?.includes(option))!
      .click();
    await fixture.whenStable();
  }

  async function fill(label: string, value: string): Promise<void> {
    const field = Array.from(element.querySelectorAll('mat-form-field')).find((entry) =>
      entry.querySelector('mat-label')?.textContent?.trim().startsWith(label),
    )!;
    const input = field.querySelector<HTMLInputElement>('input')!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  const submit = async () => {
    element.querySelector<HTMLButtonElement>('form.record button[type="submit"]')!.click();
    await fixture.whenStable();
  };

  it('offers the controls the evaluation applies to the spaces', async () => {
    for (const entry of result.interior.spaces) {
      expect([lineOf(entry, 'time-switch').status, lineOf(entry, 'automatic-partial-off').status]).toEqual(['not-required', 'not-met']);
    }
    checkbox('Select all shown').click();
    const field = Array.from(element.querySelectorAll('mat-form-field')).find(
      (entry) => entry.querySelector('mat-label')?.textContent?.trim() === 'Control',
    )!;
    field.querySelector<HTMLElement>('mat-select')!.click();
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll<HTMLElement>('mat-option')).map((entry) =>
      entry.textContent?.replace(/\s+/g, ' ').trim(),
    );
    expect(options).toEqual([
      'Occupant sensor · applies to 4 of 4 chosen',
      'Time-switch control · applies to 0 of 4 chosen',
      'Automatic partial OFF · applies to 4 of 4 chosen',
    ]);
  });

  it('chooses spaces by type, level or name, and all those shown at once', async () => {
    await choose('Space type', 'Office, open plan');
    await choose('Level', 'Level 2');
    expect(Array.from(element.querySelectorAll('.choices li')).map((item) => item.textContent?.replace(/\s+/g, ' ').trim())).toEqual([
      'Open office 1Office, open plan · Level 2',
      'Open office 2Office, open plan · Level 2',
    ]);
    checkbox('Select all shown').click();
    await fixture.whenStable();
    expect(element.textContent).toContain('2 spaces chosen');
    await choose('Level', 'Any level');
    await fill('Find spaces', 'office 3');
    checkbox('Open office 3').click();
    await fixture.whenStable();
    expect(element.textContent).toContain('3 spaces chosen');
    expect(element.querySelector('button[type="submit"]')?.textContent?.trim()).toBe('Record on 3 spaces');
  });

  it('records one provided control on every chosen space in one request, in the project units, and the store follows', async () => {
    checkbox('Select all shown').click();
    await choose('Control', 'Time-switch control');
    // An SI project reads the limit in m²: 5,000 ft² × 0.09290304 m²/ft² (exact) = 464.5 m².
    expect(element.textContent).toContain('At most 464.5 m² per device');
    expect(element.textContent).not.toContain('ft²');
    await fill('Device', 'Panel schedule');
    await fill('Zone size', '400');
    await submit();
    const request = http.expectOne((entry) => entry.method === 'POST' && entry.url === '/api/projects/p1/spaces/controls');
    expect(request.request.body).toEqual({
      spaces: spaces.map((entry) => ({ id: entry.id, version: 1 })),
      control: { strategy: 'time-switch', provided: true, device: 'Panel schedule', zoneSize: '400' },
    });
    const saved = spaces.map((entry) => ({ ...entry, version: 2, controls: [request.request.body.control] }));
    request.flush(saved);
    await fixture.whenStable();
    expect(store.spaces().map((entry) => [entry.id, entry.version, entry.controls.length])).toEqual(
      spaces.map((entry) => [entry.id, 2, 1]),
    );
    expect(element.querySelector('[data-testid="bulk-done"]')?.textContent).toContain(
      '“Time-switch control” recorded as provided on 4 spaces.',
    );
  });

  it('asks how far the lighting is reduced only for a control whose check reads it, bounded like the service', async () => {
    checkbox('Open office 1').click();
    await choose('Control', 'Time-switch control');
    const labelsShown = () => Array.from(element.querySelectorAll('mat-label')).map((label) => label.textContent?.trim());
    expect(labelsShown()).not.toContain('Reduces the lighting by (%)');
    await choose('Control', 'Automatic partial OFF');
    expect(labelsShown()).toContain('Reduces the lighting by (%)');
    // The service's range for a share of the lighting power (compliance/bounds.ts ranges.percent): 0 to 100.
    await fill('Reduces the lighting by', '120');
    await submit();
    http.expectNone('/api/projects/p1/spaces/controls');
    expect(element.textContent).toContain('Out of range. Enter a number from 0 to 100.');
    await fill('Reduces the lighting by', '50');
    await submit();
    const request = http.expectOne('/api/projects/p1/spaces/controls');
    expect(request.request.body.control).toEqual({ strategy: 'automatic-partial-off', provided: true, reductionPercent: '50' });
    request.flush([{ ...spaces[0], version: 2 }]);
  });

  it('neither checks nor sends a reduction once another control is chosen', async () => {
    checkbox('Open office 1').click();
    await choose('Control', 'Automatic partial OFF');
    await fill('Reduces the lighting by', '120');
    await choose('Control', 'Time-switch control');
    await submit();
    const request = http.expectOne('/api/projects/p1/spaces/controls');
    expect(request.request.body.control).toEqual({ strategy: 'time-switch', provided: true });
    request.flush([{ ...spaces[0], version: 2 }]);
  });

  it('records the same exception with its reason', async () => {
    checkbox('Open office 1').click();
    await choose('Control', 'Occupant sensor');
    Array.from(element.querySelectorAll<HTMLElement>('mat-radio-button'))
      .find((radio) => radio.textContent?.includes('Exception claimed'))!
      .querySelector<HTMLInputElement>('input')!
      .click();
    await fixture.whenStable();
    expect(element.textContent).not.toContain('Not provided');
    await choose('Exception', 'Another exception');
    await submit();
    http.expectNone('/api/projects/p1/spaces/controls');
    expect(element.textContent).toContain('Say which exception is claimed.');
    await fill('Note', 'Invented reason for the test');
    await submit();
    const request = http.expectOne('/api/projects/p1/spaces/controls');
    expect(request.request.body.control).toEqual({
      strategy: 'occupant-sensor',
      provided: false,
      exceptionReason: 'other',
      exceptionNote: 'Invented reason for the test',
    });
    request.flush([{ ...spaces[0], version: 2 }]);
  });

  it('offers continuous operation for the time switch, and puts the service’s refusal beside the field it names', async () => {
    checkbox('Open office 1').click();
    await choose('Control', 'Time-switch control');
    Array.from(element.querySelectorAll<HTMLElement>('mat-radio-button'))
      .find((radio) => radio.textContent?.includes('Exception claimed'))!
      .querySelector<HTMLInputElement>('input')!
      .click();
    await fixture.whenStable();
    await choose('Exception', 'Lighting intended to operate continuously');
    await submit();
    const request = http.expectOne('/api/projects/p1/spaces/controls');
    expect(request.request.body.control).toEqual({ strategy: 'time-switch', provided: false, exceptionReason: 'continuous-operation' });
    request.flush(
      {
        error: {
          code: 'validation_failed',
          message: 'The exception claimed is not complete.',
          details: [{ path: 'control.exceptionNote', message: 'Invented refusal for the test.' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const note = Array.from(element.querySelectorAll('mat-form-field')).find(
      (field) => field.querySelector('mat-label')?.textContent?.trim() === 'Note',
    )!;
    expect(note.querySelector('mat-error')?.textContent?.trim()).toBe('Invented refusal for the test.');

    // Chosen for another control, the reason is refused beside the field before anything is sent.
    await choose('Control', 'Occupant sensor');
    await submit();
    http.expectNone('/api/projects/p1/spaces/controls');
    expect(element.textContent).toContain('Continuous operation frees lighting from the time switch only.');
  });

  it('names the spaces someone changed meanwhile, records nothing, and reads the spaces again on Reload', async () => {
    checkbox('Select all shown').click();
    await choose('Control', 'Time-switch control');
    await submit();
    http.expectOne('/api/projects/p1/spaces/controls').flush(
      {
        error: {
          code: 'conflict',
          message: '1 of these spaces changed since you read them (Open office 3). Reload and apply the control again.',
          details: [{ path: 'spaces.2', message: '“Open office 3” changed since you read it.' }],
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    const stale = element.querySelector('[data-testid="bulk-stale"]')!;
    expect(stale.getAttribute('role')).toBe('alert');
    expect(stale.textContent).toContain('Nothing was recorded: this space was changed by someone else since you read it: Open office 3.');
    expect(store.spaces().every((entry) => entry.version === 1)).toBe(true);
    Array.from(stale.querySelectorAll('button'))
      .find((button) => button.textContent?.includes('Reload'))!
      .click();
    http
      .expectOne((entry) => entry.method === 'GET' && entry.url === '/api/projects/p1/spaces')
      .flush(spaces.map((entry) => (entry.id === 'o3' ? { ...entry, version: 3 } : entry)));
    await fixture.whenStable();
    expect(store.spaces().find((entry) => entry.id === 'o3')?.version).toBe(3);
    expect(element.querySelector('[data-testid="bulk-stale"]')).toBeNull();
    // The choice stays, so the next try sends the fresh version.
    await submit();
    expect(http.expectOne('/api/projects/p1/spaces/controls').request.body.spaces[2]).toEqual({ id: 'o3', version: 3 });
  });
});
