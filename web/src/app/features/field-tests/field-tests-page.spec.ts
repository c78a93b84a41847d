import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ProjectDetail, SpaceRecord } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ProjectStore } from '../workspace/project-store';
import type { FieldTestRecord, TestPlanItem, TestPlanView } from './field-tests-api';
import { FieldTestsPage } from './field-tests-page';
import { fieldTestSummaryOf } from '../../../../../contract/field-tests';
import { filterMatches, searchMatches, searchTerms } from './field-tests-words';

// An invented project, its spaces and a small plan.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'issued',
  role: 'contractor',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 4,
  members: [],
  archivedAt: null,
} as unknown as ProjectDetail;

const spaces = [
  { id: 's1', name: 'Exam 1' },
  { id: 's2', name: 'Lobby' },
] as unknown as SpaceRecord[];

const sensorId = 'occupant-sensor:occupant-sensor:s1';

function sensorItem(history: FieldTestRecord[] = []): TestPlanItem {
  return {
    id: sensorId,
    kind: 'occupant-sensor',
    title: 'Occupant sensor in Exam 1',
    spaceIds: ['s1'],
    combination: 'ceiling sensor · Exam room · up to 300 ft²',
    sample: true,
    required: true,
    steps: ['Leave the room empty.', 'Time how long the lights stay on.'],
    expected: 'The lights go off within 20 minutes of the room emptying.',
    section: 'IECC 2021 C408.3.1.1',
    history,
    photos: [],
    ...(history.length > 0 ? { result: history[history.length - 1] } : {}),
  };
}

function plan(items: TestPlanItem[], widened = false): TestPlanView {
  const failed = items.filter((item) => item.result?.result === 'fail').length;
  const passed = items.filter((item) => item.result?.result === 'pass').length;
  const progress = { required: items.length, passed, failed, untested: items.length - passed - failed };
  return {
    items,
    groups: [
      {
        kind: 'occupant-sensor',
        combination: 'ceiling sensor · Exam room · up to 300 ft²',
        population: 8,
        sampleSize: widened ? 8 : 1,
        widened,
        words: widened ? 'A failed sample widened this combination to all 8.' : 'One of 8 chosen.',
        itemIds: items.map((item) => item.id),
      },
    ],
    gaps: ['Lobby: an occupant sensor is required but not shown as provided.'],
    notices: ['Lobby: an occupant sensor is required but not shown as provided.'],
    progress: { ...progress, complete: false, kinds: [{ kind: 'occupant-sensor', label: 'Occupant sensors', ...progress }] },
  };
}

