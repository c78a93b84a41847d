import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { reviewItem, reviewProject, reviewSpace } from '../../../testing/review-items';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import { ReviewPage } from './review-page';

const items = [
  reviewItem('i1', {
    title: 'Hose store: Occupancy sensing',
    thread: [{ by: 'Ines Halvorsen', role: 'engineer', at: '2026-03-02T10:20:00Z', text: 'Sensor added on sheet E2.', round: 1 }],
  }),
  reviewItem('i2', { title: 'Office: Occupancy sensing', spaceId: 's2', changed: true }),
  reviewItem('i3', { title: 'Hose store: Power allowance', kind: 'power-allowance', outcome: 'not-met', verdict: 'needs-revision' }),
];

describe('ReviewPage', () => {
  let fixture: ComponentFixture<ReviewPage>;
  let http: HttpTestingController;
  let store: ProjectStore;
  let element: HTMLElement;

  const itemsRead = () => http.expectOne((request) => request.method === 'GET' && request.url === '/api/projects/p1/review-items');
  const press = async (key: string, target: EventTarget = document.body) => {
    target.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true }));
    await fixture.whenStable();
  };
  const heading = () => element.querySelector('[data-testid="review-detail"] h3')?.textContent?.trim();
  const button = (words: string) =>
    Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find((each) => each.textContent?.includes(words)) ?? null;

  async function open(role: 'reviewer' | 'engineer'): Promise<void> {
    // jsdom lays nothing out, so it has no scrolling; the page scrolls the chosen item into view.
    Element.prototype.scrollIntoView ??= () => undefined;
    TestBed.configureTestingModule({
      imports: [ReviewPage],
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
    store.seed({
      project: { ...reviewProject, role },
      spaces: [reviewSpace('s1', 'Hose store'), reviewSpace('s2', 'Office')],
      reviewItems: items,
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(ReviewPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  it('lists the items by kind with outcome, verdict and a changed marker, beside the first one’s detail and thread', async () => {
    await open('reviewer');
    const groups = Array.from(element.querySelectorAll('h3.group')).map((group) => group.textContent?.trim());
    expect(groups).toEqual(['Power allowance', 'Occupancy sensing']);
    const rows = Array.from(element.querySelectorAll('.item-list button')).map((row) => row.textContent?.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Not met · Needs revision');
    expect(rows[2]).toMatch(/No verdict yet · (change_circle)?Changed/);
    // Under a check, each item is named by its space; under a space, by its check.
    expect(rows.map((row) => row?.split(/Met|Not met/)[0]?.trim())).toEqual(['Hose store', 'Hose store', 'Office']);
    element.querySelectorAll<HTMLButtonElement>('mat-button-toggle button')[1]!.click();
    await fixture.whenStable();
    expect(Array.from(element.querySelectorAll('h3.group')).map((group) => group.textContent?.trim())).toEqual(['Hose store', 'Office']);
    expect(element.querySelector('.item-list button [matListItemTitle]')?.textContent?.trim()).toBe('Occupancy sensing');
    element.querySelectorAll<HTMLButtonElement>('mat-button-toggle button')[0]!.click();
    await fixture.whenStable();
    expect(heading()).toBe('Hose store: Power allowance');
    await press('j');
    expect(heading()).toBe('Hose store: Occupancy sensing');
    const detail = element.querySelector('[data-testid="review-detail"]')!.textContent!.replace(/\s+/g, ' ');
    expect(detail).toContain('Invented §1.2');
    expect(detail).toContain('An occupant sensor is recorded for the space.');
    expect(detail).toMatch(/Floor area ?400 ft²/);
    expect(detail).toContain('Ines Halvorsen (engineer)');
    expect(detail).toContain('Sensor added on sheet E2.');
    expect(element.querySelector('.keys')?.textContent).toContain('c confirmed');
  });

  it('steps with j, k and the arrows, and leaves keys alone while typing in a field', async () => {
    await open('reviewer');
    await press('ArrowDown');
    await press('j');
    expect(heading()).toBe('Office: Occupancy sensing');
    await press('j');
    expect(heading()).toBe('Office: Occupancy sensing');
    await press('k');
    expect(heading()).toBe('Hose store: Occupancy sensing');
    await press('ArrowUp');
    expect(heading()).toBe('Hose store: Power allowance');
    const comment = element.querySelector('textarea')!;
    await press('j', comment);
    await press('c', comment);
    expect(heading()).toBe('Hose store: Power allowance');
  });

  it('confirms with c, reads the items again and moves on to the next', async () => {
    await open('reviewer');
    await press('j');
    await press('c');
    const request = http.expectOne('/api/projects/p1/review-items/i1');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ verdict: 'confirmed' });
    request.flush({});
    itemsRead().flush(items.map((item) => (item.id === 'i1' ? { ...item, verdict: 'confirmed' as const } : item)));
    await fixture.whenStable();
    expect(heading()).toBe('Office: Occupancy sensing');
    expect(element.querySelector('.notice')?.textContent).toContain('Hose store: Occupancy sensing: confirmed.');
  });

  it('asks for the comment a needs-revision verdict needs (r focuses it) and sends it with the verdict', async () => {
    await open('reviewer');
    await press('j');
    await press('r');
    const comment = element.querySelector('textarea')!;
    expect(document.activeElement).toBe(comment);
    expect(element.textContent).toContain('Say what needs revision.');
    expect(element.querySelector('mat-label')?.textContent).toContain('What needs revision');
    comment.value = 'The sensor is not on the lighting plan.';
    comment.dispatchEvent(new Event('input'));
    comment.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', ctrlKey: true, bubbles: true }));
    await fixture.whenStable();
    const request = http.expectOne('/api/projects/p1/review-items/i1');
    expect(request.request.body).toEqual({ verdict: 'needs-revision', comment: 'The sensor is not on the lighting plan.' });
    request.flush({});
    itemsRead().flush(items);
  });

  it('does not send Not applicable without a comment, and shows a refusal in words', async () => {
    await open('reviewer');
    button('Not applicable')!.click();
    await fixture.whenStable();
    http.expectNone('/api/projects/p1/review-items/i3');
    expect(element.textContent).toContain('Say why this check does not apply.');
    const comment = element.querySelector('textarea')!;
    comment.value = 'The room is a closet below the size the section names.';
    comment.dispatchEvent(new Event('input'));
    button('Not applicable')!.click();
    await fixture.whenStable();
    http
      .expectOne('/api/projects/p1/review-items/i3')
      .flush({ error: { code: 'conflict', message: 'The design is no longer in review.' } }, { status: 409, statusText: 'Conflict' });
    itemsRead().flush(items);
    await fixture.whenStable();
    expect(element.querySelector('.failure[role="alert"]')?.textContent).toContain('The design is no longer in review.');
  });

  it('confirms every unchanged item, or every open item of the chosen kind, in one request each', async () => {
    await open('reviewer');
    expect(button('Confirm all unchanged')?.textContent).toContain('(1)');
    button('Confirm all unchanged')!.click();
    let request = http.expectOne('/api/projects/p1/review-items/bulk');
    expect(request.request.body).toEqual({ confirm: { unchanged: true } });
    request.flush({});
    itemsRead().flush(items);
    await fixture.whenStable();
    await press('j');
    expect(button('Confirm all of this kind')?.textContent).toContain('(2)');
    button('Confirm all of this kind')!.click();
    request = http.expectOne('/api/projects/p1/review-items/bulk');
    expect(request.request.body).toEqual({ confirm: { kind: 'occupancy-sensing' } });
    request.flush({});
    itemsRead().flush(items);
  });

  it('lets the engineer read and reply, with no verdicts and no verdict keys', async () => {
    await open('engineer');
    expect(button('Confirmed')).toBeNull();
    expect(button('Confirm all unchanged')).toBeNull();
    expect(element.querySelector('.keys')?.textContent).not.toContain('confirmed');
    await press('c');
    http.expectNone(() => true);
    const reply = element.querySelector<HTMLTextAreaElement>('form.reply textarea')!;
    reply.value = '  The allowance is met after the luminaire change on E3.  ';
    reply.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    button('Reply')!.click();
    await fixture.whenStable();
    const request = http.expectOne('/api/projects/p1/review-items/i3/replies');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ text: 'The allowance is met after the luminaire change on E3.' });
    request.flush({});
    itemsRead().flush(items);
  });

  it('says there is nothing to review before a submission', async () => {
    await open('engineer');
    store.seed({ project: { ...reviewProject, role: 'engineer', state: 'draft' }, reviewItems: [] });
    await fixture.whenStable();
    expect(element.textContent).toContain('the check items are made when the engineer submits the design for review');
  });
});
