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
});
