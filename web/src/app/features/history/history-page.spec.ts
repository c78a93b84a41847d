import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDatepickerInputHarness } from '@angular/material/datepicker/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import type { HistoryEntry, HistoryPage as HistoryPageBody, ProjectDetail, SpaceRecord } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { HistoryPage } from './history-page';

// Invented project, people and spaces.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 4,
  members: [],
  archivedAt: null,
} as unknown as ProjectDetail;
const ines = { id: 'u1', name: 'Ines Halvorsen' };
const dario = { id: 'u2', name: 'Dario Quint' };

function space(id: string, name: string, area: string): SpaceRecord {
  return {
    id,
    name,
    level: 'Level 1',
    position: 1,
    area,
    spaceType: 'office-enclosed',
    luminaires: [],
    controls: [],
    windows: [],
    skylights: [],
    version: 1,
    updatedAt: '',
    updatedBy: null,
  };
}

const exam1 = space('s1', 'Exam 1', '120');
const exam3 = space('s9', 'Exam 3', '90');

const entries: HistoryEntry[] = [
  {
    id: '42',
    at: '2026-03-02T10:20:00Z',
    user: ines,
    action: 'delete',
    entity: 'space',
    entityId: 's9',
    name: 'Exam 3',
    before: exam3,
    after: null,
    restorable: true,
  },
  {
    id: '41',
    at: '2026-03-02T10:15:00Z',
    user: ines,
    action: 'update',
    entity: 'space',
    entityId: 's1',
    name: 'Exam 1',
    before: exam1,
    after: { ...exam1, area: '150', version: 2 },
    restorable: false,
  },
];

