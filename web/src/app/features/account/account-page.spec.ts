import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { CsrfToken } from '../../core/auth/csrf-token';
import { apiInterceptor } from '../../core/http/api-interceptor';
import type { ActiveSession } from './account-api';
import { AccountPage } from './account-page';

// A shape of user agent each browser sends (from memory; versions invented).
const linuxChrome = 'Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/130.0.0.0 Safari/537.36';
const windowsFirefox = 'Mozilla/5.0 (Windows NT 10.0; Win64; x64; rv:131.0) Gecko/20100101 Firefox/131.0';

const minutesAgo = (minutes: number) => new Date(Date.now() - minutes * 60_000).toISOString();

// Addresses from the documentation ranges (RFC 5737).
const thisBrowser: ActiveSession = {
  id: 's-here',
  createdAt: minutesAgo(90),
  lastSeenAt: minutesAgo(0),
  expiresAt: minutesAgo(-400),
  userAgent: linuxChrome,
  address: '192.0.2.10',
  current: true,
};
const laptop: ActiveSession = {
  id: 's-laptop',
  createdAt: minutesAgo(300),
  lastSeenAt: minutesAgo(5),
  expiresAt: minutesAgo(-180),
  userAgent: windowsFirefox,
  address: '198.51.100.4',
  current: false,
};
const script: ActiveSession = {
  id: 's-script',
  createdAt: minutesAgo(30),
  lastSeenAt: minutesAgo(30),
  expiresAt: minutesAgo(-450),
  userAgent: null,
  address: null,
  current: false,
};

describe('AccountPage', () => {
  let fixture: ComponentFixture<AccountPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [AccountPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    TestBed.inject(CsrfToken).value.set('csrf-of-this-session');
    fixture = TestBed.createComponent(AccountPage);
    http = TestBed.inject(HttpTestingController);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  async function answerList(sessions: ActiveSession[]): Promise<void> {
    http.expectOne({ method: 'GET', url: '/api/auth/sessions' }).flush(sessions);
    await fixture.whenStable();
  }

  const rows = () => Array.from(element.querySelectorAll<HTMLElement>('[data-testid="session"]'));
  const button = (label: string, within: HTMLElement = element) =>
    Array.from(within.querySelectorAll<HTMLButtonElement>('button')).find((candidate) => candidate.textContent?.includes(label));

  it('lists each session in words, marks this browser, and offers to end only the others', async () => {
    await answerList([thisBrowser, laptop, script]);

    const [here, other, unknown] = rows();
    expect(here!.textContent).toContain('Chrome on Linux');
    expect(here!.textContent).toContain('This browser');
    expect(here!.textContent).toContain('last active just now');
    expect(button('End session', here!)).toBeUndefined();

    expect(other!.textContent).toContain('Firefox on Windows');
    expect(other!.textContent).not.toContain('This browser');
    expect(other!.textContent).toContain('last active 5 minutes ago');
    expect(other!.textContent).toContain('From address 198.51.100.4');
    expect(other!.textContent).toMatch(/Signed in \w{3} \d{1,2}, \d{4}, \d{1,2}:\d{2} [AP]M/);
    expect(button('End session', other!)!.getAttribute('aria-describedby')).toBe('session-s-laptop');

    expect(unknown!.textContent).toContain('Unknown browser');
    expect(unknown!.textContent).not.toContain('From address');
    expect(element.textContent).not.toContain('s-laptop');
  });

  it('ends another session with the CSRF header, then shows the list without it', async () => {
    await answerList([thisBrowser, laptop]);
    button('End session', rows()[1])!.click();
    await fixture.whenStable();
    expect(button('End all other sessions')!.disabled).toBe(true);

    const ending = http.expectOne({ method: 'DELETE', url: '/api/auth/sessions/s-laptop' });
    expect(ending.request.headers.get('X-CSRF-Token')).toBe('csrf-of-this-session');
    ending.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    await answerList([thisBrowser]);

    expect(rows()).toHaveLength(1);
    expect(element.querySelector('[role="status"]')!.textContent).toContain('The session on Firefox on Windows has ended.');
    expect(element.textContent).toContain('This browser is your only session.');
    expect(button('End all other sessions')!.disabled).toBe(true);
  });

  it('ends all other sessions at once and says how many', async () => {
    await answerList([thisBrowser, laptop, script]);
    button('End all other sessions')!.click();
    await fixture.whenStable();

    http.expectOne({ method: 'POST', url: '/api/auth/sessions/end-others' }).flush({ ended: 2 });
    await fixture.whenStable();
    await answerList([thisBrowser]);

    expect(element.querySelector('[role="status"]')!.textContent).toContain('2 other sessions have ended.');
    expect(rows()).toHaveLength(1);
  });

  it('treats a session that already ended elsewhere as ended, and shows other failures', async () => {
    await answerList([thisBrowser, laptop, script]);
    button('End session', rows()[1])!.click();
    await fixture.whenStable();
    http
      .expectOne('/api/auth/sessions/s-laptop')
      .flush({ error: { code: 'not_found', message: 'No such session.' } }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    await answerList([thisBrowser, script]);
    expect(element.querySelector('[role="status"]')!.textContent).toContain('had already ended');

    button('End session', rows()[1])!.click();
    await fixture.whenStable();
    http
      .expectOne('/api/auth/sessions/s-script')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong on our side. The error has been logged.' } },
        { status: 500, statusText: 'Server Error' },
      );
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('Something went wrong on our side.');
    expect(button('End session', rows()[1])!.disabled).toBe(false);
  });

  it('says so when the list cannot be loaded', async () => {
    http
      .expectOne('/api/auth/sessions')
      .flush(
        { error: { code: 'internal', message: 'Something went wrong on our side. The error has been logged.' } },
        { status: 500, statusText: 'Server Error' },
      );
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('Something went wrong on our side.');
    expect(rows()).toHaveLength(0);
  });
});
