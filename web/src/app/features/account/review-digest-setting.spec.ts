import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { AuthStore, type ProjectRole } from '../../core/auth/auth-store';
import { CsrfToken } from '../../core/auth/csrf-token';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { ReviewDigestSetting } from './review-digest-setting';

describe('ReviewDigestSetting', () => {
  let fixture: ComponentFixture<ReviewDigestSetting>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(roles: ProjectRole[], reviewDigest: boolean): Promise<void> {
    TestBed.configureTestingModule({
      imports: [ReviewDigestSetting],
      providers: [provideZonelessChangeDetection(), provideHttpClient(withInterceptors([apiInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(AuthStore).restore().subscribe();
    http.expectOne('/api/auth/me').flush({
      user: { id: 'u-1', email: 'reviewer@alderbay.example', name: 'Dario Quint', isAdmin: false, roles },
      csrfToken: 'csrf-of-this-session',
    });
    TestBed.inject(CsrfToken).value.set('csrf-of-this-session');
    fixture = TestBed.createComponent(ReviewDigestSetting);
    element = fixture.nativeElement as HTMLElement;
    // The settings load counts as pending work, so the page is stable only once it is answered.
    TestBed.tick();
    http.expectOne({ method: 'GET', url: '/api/auth/mail-settings' }).flush({ reviewDigest });
    await fixture.whenStable();
  }

  afterEach(() => http.verify());

  const toggle = () => element.querySelector<HTMLButtonElement>('button[role="switch"]');

  it('offers a reviewer the digest, off until chosen, and saves the choice with the CSRF header', async () => {
    await open(['reviewer'], false);
    expect(element.querySelector('h2')!.textContent).toContain('Review digest');
    expect(toggle()!.getAttribute('aria-checked')).toBe('false');
    expect(element.textContent).toContain('Send me the daily review digest');

    toggle()!.click();
    await fixture.whenStable();
    const saving = http.expectOne({ method: 'PATCH', url: '/api/auth/mail-settings' });
    expect(saving.request.body).toEqual({ reviewDigest: true });
    expect(saving.request.headers.get('X-CSRF-Token')).toBe('csrf-of-this-session');
    expect(toggle()!.disabled).toBe(true);
    saving.flush({ reviewDigest: true });
    await fixture.whenStable();

    expect(toggle()!.getAttribute('aria-checked')).toBe('true');
    expect(toggle()!.disabled).toBe(false);
    expect(element.querySelector('[role="status"]')!.textContent).toContain('The daily review digest is on.');
  });

  it('puts the switch back and says why when the choice is refused', async () => {
    await open(['reviewer'], true);
    expect(toggle()!.getAttribute('aria-checked')).toBe('true');
    toggle()!.click();
    await fixture.whenStable();
    http
      .expectOne({ method: 'PATCH', url: '/api/auth/mail-settings' })
      .flush(
        { error: { code: 'internal', message: 'Something went wrong on our side. The error has been logged.' } },
        { status: 500, statusText: 'Server Error' },
      );
    await fixture.whenStable();
    expect(toggle()!.getAttribute('aria-checked')).toBe('true');
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('Something went wrong on our side.');
  });

  it('is not offered to someone who reviews nothing, unless they have it on', async () => {
    await open(['engineer'], false);
    expect(toggle()).toBeNull();
    expect(element.textContent).not.toContain('Review digest');
  });

  it('stays for someone who no longer reviews but has it on, so they can turn it off', async () => {
    await open(['contractor'], true);
    toggle()!.click();
    await fixture.whenStable();
    http.expectOne({ method: 'PATCH', url: '/api/auth/mail-settings' }).flush({ reviewDigest: false });
    await fixture.whenStable();
    expect(toggle()!.getAttribute('aria-checked')).toBe('false');
    expect(element.querySelector('[role="status"]')!.textContent).toContain('The daily review digest is off.');
  });
});
