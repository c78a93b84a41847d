import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ComparisonSummary, EditionComparison, ProjectComparison, ProjectDetail } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { libraryAnnex } from '../../../testing/demo-building';
import { evaluated } from '../../../testing/evaluate';
import { ComparePage } from './compare-page';

// An invented project and invented figures.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'draft',
  role: 'reviewer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'si',
  version: 3,
  members: [],
  archivedAt: null,
} as unknown as ProjectDetail;

const summary: ComparisonSummary = {
  verdict: 'complies',
  units: 'si',
  area: '1161.29',
  allowanceW: '10250',
  installedW: '8400',
  marginW: '1850',
  marginPct: '18.05',
  allowanceLpd: '8.827',
  installedLpd: '7.233',
  interiorComplies: true,
  exterior: null,
  controls: { met: 12, notMet: 0, toVerify: 0 },
  open: [],
  unverifiedValues: 2,
};

const own: EditionComparison = {
  edition: 'iecc-2021',
  title: 'International Energy Conservation Code 2021 (commercial)',
  status: 'evaluated',
  unmapped: [],
  remapped: [],
  controlsNotCarried: [],
  controlChanges: [],
  problems: [],
  result: summary,
};
const body: ProjectComparison = {
  current: own,
  editions: [
    {
      ...own,
      edition: 'ashrae-90.1-2019',
      title: 'ANSI/ASHRAE/IES Standard 90.1-2019',
      result: { ...summary, allowanceW: '8000', marginW: '-400', marginPct: '-5', interiorComplies: false, verdict: 'does-not-comply' },
    },
  ],
  cautions: ['Energy-code compliance only: an invented caution.'],
};

describe('ComparePage', () => {
  let fixture: ComponentFixture<ComparePage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [ComparePage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    const store = TestBed.inject(ProjectStore);
    // The page compares once the project's own results are in; it reads none of their figures, so any result will do:
    // the invented library annex of testing/demo-building.ts, evaluated by the engine.
    store.seed({ project, results: { status: 'ready', result: evaluated(libraryAnnex()) } });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ComparePage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const text = (selector: string) =>
    Array.from(element.querySelectorAll(selector)).map((node) => node.textContent?.replace(/\s+/g, ' ').trim());

  it('lays out one column per edition, the project’s own first and marked, with its cautions', async () => {
    expect(element.textContent).toContain('Evaluating the design under every edition');
    http.expectOne('/api/projects/p1/comparison').flush(body);
    await fixture.whenStable();
    expect(text('[data-testid="edition-column"] h3')).toEqual(['IECC 2021', '90.1-2019']);
    expect(element.querySelectorAll('[data-testid="own-edition"]').length).toBe(1);
    expect(element.querySelector('[data-edition="iecc-2021"] [data-testid="own-edition"]')).not.toBeNull();
    expect(text('[data-figure="interior-margin-words"]')).toEqual(['within allowance, 1,850 W to spare', 'over by 400 W']);
    expect(text('[data-figure="area"]')).toEqual(['1,161.3 m²', '1,161.3 m²']);
    expect(text('[data-figure="allowance-density"]')[0]).toBe('8.83 W/m²');
    // No exterior in the design: no exterior figures at all.
    expect(element.querySelector('[data-figure="exterior-allowance"]')).toBeNull();
    expect(element.querySelector('al-cautions-banner')?.textContent).toContain('an invented caution');
    expect(element.querySelectorAll('al-verify-badge').length).toBe(2);
  });

  it('says the editions cannot be compared while the design cannot be evaluated, and leads to Results', async () => {
    http.expectOne('/api/projects/p1/comparison').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'The results cannot be computed until the problems below are fixed.',
          details: [{ path: 'spaces.0.area', message: 'Give the floor area.' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    const problem = element.querySelector('[data-testid="compare-problem"]');
    expect(problem?.textContent).toContain('The editions cannot be compared yet');
    expect(problem?.querySelector('a')?.getAttribute('href')).toMatch(/results$/);
    expect(element.querySelector('[data-testid="edition-column"]')).toBeNull();
  });
});
