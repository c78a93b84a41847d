import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { CutSheet } from '../../../../../contract/cut-sheets';
import type { LuminaireTypeRecord, ProjectDetail, SpaceRecord } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { LuminairesPage } from './luminaires-page';

// Invented project and luminaire types.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 1,
  members: [],
  archivedAt: null,
} as unknown as ProjectDetail;
const stamp = { version: 2, updatedAt: '', updatedBy: null };
const types: LuminaireTypeRecord[] = [
  { id: 't1', tag: 'A', description: '2×4 troffer', inputWatts: '30', use: 'general', basis: 'rated', ...stamp },
  { id: 't2', tag: 'B', description: 'Strip', inputWatts: '20', use: 'general', basis: 'rated', ...stamp },
  {
    id: 't3',
    tag: 'H',
    description: 'High-bay',
    inputWatts: '151.46',
    use: 'general',
    basis: 'rated',
    manufacturer: 'Invented Lighting Co.',
    catalogNumber: 'HB-150-40K',
    lightSource: 'LED, 4000 K',
    driver: '0–10 V dimming',
    voltage: '120–277 V',
    ...stamp,
  },
];
// An invented apparatus bay with ten high-bays not yet assigned to a daylight zone.
const bay: SpaceRecord = {
  id: 's1',
  name: 'Apparatus bay',
  position: 1,
  area: '3000',
  spaceType: 'emergency-vehicle-garage',
  luminaires: [{ tag: 'H', count: '10', luminaireTypeId: 't3' }],
  controls: [],
  windows: [],
  skylights: [{ length: '4', width: '4' }],
  ...stamp,
};

