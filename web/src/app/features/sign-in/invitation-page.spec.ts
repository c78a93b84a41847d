import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { apiInterceptor } from '../../core/http/api-interceptor';
import type { InvitationPreview } from './invitation-api';
import { InvitationPage } from './invitation-page';

const preview: InvitationPreview = {
  email: 'surveyor@elsewhere.example',
  role: 'reviewer',
  projectName: 'Tidewater Pavilion',
  invitedBy: 'Ines Halvorsen',
  expiresAt: '2026-03-09T10:15:00Z',
};

describe('InvitationPage', () => {
  let fixture: ComponentFixture<InvitationPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(token: string) {
    TestBed.configureTestingModule({
      imports: [InvitationPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    fixture = TestBed.createComponent(InvitationPage);
    fixture.componentRef.setInput('token', token);
    http = TestBed.inject(HttpTestingController);
    element = fixture.nativeElement as HTMLElement;
    // The preview is a resource: the request goes out once change detection runs, and stability waits for its answer.
    TestBed.tick();
  }

  afterEach(() => http.verify());

  const type = (label: string, value: string) => {
    const field = Array.from(element.querySelectorAll('mat-form-field')).find(
      (candidate) => candidate.querySelector('mat-label')?.textContent?.trim() === label,
    );
    const input = field!.querySelector('input')!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  };
  const submit = () =>
    Array.from(element.querySelectorAll<HTMLButtonElement>('button'))
      .find((button) => button.textContent?.includes('Join the project'))!
      .click();

  it('says who invites to what, then makes the account and opens the project', async () => {
    await open('tok');
    http.expectOne({ method: 'GET', url: '/api/invitations/tok' }).flush(preview);
    await fixture.whenStable();
    const text = element.textContent?.replace(/\s+/g, ' ') ?? '';
    expect(text).toContain('Ines Halvorsen invites you to the team of Tidewater Pavilion as a reviewer.');
    expect(text).toContain('Your account will be surveyor@elsewhere.example.');
    expect(text).not.toContain('tok');

    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    type('Your name', 'Noor Castellanos');
    type('New password', 'harbour lantern thistle 42');
    type('New password again', 'harbour lantern thistle 42');
    submit();
    const accept = http.expectOne({ method: 'POST', url: '/api/invitations/tok/accept' });
    expect(accept.request.body).toEqual({ name: 'Noor Castellanos', password: 'harbour lantern thistle 42' });
    accept.flush({
      user: { id: 'u9', email: preview.email, name: 'Noor Castellanos', isAdmin: false, roles: ['reviewer'] },
      csrfToken: 'csrf',
      projectId: 'p1',
    });
    await fixture.whenStable();
    expect(TestBed.inject(AuthStore).user()?.name).toBe('Noor Castellanos');
    expect(navigate).toHaveBeenCalledWith(['/projects', 'p1']);
  });

  it('says in words why a link cannot be used, and offers the sign-in', async () => {
    await open('old');
    http.expectOne({ method: 'GET', url: '/api/invitations/old' }).flush(
      {
        error: { code: 'invitation_expired', message: 'This invitation has expired. Ask the person who invited you to send a new one.' },
      },
      { status: 410, statusText: 'Gone' },
    );
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('This invitation has expired.');
    expect(element.querySelector('form')).toBeNull();
    expect(element.querySelector('a')?.textContent).toContain('Go to sign-in');
  });

  it('keeps a refused password on the page, in the service’s words', async () => {
    await open('tok');
    http.expectOne({ method: 'GET', url: '/api/invitations/tok' }).flush(preview);
    await fixture.whenStable();
    type('Your name', 'Noor Castellanos');
    type('New password', 'password1234');
    type('New password again', 'password1234');
    submit();
    const message = 'This password is too easy to guess.';
    http
      .expectOne({ method: 'POST', url: '/api/invitations/tok/accept' })
      .flush(
        { error: { code: 'validation_failed', message, details: [{ path: 'password', message }] } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain(message);
    expect(element.querySelector('form')).not.toBeNull();
  });

  it('says a link without its token is incomplete, and asks nothing', async () => {
    await open('');
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('This link is incomplete.');
  });
});
