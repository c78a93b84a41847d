import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { ProjectSummary } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectsPage } from './projects-page';

// Invented demo projects.
const projects: ProjectSummary[] = [
  {
    id: 'p1',
    name: 'Cedar Hall',
    state: 'draft',
    role: 'engineer',
    edition: 'iecc-2021',
    method: 'space-by-space',
    version: 1,
    revision: 1,
    updatedAt: '2026-03-01T10:00:00Z',
    resultSummary: null,
    fieldTests: null,
    archivedAt: null,
  },
  {
    id: 'p2',
    name: 'Alder Bay Library',
    state: 'in-review',
    role: 'reviewer',
    edition: 'iecc-2021',
    method: 'space-by-space',
    version: 3,
    revision: 1,
    updatedAt: '2026-03-02T10:00:00Z',
    resultSummary: null,
    fieldTests: null,
    archivedAt: null,
  },
  {
    id: 'p3',
    name: 'Birch Annex',
    state: 'accepted',
    role: 'engineer',
    edition: 'ashrae-90.1-2019',
    method: 'building-area',
    version: 2,
    revision: 1,
    updatedAt: '2026-03-03T10:00:00Z',
    resultSummary: null,
    fieldTests: null,
    archivedAt: null,
  },
];

describe('ProjectsPage', () => {
  let fixture: ComponentFixture<ProjectsPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function render(list: ProjectSummary[]): Promise<void> {
    TestBed.configureTestingModule({
      imports: [ProjectsPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        // The confirm dialog closes at once, so what its answer starts can be checked straight after.
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    fixture = TestBed.createComponent(ProjectsPage);
    http = TestBed.inject(HttpTestingController);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/projects').flush(list);
    await fixture.whenStable();
  }

  beforeEach(() => render(projects));

  const names = () => Array.from(element.querySelectorAll('.project-link')).map((link) => link.textContent?.trim());

  it('lists projects sorted by name with their state, and fetches each verdict', async () => {
    expect(names()).toEqual(['Alder Bay Library', 'Birch Annex', 'Cedar Hall']);
    expect(element.textContent).toContain('In review');
    const pending = http.match((request) => request.url.endsWith('/results'));
    expect(pending.length).toBe(3);
    pending
      .find((request) => request.request.url.includes('p1'))!
      .flush({ complies: true, verdict: 'complies', interior: { marginPct: '12.345' } });
    pending
      .find((request) => request.request.url.includes('p2'))!
      .flush({ complies: false, verdict: 'does-not-comply', interior: { marginPct: '-4.2' } });
    pending
      .find((request) => request.request.url.includes('p3'))!
      .flush(
        { error: { code: 'validation_failed', message: 'At least one space is needed.' } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    const text = element.textContent ?? '';
    expect(text).toContain('12.3');
    expect(text).toContain('-4.2');
    expect(text).toContain('Complies');
    expect(text).toContain('Does not comply');
    expect(text).toContain('Design incomplete');
    expect(element.querySelectorAll('.verdict mat-icon').length).toBe(3);
  });

  it('names the older and the newer code editions by their short names', async () => {
    TestBed.resetTestingModule();
    const editions = ['ashrae-90.1-2013', 'ashrae-90.1-2016', 'iecc-2018', 'iecc-2024'] as const;
    await render(editions.map((edition, index) => ({ ...projects[0]!, id: `e${index}`, name: `Project ${index}`, edition })));
    const cells = Array.from(element.querySelectorAll('td.mat-column-edition')).map((cell) => cell.textContent?.trim());
    expect(cells).toEqual(['90.1-2013', '90.1-2016', 'IECC 2018', 'IECC 2024']);
  });

  it('shows a kept verdict without evaluating that project again', async () => {
    TestBed.resetTestingModule();
    await render([{ ...projects[0]!, resultSummary: { complies: true, marginPct: '7.25', dataVersion: 'v1' } }]);
    const pending = http.match((request) => request.url.endsWith('/results'));
    expect(pending.length).toBe(0);
    expect(element.textContent).toContain('7.3');
    expect(element.textContent).toContain('Complies');
  });

  it('says under the state where the field tests stand, and finds “testing complete” by the filter', async () => {
    TestBed.resetTestingModule();
    await render([
      {
        ...projects[0]!,
        fieldTests: { required: 8, passed: 8, failed: 0, untested: 0, complete: true, completedAt: '2026-11-20T15:30:00Z' },
      },
      { ...projects[1]!, fieldTests: { required: 8, passed: 3, failed: 2, untested: 3, complete: false, completedAt: null } },
      projects[2]!,
    ]);
    http.match(() => true).forEach((request) => request.flush({ complies: true, verdict: 'complies', interior: { marginPct: '1' } }));
    await fixture.whenStable();
    const shown = () => Array.from(element.querySelectorAll('[data-testid="project-field-tests"]')).map((cell) => cell.textContent?.trim());
    // Sorted by name: Alder Bay Library (the second), then Cedar Hall (the first).
    expect(shown()).toEqual(['fact_checkField tests: 3 of 8 passed, 2 failed', 'task_altTesting complete']);
    const filter = element.querySelector<HTMLInputElement>('input[matInput]')!;
    filter.value = 'testing complete';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(names()).toEqual(['Cedar Hall']);
  });

  it('sorts by a column header and filters by text', async () => {
    http.match(() => true).forEach((request) => request.flush({ complies: true, verdict: 'complies', interior: { marginPct: '1' } }));
    const nameHeader = Array.from(element.querySelectorAll<HTMLElement>('th')).find((th) => th.textContent?.includes('Project'))!;
    nameHeader.querySelector<HTMLElement>('.mat-sort-header-container')!.click();
    await fixture.whenStable();
    expect(names()).toEqual(['Cedar Hall', 'Birch Annex', 'Alder Bay Library']);

    const filter = element.querySelector<HTMLInputElement>('input[matInput]')!;
    filter.value = '90.1';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(names()).toEqual(['Birch Annex']);

    filter.value = 'nothing like this';
    filter.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(element.textContent).toContain('No project matches');
  });

  it('archives a project the user engineers after a confirm dialog, and lists archived projects with Unarchive', async () => {
    http
      .match((request) => request.url.endsWith('/results'))
      .forEach((request) => request.flush({ complies: true, verdict: 'complies', interior: { marginPct: '1' } }));
    await fixture.whenStable();
    // A reviewer on the project may not archive it.
    expect(element.querySelector('button[aria-label="Archive Alder Bay Library"]')).toBeNull();

    const dialogButton = (text: string) =>
      Array.from(document.querySelectorAll<HTMLButtonElement>('mat-dialog-container button')).find(
        (button) => button.textContent?.trim() === text,
      );
    element.querySelector<HTMLButtonElement>('button[aria-label="Archive Cedar Hall"]')!.click();
    await fixture.whenStable();
    expect(document.querySelector('mat-dialog-container')?.textContent).toContain('Archive “Cedar Hall”?');
    dialogButton('Cancel')!.click();
    await fixture.whenStable();
    http.expectNone((request) => request.url.endsWith('/archive'));

    element.querySelector<HTMLButtonElement>('button[aria-label="Archive Cedar Hall"]')!.click();
    await fixture.whenStable();
    dialogButton('Archive')!.click();
    await fixture.whenStable();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/archive')
      .flush({ ...projects[0], archivedAt: '2026-03-04T10:00:00Z', members: [] });
    await fixture.whenStable();
    http.expectOne('/api/projects').flush([projects[1], projects[2]]);
    await fixture.whenStable();
    expect(names()).toEqual(['Alder Bay Library', 'Birch Annex']);
    expect(document.querySelector('.mat-mdc-snack-bar-container')?.textContent).toContain('“Cedar Hall” archived');

    element.querySelector<HTMLButtonElement>('mat-slide-toggle button')!.click();
    await fixture.whenStable();
    const archived = http.expectOne((request) => request.url === '/api/projects' && request.params.get('archived') === 'true');
    archived.flush([{ ...projects[0]!, archivedAt: '2026-03-04T10:00:00Z' }]);
    await fixture.whenStable();
    expect(names()).toEqual(['Cedar Hall']);
    expect(element.querySelector('table')?.getAttribute('aria-label')).toBe('Your archived projects');
    element.querySelector<HTMLButtonElement>('button[aria-label="Unarchive Cedar Hall"]')!.click();
    http
      .expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/unarchive')
      .flush({ ...projects[0], members: [] });
    await fixture.whenStable();
    http.expectOne((request) => request.url === '/api/projects' && request.params.get('archived') === 'true').flush([]);
    await fixture.whenStable();
    expect(element.textContent).toContain('No archived projects.');
  });
});