describe('HistoryPage', () => {
  let fixture: ComponentFixture<HistoryPage>;
  let http: HttpTestingController;
  let store: ProjectStore;
  let loader: HarnessLoader;
  let element: HTMLElement;

  const historyRequest = () => http.expectOne((request) => request.method === 'GET' && request.url === '/api/projects/p1/history');
  const query = (request: TestRequest) =>
    Object.fromEntries(request.request.params.keys().map((key) => [key, request.request.params.get(key)]));
  const page = (body: Partial<HistoryPageBody> = {}): HistoryPageBody => ({ entries, more: true, people: [dario, ines], ...body });

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [HistoryPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    // The results a change asks for are the store's business, not this page's.
    vi.spyOn(store, 'refreshResults').mockImplementation(() => undefined);
    store.seed({ project });
    store.seed({ spaces: [{ ...exam1, area: '150', version: 2 }] });
    store.seed({
      tables: {
        spaceTypes: [{ key: 'office-enclosed', label: 'Office — Enclosed' }] as never,
        buildingAreaTypes: [],
        controlStrategies: [],
        exteriorApplications: [],
        lightingZones: [],
      },
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(HistoryPage);
    element = fixture.nativeElement as HTMLElement;
    loader = TestbedHarnessEnvironment.loader(fixture);
    await fixture.whenStable();
    http.expectOne('/api/code-editions').flush([{ id: 'iecc-2021', title: 'IECC 2021' }]);
    const first = historyRequest();
    expect(query(first)).toEqual({ limit: '50' });
    first.flush(page());
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  it('lists each entry as a sentence with its time, and offers Restore on a delete to the engineer only', async () => {
    const text = element.textContent?.replace(/\s+/g, ' ') ?? '';
    expect(text).toContain('Ines Halvorsen changed space “Exam 1”: floor area 120 → 150 ft²');
    expect(text).toContain('Ines Halvorsen deleted space “Exam 3” (Level 1, 90 ft², Office — Enclosed)');
    expect(text).toMatch(/Mar 2, 2026/);
    expect(element.querySelector('button[aria-label="Restore space “Exam 3”"]')).not.toBeNull();
    expect(element.querySelectorAll('.restore').length).toBe(1);

    store.seed({ project: { ...project, role: 'reviewer' } });
    await fixture.whenStable();
    expect(element.querySelector('.restore')).toBeNull();
    expect(element.textContent).toContain('Ines Halvorsen changed space “Exam 1”');

    store.seed({ project: { ...project, archivedAt: '2026-03-03T08:00:00Z' } });
    await fixture.whenStable();
    expect(element.querySelector('.restore')).toBeNull();
  });

  it('asks the service with each filter, and for older entries before the last one shown', async () => {
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Dario Quint' });
    let request = historyRequest();
    expect(query(request)).toEqual({ limit: '50', userId: 'u2' });
    request.flush(page({ entries: [], more: false }));
    await fixture.whenStable();
    expect(element.textContent).toContain('No change matches these filters');

    await (await loader.getHarness(MatDatepickerInputHarness)).setValue('3/1/2026');
    await (await loader.getHarness(MatDatepickerInputHarness)).blur();
    request = historyRequest();
    expect(query(request)).toEqual({ limit: '50', userId: 'u2', since: '2026-03-01' });
    request.flush(page());
    await fixture.whenStable();

    // A deleted space is offered by the name the history knows it by.
    const spaceFilter = await loader.getHarness(MatAutocompleteHarness);
    await spaceFilter.enterText('Exam');
    const options = await spaceFilter.getOptions();
    expect(await Promise.all(options.map((option) => option.getText()))).toEqual(['Exam 1', 'Exam 3 (deleted)']);
    await spaceFilter.selectOption({ text: 'Exam 3 (deleted)' });
    request = historyRequest();
    expect(query(request)).toEqual({ limit: '50', userId: 'u2', since: '2026-03-01', spaceId: 's9' });
    request.flush(page());
    await fixture.whenStable();

    await (await loader.getHarness(MatButtonHarness.with({ text: /Show older/ }))).click();
    request = historyRequest();
    expect(query(request)).toEqual({ limit: '50', userId: 'u2', since: '2026-03-01', spaceId: 's9', before: '41' });
    request.flush(page({ entries: [{ ...entries[1]!, id: '7', at: '2026-02-20T09:00:00Z' }], more: false }));
    await fixture.whenStable();
    expect(element.querySelectorAll('.entry').length).toBe(3);
    expect(element.textContent).not.toContain('Show older');

    await (await loader.getHarness(MatButtonHarness.with({ text: /Clear filters/ }))).click();
    request = historyRequest();
    expect(query(request)).toEqual({ limit: '50' });
    request.flush(page());
  });

  it('restores a deleted space through its restore route, puts it back in the store and reads the history again', async () => {
    element.querySelector<HTMLButtonElement>('button[aria-label="Restore space “Exam 3”"]')!.click();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/spaces/s9/restore')
      .flush(exam3, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(store.spaces().map((kept) => kept.id)).toEqual(['s1', 's9']);
    expect(document.querySelector('.mat-mdc-snack-bar-container')?.textContent).toContain('Space “Exam 3” restored');
    const again = historyRequest();
    expect(query(again)).toEqual({ limit: '50' });
    const restored: HistoryEntry = {
      id: '43',
      at: '2026-03-02T10:25:00Z',
      user: ines,
      action: 'restore',
      entity: 'space',
      entityId: 's9',
      name: 'Exam 3',
      before: null,
      after: exam3,
      restorable: false,
    };
    again.flush(page({ entries: [restored, { ...entries[0]!, restorable: false }] }));
    await fixture.whenStable();
    expect(element.textContent).toContain('Ines Halvorsen restored space “Exam 3”');
    expect(element.querySelector('.restore')).toBeNull();
    expect(store.refreshResults).toHaveBeenCalled();
  });

  it('restores a removed allowance claim through its restore route, and the results count it again', async () => {
    const claim = { id: 'c4', spaceId: 's1', allowance: 'retail-area-3', area: '800', version: 2, updatedAt: '', updatedBy: null };
    const removed: HistoryEntry = {
      id: '44',
      at: '2026-03-02T10:30:00Z',
      user: ines,
      action: 'delete',
      entity: 'additional-allowance',
      entityId: 'c4',
      name: 'Exam 1',
      before: claim,
      after: null,
      restorable: true,
    };
    // Ines's changes, the claim's removal among them.
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Ines Halvorsen' });
    historyRequest().flush(page({ entries: [removed, ...entries], more: false }));
    await fixture.whenStable();
    expect(element.textContent).toContain('Ines Halvorsen removed an additional allowance claimed on “Exam 1” for 800 ft²');
    element.querySelector<HTMLButtonElement>('button[aria-label="Restore the claim on “Exam 1”"]')!.click();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/additional-allowances/c4/restore')
      .flush({ ...claim, version: 3 }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(document.querySelector('.mat-mdc-snack-bar-container')?.textContent).toContain('The claim on “Exam 1” restored');
    expect(store.refreshResults).toHaveBeenCalled();
    historyRequest().flush(
      page({
        more: false,
        entries: [
          { ...removed, id: '45', action: 'restore', before: null, after: { ...claim, version: 3 }, restorable: false },
          { ...removed, restorable: false },
        ],
      }),
    );
    await fixture.whenStable();
    expect(element.textContent).toContain('Ines Halvorsen restored an additional allowance claimed on “Exam 1” for 800 ft²');
    expect(element.querySelector('.restore')).toBeNull();
  });

  it('says in words when the restore is refused', async () => {
    element.querySelector<HTMLButtonElement>('button[aria-label="Restore space “Exam 3”"]')!.click();
    http
      .expectOne((request) => request.url === '/api/projects/p1/spaces/s9/restore')
      .flush(
        { error: { code: 'not_restorable', message: '“Exam 3” counted luminaire types that no longer exist; restore or add them first.' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    expect(document.querySelector('.mat-mdc-snack-bar-container')?.textContent).toContain('counted luminaire types that no longer exist');
    expect(store.spaces().map((kept) => kept.id)).toEqual(['s1']);
  });
});
