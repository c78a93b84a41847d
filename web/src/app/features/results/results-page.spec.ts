import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ProjectDetail } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { libraryAnnex } from '../../../testing/demo-building';
import { evaluated } from '../../../testing/evaluate';
import { ResultsPage } from './results-page';

// Invented project.
const project = {
  id: 'p1',
  name: 'Tacoma annex',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 1,
  members: [],
  amendments: [],
} as unknown as ProjectDetail;

// The invented library annex (testing/demo-building.ts), evaluated under the model code alone.
const result = evaluated(libraryAnnex());

describe('ResultsPage', () => {
  let fixture: ComponentFixture<ResultsPage>;
  let store: ProjectStore;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [ResultsPage],
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        provideRouter([]),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    store.seed({ project });
    store.seed({ results: { status: 'ready', result } });
    fixture = TestBed.createComponent(ResultsPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const basis = () => element.querySelector('[data-testid="results-amendments"]')?.textContent?.replace(/\s+/g, ' ').trim();

  it('says the model code alone applies when the result carries no amendment', () => {
    expect(result.amendments).toEqual([]);
    expect(basis()).toBe('gavel Model code only: no jurisdiction amendment is applied.');
  });

  it('names each jurisdiction amendment the result applied, by its title', async () => {
    // Override on the engine's result: the calculation tests' editions carry no jurisdiction amendment, so the engine
    // cannot apply one here; the list of amendments applied is set by hand. The title as reference/iecc-2021/amendments.json
    // holds it (Washington State Energy Code 2021).
    const amended = {
      ...result,
      amendments: [{ key: 'washington-2021', title: "Washington State Energy Code 2021 (Washington's amendments to IECC 2021)" }],
    };
    store.seed({ results: { status: 'ready', result: amended } });
    await fixture.whenStable();
    expect(basis()).toBe(
      "gavel Jurisdiction amendment applied over the model code: Washington State Energy Code 2021 (Washington's amendments to IECC 2021).",
    );
    expect(basis()).not.toContain('washington-2021');
  });
});
