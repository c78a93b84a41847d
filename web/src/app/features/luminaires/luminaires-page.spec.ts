import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { LuminaireTypeRecord, ProjectDetail } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { LuminairesPage } from './luminaires-page';

// Invented project and luminaire types.
const project = { id: 'p1', name: 'Harbour Pavilion', state: 'draft', role: 'engineer', edition: 'iecc-2021', method: 'space-by-space', units: 'ip', version: 1, members: [], archivedAt: null } as unknown as ProjectDetail;
const stamp = { version: 2, updatedAt: '', updatedBy: null };
const types: LuminaireTypeRecord[] = [
  { id: 't1', tag: 'A', description: '2×4 troffer', inputWatts: '30', use: 'general', basis: 'rated', ...stamp },
  { id: 't2', tag: 'B', description: 'Strip', inputWatts: '20', use: 'general', basis: 'rated', ...stamp },
];

describe('LuminairesPage', () => {
  let fixture: ComponentFixture<LuminairesPage>;
  let http: HttpTestingController;
  let store: ProjectStore;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [LuminairesPage],
      providers: [provideZonelessChangeDetection(), provideRouter([]), provideHttpClient(withInterceptors([apiInterceptor])), provideHttpClientTesting(), ProjectStore],
    });
    store = TestBed.inject(ProjectStore);
    vi.spyOn(store, 'refreshResults').mockImplementation(() => undefined);
    store.project.set(project);
    store.luminaireTypes.set(types);
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(LuminairesPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const snackBar = () => document.querySelector('.mat-mdc-snack-bar-container');

  it('deletes a luminaire type at once and brings it back with its id on Undo', async () => {
    element.querySelector<HTMLButtonElement>('button[aria-label="Delete type A"]')!.click();
    const deletion = http.expectOne((request) => request.method === 'DELETE' && request.url === '/api/projects/p1/luminaire-types/t1');
    expect(deletion.request.params.get('version')).toBe('2');
    deletion.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(store.luminaireTypes().map((type) => type.tag)).toEqual(['B']);
    expect(snackBar()?.textContent).toContain('Luminaire type “A” deleted');

    Array.from(snackBar()!.querySelectorAll<HTMLButtonElement>('button')).find((button) => button.textContent?.includes('Undo'))!.click();
    http.expectNone((request) => request.method === 'POST' && request.url === '/api/projects/p1/luminaire-types');
    http.expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/luminaire-types/t1/restore').flush(types[0], { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(store.luminaireTypes().map((type) => type.id)).toEqual(['t1', 't2']);
  });

  it('says why a type still counted in spaces is kept, with no offer to reload', async () => {
    element.querySelector<HTMLButtonElement>('button[aria-label="Delete type B"]')!.click();
    http
      .expectOne((request) => request.url === '/api/projects/p1/luminaire-types/t2')
      .flush({ error: { code: 'in_use', message: 'This luminaire type is still counted in 1 space(s): Exam 1. Remove those counts first.' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(snackBar()?.textContent).toContain('still counted in 1 space(s): Exam 1');
    expect(snackBar()?.textContent).not.toContain('Reload');
    expect(store.luminaireTypes().map((type) => type.tag)).toEqual(['A', 'B']);
  });
});