describe('FieldTestsPage', () => {
  let fixture: ComponentFixture<FieldTestsPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(role: string, view: TestPlanView) {
    TestBed.configureTestingModule({
      imports: [FieldTestsPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        ProjectStore,
      ],
    });
    TestBed.inject(ProjectStore).seed({ project: { ...project, role } as ProjectDetail, spaces });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FieldTestsPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/projects/p1/test-plan').flush(view);
    await fixture.whenStable();
  }

  const text = () => element.textContent!.replace(/\s+/g, ' ');

  afterEach(() => http.verify());

  it('lists the items in words: spaces by name, numbered steps, expected result, section, progress and notices', async () => {
    await open('engineer', plan([sensorItem()]));
    const card = element.querySelector('[data-testid="field-test-item"]')!;
    const shown = card.textContent!.replace(/\s+/g, ' ');
    expect(shown).toContain('Occupant sensor in Exam 1');
    expect(shown).toContain('Space: Exam 1');
    expect(shown).toContain('Not tested yet');
    expect(Array.from(card.querySelectorAll('.steps li')).map((li) => li.textContent?.trim())).toEqual([
      'Leave the room empty.',
      'Time how long the lights stay on.',
    ]);
    expect(shown).toContain('Expected: The lights go off within 20 minutes of the room emptying.');
    expect(shown).toContain('Section: IECC 2021 C408.3.1.1');
    expect(text()).toContain('All tests: 0 of 1 passed, 1 not tested yet.');
    expect(text()).toContain('8 controls: 1 in the sample.');
    expect(text()).toContain('Lobby: an occupant sensor is required but not shown as provided.');
    expect(text()).not.toMatch(/occupant-sensor|\bs1\b/);
    expect(element.querySelector('[data-testid="testing-complete"]')).toBeNull();
  });

  it('lets the contractor record a fail with a time-out, then reads the plan again and shows the widened sample', async () => {
    await open('contractor', plan([sensorItem()]));
    element.querySelector<HTMLButtonElement>('[data-testid="record-test"]')!.click();
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-fail"] button')!.click();
    const timeout = element.querySelector<HTMLInputElement>('[data-testid="measured-timeoutMinutes"]')!;
    expect(timeout.getAttribute('max')).toBe('1440');
    timeout.value = '32';
    timeout.dispatchEvent(new Event('input'));
    const notes = element.querySelector<HTMLTextAreaElement>('[data-testid="record-notes"]')!;
    notes.value = 'Lights stayed on past half an hour.';
    notes.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-save"]')!.click();
    await fixture.whenStable();

    const request = http.expectOne((candidate) => candidate.method === 'PATCH');
    expect(request.request.url).toBe('/api/projects/p1/test-plan/items/occupant-sensor%3Aoccupant-sensor%3As1');
    expect(request.request.body).toEqual({
      result: 'fail',
      measured: { timeoutMinutes: '32' },
      notes: 'Lights stayed on past half an hour.',
    });
    const failed: FieldTestRecord = {
      id: '1',
      itemId: sensorId,
      result: 'fail',
      measured: { timeoutMinutes: '32' },
      lightLevelUnit: null,
      notes: 'Lights stayed on past half an hour.',
      by: { id: 'u1', name: 'Tomas Reyes' },
      at: '2026-03-02T10:15:00Z',
    };
    const after = plan([sensorItem([failed])], true);
    request.flush({ item: after.items[0], group: after.groups[0], notices: after.notices, progress: after.progress });
    await fixture.whenStable();
    http.expectOne('/api/projects/p1/test-plan').flush(after);
    await fixture.whenStable();

    expect(element.querySelector('[data-testid="latest-result"]')?.textContent).toContain('Failed');
    const history = element.querySelector('[data-testid="field-test-history"]')!.textContent!.replace(/\s+/g, ' ');
    expect(history).toContain('Failed');
    expect(history).toContain('by Tomas Reyes');
    expect(history).toContain('time-out 32 minutes');
    expect(history).toContain('Lights stayed on past half an hour.');
    expect(text()).toContain('8 controls: the sample widened, every one of them is to be tested.');
    expect(element.querySelector('[data-testid="record-form"]')).toBeNull();
    expect(element.querySelector('[data-testid="record-test"]')?.textContent).toContain('Record a retest');
  });

  it('shows the service’s refusal beside the item', async () => {
    await open('contractor', plan([sensorItem()]));
    element.querySelector<HTMLButtonElement>('[data-testid="record-test"]')!.click();
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-pass"] button')!.click();
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-save"]')!.click();
    await fixture.whenStable();
    http
      .expectOne((candidate) => candidate.method === 'PATCH')
      .flush(
        { error: { code: 'archived', message: 'The project is archived: nothing in it can change.' } },
        { status: 409, statusText: 'Conflict' },
      );
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="record-refusal"]')?.textContent).toContain('The project is archived');
  });

  it('refuses a time-out over a day before sending it', async () => {
    await open('contractor', plan([sensorItem()]));
    element.querySelector<HTMLButtonElement>('[data-testid="record-test"]')!.click();
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-fail"] button')!.click();
    const timeout = element.querySelector<HTMLInputElement>('[data-testid="measured-timeoutMinutes"]')!;
    timeout.value = '1441';
    timeout.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-save"]')!.click();
    await fixture.whenStable();
    http.expectNone((candidate) => candidate.method === 'PATCH');
    expect(element.querySelector('[data-testid="record-refusal"]')?.textContent).toContain('Time-out: at most 1,440.');
  });

  it('says testing is complete when every required test has passed', async () => {
    const passed: FieldTestRecord = {
      id: '1',
      itemId: sensorId,
      result: 'pass',
      measured: {},
      lightLevelUnit: null,
      notes: null,
      by: null,
      at: '2026-03-02T10:15:00Z',
    };
    const view = plan([sensorItem([passed])]);
    await open('engineer', { ...view, progress: { ...view.progress, complete: true } });
    const banner = element.querySelector('[data-testid="testing-complete"]')!.textContent!.replace(/\s+/g, ' ');
    expect(banner).toContain('Testing complete: every required test has passed, the last on Mar 2, 2026.');
    expect(text()).toContain('All tests: 1 of 1 passed.');
    expect(text()).toContain('by someone no longer on the team');
    // The state bar reads the project: it follows the plan just read.
    expect(TestBed.inject(ProjectStore).project()?.fieldTests).toMatchObject({ complete: true, passed: 1, required: 1 });
  });

  it('dates the completion by the last required pass, not by a later test of an item outside the sample', () => {
    const at = (id: string, when: string): FieldTestRecord => ({
      id,
      itemId: sensorId,
      result: 'pass',
      measured: {},
      lightLevelUnit: null,
      notes: null,
      by: null,
      at: when,
    });
    const required = sensorItem([at('1', '2026-03-04T09:00:00Z')]);
    const earlier = { ...sensorItem([at('2', '2026-03-01T09:00:00Z')]), id: 'other' };
    const optional = { ...sensorItem([at('3', '2026-03-09T09:00:00Z')]), id: 'optional', required: false, sample: false };
    const view = plan([earlier, required, optional]);
    expect(fieldTestSummaryOf({ ...view, progress: { ...view.progress, complete: true } }).completedAt).toBe('2026-03-04T09:00:00Z');
    expect(fieldTestSummaryOf(view).completedAt).toBeNull();
  });

  it('keeps a result taken without a connection, says it waits, and sends it when the connection returns', async () => {
    await open('contractor', plan([sensorItem()]));
    element.querySelector<HTMLButtonElement>('[data-testid="record-test"]')!.click();
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-fail"] button')!.click();
    await fixture.whenStable();
    element.querySelector<HTMLButtonElement>('[data-testid="record-save"]')!.click();
    await fixture.whenStable();
    http.expectOne((candidate) => candidate.method === 'PATCH').error(new ProgressEvent('error'), { status: 0, statusText: '' });

    const waiting = () => element.querySelector('[data-testid="queue-waiting"]')?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
    await expect.poll(async () => (await fixture.whenStable(), waiting())).toContain('1 result waits for a connection.');
    expect(element.querySelector('[data-testid="queued-result"]')?.textContent).toContain('Failed, waiting to be sent');
    expect(element.querySelector('[data-testid="record-form"]')).toBeNull();

    window.dispatchEvent(new Event('online'));
    const failed: FieldTestRecord = {
      id: '1',
      itemId: sensorId,
      result: 'fail',
      measured: {},
      lightLevelUnit: null,
      notes: null,
      by: { id: 'u1', name: 'Tomas Reyes' },
      at: new Date().toISOString(),
    };
    const after = plan([sensorItem([failed])], true);
    let resent: ReturnType<HttpTestingController['match']> = [];
    await expect.poll(() => (resent = http.match((candidate) => candidate.method === 'PATCH')).length).toBe(1);
    expect(resent[0]!.request.body).toEqual({ result: 'fail' });
    resent[0]!.flush({ item: after.items[0], group: after.groups[0], notices: after.notices, progress: after.progress });
    let reread: ReturnType<HttpTestingController['match']> = [];
    await expect.poll(() => (reread = http.match('/api/projects/p1/test-plan')).length).toBe(1);
    reread[0]!.flush(after);
    await expect
      .poll(async () => (await fixture.whenStable(), element.querySelector('[data-testid="queue-sent"]')?.textContent ?? ''))
      .toContain('1 waiting result was sent.');
    expect(waiting()).toBe('');
    expect(element.querySelector('[data-testid="queued-result"]')).toBeNull();
    expect(element.querySelector('[data-testid="latest-result"]')?.textContent).toContain('Failed');
  });

  it('gives a member who is not the contractor no recording controls', async () => {
    await open('reviewer', plan([sensorItem()]));
    // Nothing recorded yet: the project says nothing of field tests.
    expect(TestBed.inject(ProjectStore).project()?.fieldTests).toBeUndefined();
    expect(element.querySelectorAll('[data-testid="field-test-item"]').length).toBe(1);
    expect(element.querySelector('[data-testid="record-test"]')).toBeNull();
    expect(element.querySelector('[data-testid="record-form"]')).toBeNull();
  });

  describe('showing some of the tests', () => {
    const passed: FieldTestRecord = {
      id: 'r1',
      itemId: 'time-switch:s2',
      result: 'pass',
      measured: {},
      lightLevelUnit: null,
      notes: null,
      at: '2026-11-02T15:00:00Z',
      by: { id: 'u1', name: 'Dana Contractor' },
    };
    const lobbySwitch: TestPlanItem = {
      ...sensorItem([passed]),
      id: 'time-switch:s2',
      kind: 'time-switch',
      title: 'Time switch of the Lobby',
      spaceIds: ['s2'],
      combination: undefined,
      section: 'IECC 2021 C408.3.1.2',
    } as TestPlanItem;
    function twoKinds(): TestPlanView {
      const view = plan([sensorItem(), lobbySwitch]);
      const kind = (k: 'occupant-sensor' | 'time-switch', label: string, passedCount: number) => ({
        kind: k,
        label,
        required: 1,
        passed: passedCount,
        failed: 0,
        untested: 1 - passedCount,
      });
      view.progress.kinds = [kind('occupant-sensor', 'Occupant sensors', 0), kind('time-switch', 'Time switches', 1)];
      return view;
    }
    const titles = () => Array.from(element.querySelectorAll('.item-title')).map((title) => title.textContent?.trim());
    const button = (testId: string) => element.querySelector<HTMLElement>(`[data-testid="${testId}"] button`)!;

    it('counts each choice, and shows what is still to do, what passed, or nothing failed', async () => {
      await open('contractor', twoKinds());
      expect(titles()).toEqual(['Occupant sensor in Exam 1', 'Time switch of the Lobby']);
      expect(button('filter-to-do').textContent?.replace(/\s+/g, ' ').trim()).toBe('To do 1');
      button('filter-to-do').click();
      await fixture.whenStable();
      expect(titles()).toEqual(['Occupant sensor in Exam 1']);
      expect(text()).toContain('1 of 2 tests shown.');
      button('filter-passed').click();
      await fixture.whenStable();
      expect(titles()).toEqual(['Time switch of the Lobby']);
      button('filter-failed').click();
      await fixture.whenStable();
      expect(titles()).toEqual([]);
      expect(text()).toContain('No test is shown by this choice.');
      (Array.from(element.querySelectorAll('button')).find((b) => b.textContent?.includes('Show every test')) as HTMLElement).click();
      await fixture.whenStable();
      expect(titles()).toHaveLength(2);
    });

    it('finds a test by a space’s name, and folds and opens a kind', async () => {
      await open('contractor', twoKinds());
      const search = element.querySelector<HTMLInputElement>('[data-testid="field-test-search"]')!;
      search.value = '  LOBBY ';
      search.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      expect(titles()).toEqual(['Time switch of the Lobby']);
      search.value = 'Exam';
      search.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      expect(titles()).toEqual(['Occupant sensor in Exam 1']);
      search.value = '';
      search.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      const toggles = () => Array.from(element.querySelectorAll<HTMLElement>('[data-testid="field-test-kind"]'));
      expect(toggles().map((toggle) => toggle.getAttribute('aria-expanded'))).toEqual(['true', 'true']);
      toggles()[0]!.click();
      await fixture.whenStable();
      expect(toggles()[0]!.getAttribute('aria-expanded')).toBe('false');
      expect(toggles()[0]!.textContent).toContain('Occupant sensors');
      expect(toggles()[0]!.textContent).toContain('0 of 1 passed, 1 not tested yet.');
      expect(titles()).toEqual(['Time switch of the Lobby']);
      toggles()[0]!.click();
      await fixture.whenStable();
      expect(titles()).toHaveLength(2);
    });

    it('reads a search bounded, trimmed and in any case, and a filter by the latest result', () => {
      expect(searchTerms('  Lobby   East ')).toBe('lobby east');
      expect(searchTerms('x'.repeat(5000))).toHaveLength(100);
      expect(searchMatches({ title: 'Time switch', combination: undefined }, ['Lobby  East'], 'lobby east')).toBe(true);
      expect(searchMatches({ title: 'Time switch', combination: undefined }, ['Lobby'], 'exam')).toBe(false);
      const failedItem = { required: true, result: { ...passed, result: 'fail' as const } };
      expect(filterMatches(failedItem, 'to-do')).toBe(true);
      expect(filterMatches(failedItem, 'failed')).toBe(true);
      expect(filterMatches({ required: false }, 'to-do')).toBe(false);
      expect(filterMatches({ required: true, result: passed }, 'to-do')).toBe(false);
    });
  });
});
