import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { SignInPage } from './sign-in-page';

describe('SignInPage', () => {
  let fixture: ComponentFixture<SignInPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [SignInPage],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    fixture = TestBed.createComponent(SignInPage);
    http = TestBed.inject(HttpTestingController);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  function type(selector: string, value: string): void {
    const input = element.querySelector<HTMLInputElement>(selector)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  async function submit(): Promise<void> {
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    fixture.detectChanges();
    await fixture.whenStable();
  }

  it('shows a message beside each empty field and sends nothing', async () => {
    await submit();
    const errors = Array.from(element.querySelectorAll('mat-error')).map((node) => node.textContent?.trim());
    expect(errors).toEqual(['Enter your e-mail address.', 'Enter your password.']);
    http.expectNone('/api/auth/login');
  });

  it('says when the e-mail address is not valid', async () => {
    type('input[type="email"]', 'not-an-address');
    type('input[autocomplete="current-password"]', 'secret');
    await submit();
    expect(element.querySelector('mat-error')?.textContent?.trim()).toBe('Enter a valid e-mail address.');
    http.expectNone('/api/auth/login');
  });

  it('signs in with valid input and goes to the return URL', async () => {
    const router = TestBed.inject(Router);
    const navigate = vi.spyOn(router, 'navigateByUrl').mockResolvedValue(true);
    fixture.componentRef.setInput('returnUrl', '/projects/1');
    type('input[type="email"]', 'engineer@alderbay.example');
    type('input[autocomplete="current-password"]', 'secret');
    await submit();

    const request = http.expectOne('/api/auth/login');
    expect(request.request.body).toEqual({ email: 'engineer@alderbay.example', password: 'secret' });
    request.flush({
      user: { id: 'u1', email: 'engineer@alderbay.example', name: 'Ines Halvorsen', isAdmin: false, roles: ['engineer'] },
      csrfToken: 'token',
    });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith('/projects/1');
  });

  it('shows the service message when the password is wrong, and never follows an outside return URL', async () => {
    fixture.componentRef.setInput('returnUrl', '//elsewhere.example');
    type('input[type="email"]', 'engineer@alderbay.example');
    type('input[autocomplete="current-password"]', 'wrong');
    await submit();
    http
      .expectOne('/api/auth/login')
      .flush(
        { error: { code: 'invalid_credentials', message: 'The e-mail or password is not correct.' } },
        { status: 401, statusText: 'Unauthorized' },
      );
    fixture.detectChanges();
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The e-mail or password is not correct.');
  });
});
