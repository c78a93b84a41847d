import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import type { ProjectState } from '../../../../../contract/review';
import type { ProjectDetail } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { reviewItem, reviewProject } from '../../../testing/review-items';
import { ApiError } from '../../core/http/api-error';
import { ProjectStore, reviewReadFailure, sameWhereUnchanged } from './project-store';

// Invented records: only id and version matter here.
const record = (id: string, version: number, name: string) => ({ id, version, name });

describe('sameWhereUnchanged', () => {
  it('keeps the held copy of each record whose version did not move, and takes the new copy of the rest', () => {
    const held = [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')];
    const read = [record('a', 1, 'Exam 1'), record('b', 5, 'Exam 2, renamed')];
    const next = sameWhereUnchanged(held, read);
    expect(next[0]).toBe(held[0]);
    expect(next[1]).toBe(read[1]);
  });

  it('answers the held list itself when nothing changed, so nothing on screen starts again', () => {
    const held = [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')];
    expect(sameWhereUnchanged(held, [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')])).toBe(held);
  });

  it('follows additions, deletions and the order read', () => {
    const held = [record('a', 1, 'Exam 1'), record('b', 4, 'Exam 2')];
    const read = [record('c', 1, 'Exam 3'), record('a', 1, 'Exam 1')];
    const next = sameWhereUnchanged(held, read);
    expect(next.map((item) => item.id)).toEqual(['c', 'a']);
    expect(next[1]).toBe(held[0]);
  });
});

describe('ProjectStore and the review state', () => {
  let store: ProjectStore;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    store = TestBed.inject(ProjectStore);
    http = TestBed.inject(HttpTestingController);
    vi.spyOn(store, 'refreshResults').mockImplementation(() => undefined);
  });

  afterEach(() => http.verify());

  it('lets the engineer edit a draft or a returned design, and nothing in review, accepted or issued, saying why', () => {
    const expected: Record<ProjectState, boolean> = { draft: true, returned: true, 'in-review': false, accepted: false, issued: false };
    for (const [state, editable] of Object.entries(expected) as [ProjectState, boolean][]) {
      store.seed({ project: { ...reviewProject, role: 'engineer', state } });
      expect(store.editable()).toBe(editable);
      expect(store.canEdit()).toBe(editable);
      expect(store.mayEdit()).toBe(true);
      expect(store.lockedReason() === null).toBe(editable);
    }
    store.seed({ project: { ...reviewProject, role: 'engineer', state: 'in-review' } });
    expect(store.lockedReason()).toContain('until the reviewer returns it');
    store.seed({ project: { ...reviewProject, role: 'reviewer', state: 'draft' } });
    expect(store.canEdit()).toBe(false);
    expect(store.mayEdit()).toBe(false);
  });

  it('counts per space the items that need revision', () => {
    store.seed({
      reviewItems: [
        reviewItem('a', { spaceId: 's1', verdict: 'needs-revision' }),
        reviewItem('b', { spaceId: 's1', verdict: 'needs-revision', kind: 'power-allowance' }),
        reviewItem('c', { spaceId: 's2', verdict: 'confirmed' }),
        reviewItem('d', { spaceId: undefined, verdict: 'needs-revision', kind: 'exterior-power' }),
      ],
    });
    expect([...store.needsRevisionBySpace()]).toEqual([['s1', 2]]);
  });

  it('moves the state from the version held, takes the project that comes back and reads the items again', () => {
    store.seed({ project: { ...reviewProject, role: 'engineer', state: 'draft', version: 7 } });
    let moved: ProjectDetail | undefined;
    store.move('in-review').subscribe((project) => (moved = project));
    const request = http.expectOne('/api/projects/p1/transitions');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ to: 'in-review', version: 7 });
    request.flush({ ...reviewProject, state: 'in-review', version: 8 });
    expect(moved?.state).toBe('in-review');
    expect(store.project()?.version).toBe(8);
    expect(store.canEdit()).toBe(false);
    http.expectOne('/api/projects/p1/review-items').flush([reviewItem('a')]);
    const items = store.reviewItems();
    expect(items.status === 'ready' && items.items.map((item) => item.id)).toEqual(['a']);
  });

  it('keeps the words of why the items could not be read', () => {
    store.seed({ project: reviewProject });
    store.reloadReviewItems();
    http
      .expectOne('/api/projects/p1/review-items')
      .flush({ error: { code: 'forbidden', message: 'You are not on this project.' } }, { status: 403, statusText: 'Forbidden' });
    expect(store.reviewItems()).toEqual({ status: 'failed', message: 'You are not on this project.' });
  });
});

describe('reviewReadFailure', () => {
  it('keeps the service’s words, but never the route a 404 names', () => {
    const missing = new ApiError(404, 'not_found', 'No route for GET /api/review-desk.');
    expect(reviewReadFailure(missing, 'The review desk could not be read.')).toBe(
      'The review desk could not be read. The service did not find what was asked for.',
    );
    expect(reviewReadFailure(new ApiError(403, 'forbidden', 'You are not on this project.'), 'x')).toBe('You are not on this project.');
    expect(reviewReadFailure(new Error('boom'), 'The check items could not be read.')).toBe('The check items could not be read.');
  });
});
