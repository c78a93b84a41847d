import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { apiInterceptor } from '../../core/http/api-interceptor';
import type { InvitationView } from './invitations-api';
import { expiryWords, InvitationsPanel } from './invitations-panel';

const waiting: InvitationView = {
  id: 'i1',
  email: 'surveyor@elsewhere.example',
  role: 'contractor',
  invitedBy: 'Ines Halvorsen',
  createdAt: '2026-03-02T10:15:00Z',
  expiresAt: '2026-03-09T10:15:00Z',
  expired: false,
};
const lapsed: InvitationView = { ...waiting, id: 'i2', email: 'late@elsewhere.example', role: 'reviewer', expired: true };
const url = '/api/projects/p1/invitations';

describe('InvitationsPanel', () => {
  let fixture: ComponentFixture<InvitationsPanel>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function render(canManage: boolean, invitations: InvitationView[]) {
    TestBed.configureTestingModule({
      imports: [InvitationsPanel],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        // Dialogs close at once, so the answer reaches the panel without waiting for an animation.
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    fixture = TestBed.createComponent(InvitationsPanel);
    fixture.componentRef.setInput('projectId', 'p1');
    fixture.componentRef.setInput('canManage', canManage);
    http = TestBed.inject(HttpTestingController);
    element = fixture.nativeElement as HTMLElement;
    // The list is a resource: the request goes out once change detection runs, and stability waits for its answer.
    TestBed.tick();
    http.expectOne({ method: 'GET', url }).flush(invitations);
    await fixture.whenStable();
  }

  afterEach(() => {
    TestBed.inject(MatDialog).closeAll();
    http.verify();
  });

  const button = (label: string, within: ParentNode = element) =>
    Array.from(within.querySelectorAll<HTMLButtonElement>('button')).find((candidate) => candidate.textContent?.includes(label));

  it('lists each waiting invitation in words: address, role, who invited, and when it ends', async () => {
    await render(false, [waiting, lapsed]);
    const items = Array.from(element.querySelectorAll('li')).map((item) => item.textContent?.replace(/\s+/g, ' ').trim());
    expect(items[0]).toContain('surveyor@elsewhere.example');
    expect(items[0]).toContain('Contractor');
    expect(items[0]).toContain('Invited by Ines Halvorsen');
    expect(items[0]).toContain(expiryWords(waiting));
    expect(items[1]).toContain('the link no longer works');
    // A reader sees them, but neither the form nor a withdrawal.
    expect(element.querySelector('form')).toBeNull();
    expect(button('Withdraw')).toBeUndefined();
    expect(element.textContent).not.toMatch(/i1|expired:|contractor\b/);
  });

  it('says when nothing waits', async () => {
    await render(true, []);
    expect(element.textContent).toContain('No invitation is waiting for an answer.');
  });

  it('sends an invitation, and tells when the address joined at once instead', async () => {
    await render(true, []);
    const input = element.querySelector<HTMLInputElement>('input[type="email"]')!;
    input.value = 'surveyor@elsewhere.example';
    input.dispatchEvent(new Event('input'));
    button('Send the invitation')!.click();
    const sent = http.expectOne({ method: 'POST', url });
    expect(sent.request.body).toEqual({ email: 'surveyor@elsewhere.example', role: 'reviewer' });
    sent.flush({ outcome: 'invited', invitation: waiting, invitations: [waiting] });
    await fixture.whenStable();
    expect(element.querySelector('[role="status"]')?.textContent).toBe('An invitation is on its way to surveyor@elsewhere.example.');
    expect(element.querySelectorAll('li').length).toBe(1);
    expect(input.value).toBe('');

    const joined: unknown[] = [];
    fixture.componentInstance.joined.subscribe(() => joined.push(true));
    input.value = 'contractor@alderbay.example';
    input.dispatchEvent(new Event('input'));
    button('Send the invitation')!.click();
    http
      .expectOne({ method: 'POST', url })
      .flush({ outcome: 'added', name: 'Noor Abernathy', email: 'contractor@alderbay.example', role: 'reviewer' });
    await fixture.whenStable();
    expect(element.querySelector('[role="status"]')?.textContent).toContain(
      'Noor Abernathy has an account already, so they are on the team now as reviewer',
    );
    expect(joined).toEqual([true]);
  });

  it('shows a refusal on the field', async () => {
    await render(true, [waiting]);
    const input = element.querySelector<HTMLInputElement>('input[type="email"]')!;
    input.value = 'surveyor@elsewhere.example';
    input.dispatchEvent(new Event('input'));
    button('Send the invitation')!.click();
    http.expectOne({ method: 'POST', url }).flush(
      {
        error: {
          code: 'conflict',
          message: 'This address has an invitation waiting already. Withdraw it first to send a new one.',
          details: [{ path: 'email', message: 'Invited already.' }],
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(element.querySelector('mat-error')?.textContent).toContain('Invited already.');
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('Withdraw it first');
  });

  it('withdraws only after the question is answered yes', async () => {
    await render(true, [waiting]);
    button('Withdraw')!.click();
    await fixture.whenStable();
    const dialog = document.querySelector('mat-dialog-container')!;
    expect(dialog.textContent).toContain('Withdraw the invitation of surveyor@elsewhere.example?');
    button('Keep it', dialog)!.click();
    await fixture.whenStable();
    http.expectNone({ method: 'DELETE' });

    button('Withdraw')!.click();
    await fixture.whenStable();
    button('Withdraw the invitation', document.querySelector('mat-dialog-container')!)!.click();
    await fixture.whenStable();
    http.expectOne({ method: 'DELETE', url: `${url}/i1` }).flush([]);
    await fixture.whenStable();
    expect(element.querySelector('[role="status"]')?.textContent).toBe('The invitation of surveyor@elsewhere.example is withdrawn.');
    expect(element.querySelectorAll('li').length).toBe(0);
  });
});