describe('LuminairesPage', () => {
  let fixture: ComponentFixture<LuminairesPage>;
  let http: HttpTestingController;
  let store: ProjectStore;
  let element: HTMLElement;
  let cutSheetsRead: TestRequest;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [LuminairesPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    vi.spyOn(store, 'refreshResults').mockImplementation(() => undefined);
    store.seed({ project });
    store.seed({ luminaireTypes: types });
    store.seed({ spaces: [bay] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(LuminairesPage);
    element = fixture.nativeElement as HTMLElement;
    TestBed.tick();
    cutSheetsRead = http.expectOne('/api/projects/p1/cut-sheets');
  });

  /** Answers the page's reading of the cut sheets on file (none unless given) and lets it settle. */
  async function answerCutSheets(sheets: CutSheet[] = []): Promise<void> {
    cutSheetsRead.flush(sheets);
    await fixture.whenStable();
  }

  const snackBar = () => document.querySelector('.mat-mdc-snack-bar-container');

  it('deletes a luminaire type at once and brings it back with its id on Undo', async () => {
    await answerCutSheets();
    element.querySelector<HTMLButtonElement>('button[aria-label="Delete type A"]')!.click();
    const deletion = http.expectOne((request) => request.method === 'DELETE' && request.url === '/api/projects/p1/luminaire-types/t1');
    expect(deletion.request.params.get('version')).toBe('2');
    deletion.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(store.luminaireTypes().map((type) => type.tag)).toEqual(['B', 'H']);
    expect(snackBar()?.textContent).toContain('Luminaire type “A” deleted');

    Array.from(snackBar()!.querySelectorAll<HTMLButtonElement>('button'))
      .find((button) => button.textContent?.includes('Undo'))!
      .click();
    http.expectNone((request) => request.method === 'POST' && request.url === '/api/projects/p1/luminaire-types');
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/luminaire-types/t1/restore')
      .flush(types[0]!, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(store.luminaireTypes().map((type) => type.id)).toEqual(['t1', 't2', 't3']);
  });

  it('says a deleted type’s cut sheet went with it, and that Undo brings the type back without it', async () => {
    await answerCutSheets([
      {
        luminaireTypeId: 't1',
        fileName: 'A data.pdf',
        size: 1000,
        sha256: 'b'.repeat(64),
        uploadedAt: '2026-11-01T10:00:00Z',
        uploadedBy: 'Invented Engineer',
        url: '/api/projects/p1/luminaire-types/t1/cut-sheet',
      },
    ]);
    element.querySelector<HTMLButtonElement>('button[aria-label="Delete type A"]')!.click();
    http
      .expectOne((request) => request.method === 'DELETE' && request.url === '/api/projects/p1/luminaire-types/t1')
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(snackBar()?.textContent).toContain('Luminaire type “A” deleted, with its cut sheet');
    Array.from(snackBar()!.querySelectorAll<HTMLButtonElement>('button'))
      .find((button) => button.textContent?.includes('Undo'))!
      .click();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/luminaire-types/t1/restore')
      .flush(types[0]!, { status: 201, statusText: 'Created' });
    // The cut sheets are read again (the page waits on that request, so it is answered first).
    TestBed.tick();
    http.expectOne('/api/projects/p1/cut-sheets').flush([]);
    await fixture.whenStable();
    // The snackbar of the deletion gives way to this one.
    await expect
      .poll(async () => (await fixture.whenStable(), document.body.textContent))
      .toContain('Type “A” is back without its cut sheet: upload the cut sheet again.');
    expect(element.querySelector('a[aria-label^="Download the cut sheet of type A"]')).toBeNull();
  });

  it('says why a type still counted in spaces is kept, with no offer to reload', async () => {
    await answerCutSheets();
    element.querySelector<HTMLButtonElement>('button[aria-label="Delete type B"]')!.click();
    http
      .expectOne((request) => request.url === '/api/projects/p1/luminaire-types/t2')
      .flush(
        { error: { code: 'in_use', message: 'This luminaire type is still counted in 1 space(s): Exam 1. Remove those counts first.' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    expect(snackBar()?.textContent).toContain('still counted in 1 space(s): Exam 1');
    expect(snackBar()?.textContent).not.toContain('Reload');
    expect(store.luminaireTypes().map((type) => type.tag)).toEqual(['A', 'B', 'H']);
  });

  it('lists the schedule with rated input to 0.1 W and the product columns, and each type’s cut sheet', async () => {
    await answerCutSheets([
      {
        luminaireTypeId: 't3',
        fileName: 'High-bay data.pdf',
        size: 1200,
        sha256: 'a'.repeat(64),
        uploadedAt: '2026-11-20T15:30:00Z',
        uploadedBy: 'Invented Engineer',
        url: '/api/projects/p1/luminaire-types/t3/cut-sheet',
      },
    ]);
    const row = Array.from(element.querySelectorAll('tr')).find((candidate) => candidate.textContent?.includes('High-bay'))!;
    const cells = Array.from(row.querySelectorAll('td')).map((cell) => cell.textContent?.trim());
    expect(cells).toContain('151.5');
    expect(row.textContent).toContain('Invented Lighting Co.');
    expect(row.textContent).toContain('HB-150-40K');
    expect(row.textContent).toContain('LED, 4000 K');
    expect(row.textContent).toContain('0–10 V dimming');
    expect(row.textContent).toContain('120–277 V');
    const headers = Array.from(element.querySelectorAll('th')).map((header) => header.textContent?.trim());
    expect(headers).toEqual(expect.arrayContaining(['Product', 'Light source and driver', 'Rated input (W)']));
    const link = row.querySelector<HTMLAnchorElement>('td.cut-sheet a')!;
    expect(link.getAttribute('href')).toBe('/api/projects/p1/luminaire-types/t3/cut-sheet');
    expect(link.getAttribute('aria-label')).toBe('Download the cut sheet of type H: High-bay data.pdf');
    const other = Array.from(element.querySelectorAll('tr')).find((candidate) => candidate.textContent?.includes('Strip'))!;
    expect(other.querySelector('td.cut-sheet')?.textContent?.trim()).toBe('None on file');
    expect(headers).toContain('Cut sheet');
  });

  it('gives a reviewer the cut sheet links too, and says so in words when the list cannot be read', async () => {
    store.seed({ project: { ...project, role: 'reviewer' } });
    cutSheetsRead.flush({ error: { code: 'unavailable', message: 'down' } }, { status: 503, statusText: 'Unavailable' });
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The cut sheets on file could not be read.');
    expect(element.querySelector('button[aria-label="Delete type A"]')).toBeNull();
  });

  it('saves a daylight-zone split from the counts panel through the service and stays on the Counts tab', async () => {
    await answerCutSheets();
    fixture.componentRef.setInput('tab', 'counts');
    fixture.componentRef.setInput('space', 's1');
    await fixture.whenStable();
    const panel = element.querySelector<HTMLElement>('al-space-counts')!;
    expect(panel.querySelector('h3')?.textContent).toContain('Apparatus bay');

    panel.querySelector<HTMLElement>('mat-select[formcontrolname="zone"] .mat-mdc-select-trigger')!.click();
    await fixture.whenStable();
    Array.from(document.querySelectorAll<HTMLElement>('.cdk-overlay-container mat-option'))
      .find((option) => option.textContent?.trim() === 'Toplit')!
      .click();
    await fixture.whenStable();
    const save = Array.from(panel.querySelectorAll<HTMLButtonElement>('button')).find((button) =>
      button.textContent?.includes('Save counts'),
    )!;
    expect(save.disabled).toBe(false);
    const submitted = new Promise<SubmitEvent>((resolve) =>
      panel.querySelector('form')!.addEventListener('submit', (event) => resolve(event as SubmitEvent), { once: true }),
    );
    save.click();
    // The form is the app's, not the browser's: no page load.
    expect((await submitted).defaultPrevented).toBe(true);

    const patch = http.expectOne((request) => request.method === 'PATCH' && request.url === '/api/projects/p1/spaces/s1');
    expect(patch.request.body).toEqual({ luminaires: [{ tag: 'H', count: '10', zone: 'toplit' }], version: 2 });
    patch.flush({ ...bay, version: 3, luminaires: [{ tag: 'H', count: '10', zone: 'toplit', luminaireTypeId: 't3' }] });
    await fixture.whenStable();
    expect(store.spaces()[0]!.luminaires[0]!.zone).toBe('toplit');
    expect(element.querySelector('[role="tab"][aria-selected="true"]')?.textContent).toContain('Counts');
    expect(element.querySelector('al-space-counts')).not.toBeNull();
  });
});
