import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TeamEditor, type TeamEntry } from './team-editor';

describe('TeamEditor', () => {
  const members: TeamEntry[] = [
    { userId: 'u1', name: 'Ines Halvorsen', email: 'engineer@alderbay.example', role: 'engineer' },
    { userId: 'u2', name: 'Dario Quint', email: 'reviewer@alderbay.example', role: 'reviewer' },
  ];

  function render(canManage: boolean) {
    TestBed.configureTestingModule({ imports: [TeamEditor], providers: [provideZonelessChangeDetection()] });
    const fixture = TestBed.createComponent(TeamEditor);
    fixture.componentRef.setInput('members', members);
    fixture.componentRef.setInput('canManage', canManage);
    fixture.detectChanges();
    return fixture;
  }

  it('lists each member with the role in words', () => {
    const text = (render(false).nativeElement as HTMLElement).textContent ?? '';
    expect(text).toContain('Ines Halvorsen');
    expect(text).toContain('Engineer (designer of record)');
    expect(text).toContain('Reviewer (plan reviewer or commissioning agent)');
  });

  it('offers no changes to a reader', () => {
    const element = render(false).nativeElement as HTMLElement;
    expect(element.querySelector('form')).toBeNull();
    expect(element.querySelector('button')).toBeNull();
  });

  it('never offers to remove the only engineer', () => {
    const element = render(true).nativeElement as HTMLElement;
    const removeLabels = Array.from(element.querySelectorAll('li button')).map((button) => button.getAttribute('aria-label'));
    expect(removeLabels).toEqual(['Remove Dario Quint']);
  });

  it('checks the e-mail before emitting an addition', async () => {
    const fixture = render(true);
    const emitted: unknown[] = [];
    fixture.componentInstance.added.subscribe((entry) => emitted.push(entry));
    const element = fixture.nativeElement as HTMLElement;
    const input = element.querySelector<HTMLInputElement>('input[type="email"]')!;
    input.value = 'not-an-address';
    input.dispatchEvent(new Event('input'));
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    fixture.detectChanges();
    await fixture.whenStable();
    expect(emitted).toEqual([]);
    expect(element.querySelector('mat-error')?.textContent).toContain('valid e-mail');

    input.value = 'contractor@alderbay.example';
    input.dispatchEvent(new Event('input'));
    element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
    expect(emitted).toEqual([{ email: 'contractor@alderbay.example', role: 'reviewer' }]);
  });

  it('keeps an address the team did not take, says so beside the field, and empties the field once the person is on the team', async () => {
    const fixture = render(true);
    const element = fixture.nativeElement as HTMLElement;
    const input = element.querySelector<HTMLInputElement>('input[type="email"]')!;
    const submit = async (address: string) => {
      input.value = address;
      input.dispatchEvent(new Event('input'));
      element.querySelector<HTMLButtonElement>('button[type="submit"]')!.click();
      await fixture.whenStable();
    };
    const notice = () => element.querySelector('[role="status"]')?.textContent?.trim();

    // The team came back without the address: the service does not say why, and neither do we.
    await submit('newcomer@alderbay.example');
    fixture.componentRef.setInput('members', [...members]);
    fixture.componentRef.setInput('notAdded', 'newcomer@alderbay.example');
    await fixture.whenStable();
    expect(input.value).toBe('newcomer@alderbay.example');
    expect(notice()).toBe(
      'No one was added for that address. Check it, or invite the person by e-mail on the Set-up page: the invitation makes their account.',
    );
    expect(element.textContent).not.toMatch(/no account|does not exist|unknown/i);

    input.value = 'contractor@alderbay.example';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(notice()).toBe('');

    await submit('contractor@alderbay.example');
    fixture.componentRef.setInput('notAdded', null);
    fixture.componentRef.setInput('members', [
      ...members,
      { userId: 'u3', name: 'Noor Abernathy', email: 'contractor@alderbay.example', role: 'reviewer' },
    ]);
    await fixture.whenStable();
    expect(input.value).toBe('');
    expect(element.querySelector('mat-error')).toBeNull();
  });
});
