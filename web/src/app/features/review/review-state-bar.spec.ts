import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { reviewProject } from '../../../testing/review-items';
import type { ProjectDetail } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { ReviewStateBar } from './review-state-bar';

describe('ReviewStateBar', () => {
  let fixture: ComponentFixture<ReviewStateBar>;
  let http: HttpTestingController;
  let store: ProjectStore;
  let element: HTMLElement;

  async function open(project: Partial<ProjectDetail>): Promise<void> {
    TestBed.configureTestingModule({
      imports: [ReviewStateBar],
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    vi.spyOn(store, 'refreshResults').mockImplementation(() => undefined);
    store.seed({ project: { ...reviewProject, ...project } });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ReviewStateBar);
    element = fixture.nativeElement as HTMLElement;
    // A returned design reads its history, and the page is stable only once that is answered.
    if (project.state === 'returned') TestBed.tick();
    else await fixture.whenStable();
  }

  afterEach(() => http.verify());

  const buttons = () => Array.from(element.querySelectorAll('button')).map((button) => button.textContent?.trim());

  it('says where the field tests stand, and that testing is complete with the date of the last pass', async () => {
    await open({
      role: 'contractor',
      state: 'issued',
      fieldTests: { required: 12, passed: 9, failed: 1, untested: 2, complete: false, completedAt: null },
    });
    expect(element.querySelector('[data-testid="state-field-tests"]')?.textContent?.trim()).toBe(
      'fact_checkField tests: 9 of 12 passed, 1 failed',
    );
    store.seed({
      project: {
        ...reviewProject,
        role: 'contractor',
        state: 'issued',
        fieldTests: { required: 12, passed: 12, failed: 0, untested: 0, complete: true, completedAt: '2026-11-20T15:30:00Z' },
      },
    });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="state-field-tests"]')?.textContent?.trim()).toBe(
      'task_altTesting complete on Nov 20, 2026',
    );
  });

  it('says nothing about field tests before any is recorded', async () => {
    await open({ role: 'engineer', state: 'issued', fieldTests: null });
    expect(element.querySelector('[data-testid="state-field-tests"]')).toBeNull();
  });

  it('shows the engineer’s draft with Submit for review, and after the move the state and the lock in words', async () => {
    await open({ role: 'engineer', state: 'draft', version: 3 });
    expect(element.querySelector('[data-testid="review-state"]')?.textContent).toContain('Draft');
    expect(buttons()).toEqual(['sendSubmit for review']);
    expect(element.querySelector('[data-testid="locked-banner"]')).toBeNull();
    element.querySelector('button')!.click();
    const request = http.expectOne('/api/projects/p1/transitions');
    expect(request.request.body).toEqual({ to: 'in-review', version: 3 });
    request.flush({ ...reviewProject, role: 'engineer', state: 'in-review', version: 4 });
    http.expectOne('/api/projects/p1/review-items').flush([]);
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="review-state"]')?.textContent).toContain('In review');
    expect(buttons()).toEqual([]);
    expect(element.querySelector('[data-testid="locked-banner"]')?.textContent).toContain(
      'cannot be changed until the reviewer returns it',
    );
  });

  it('shows a refusal in words and reads the project again when it moved meanwhile', async () => {
    await open({ role: 'engineer', state: 'returned', version: 5 });
    http.expectOne((request) => request.url === '/api/projects/p1/history').flush({ entries: [], more: false, people: [] });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="return-note"]')).toBeNull();
    const readAgain = vi.spyOn(store, 'readAgain').mockImplementation(() => undefined);
    element.querySelector('button')!.click();
    http.expectOne('/api/projects/p1/transitions').flush(
      {
        error: {
          code: 'conflict',
          message: 'The project changed since you opened it; it is now in review. Look again, then try once more.',
          details: [
            { path: 'state', message: 'in-review' },
            { path: 'version', message: '6' },
          ],
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(element.querySelector('.refusal')?.textContent).toContain('it is now in review');
    expect(readAgain).toHaveBeenCalled();
  });

  it('asks the reviewer for the comment a return needs, in a dialog, and sends it with the move', async () => {
    await open({ role: 'reviewer', state: 'in-review', version: 8 });
    expect(buttons()).toEqual(['undoReturn to the engineer', 'verifiedAccept']);
    const loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
    element.querySelector('button')!.click();
    const dialog = await loader.getHarness(MatDialogHarness);
    await (await dialog.getHarness(MatButtonHarness.with({ text: /Return to the engineer/ }))).click();
    http.expectNone('/api/projects/p1/transitions');
    expect(await dialog.getText()).toContain('Write what needs revision: a return needs a comment.');
    const textarea = document.querySelector<HTMLTextAreaElement>('al-return-dialog textarea')!;
    textarea.value = 'Describe the daylight control of the reading room.';
    textarea.dispatchEvent(new Event('input'));
    await (await dialog.getHarness(MatButtonHarness.with({ text: /Return to the engineer/ }))).click();
    const request = http.expectOne('/api/projects/p1/transitions');
    expect(request.request.body).toEqual({ to: 'returned', version: 8, comment: 'Describe the daylight control of the reading room.' });
    request.flush({ ...reviewProject, state: 'returned', version: 9 });
    http.expectOne('/api/projects/p1/review-items').flush([]);
    TestBed.tick();
    expect(element.querySelector('[data-testid="review-state"]')?.textContent).toContain('Returned');
    // Who returned it and why, from the newest return in the history.
    const history = http.expectOne((each) => each.url === '/api/projects/p1/history');
    expect(history.request.params.get('limit')).toBe('50');
    history.flush({
      entries: [
        {
          id: '9',
          at: '2026-03-04T09:00:00Z',
          user: { id: 'u2', name: 'Dario Quint' },
          entity: 'project',
          entityId: 'p1',
          action: 'transition',
          name: 'Harbour Pavilion',
          before: null,
          after: null,
          restorable: false,
          transition: { from: 'in-review', to: 'returned', revision: 1, words: 'Returned to the engineer', comment: 'Describe it.' },
        },
      ],
      more: false,
      people: [],
    });
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="return-note"]')?.textContent?.replace(/\s+/g, ' ')).toContain(
      'Returned by Dario Quint on Mar 4, 2026: “Describe it.”',
    );
  });

  it('offers a contractor no move, and none on an archived project', async () => {
    await open({ role: 'contractor', state: 'in-review' });
    expect(buttons()).toEqual([]);
    store.seed({ project: { ...reviewProject, role: 'engineer', state: 'draft', archivedAt: '2026-03-01T00:00:00Z' } });
    await fixture.whenStable();
    expect(buttons()).toEqual([]);
  });
});
