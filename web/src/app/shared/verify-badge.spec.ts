import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { VerifyBadge } from './verify-badge';

describe('VerifyBadge', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [VerifyBadge], providers: [provideZonelessChangeDetection()] }));

  it('names the source by its short citation and note, in the project units', async () => {
    const fixture = TestBed.createComponent(VerifyBadge);
    // Invented citation in the service's wording.
    fixture.componentRef.setInput('citation', {
      short: 'IECC 2021 Section C405.2.2 — Washington state text standing in for the model code',
      layer: 'other-edition-or-state',
      checked: false,
      note: 'Override controlling at most 5,000 ft².',
    });
    await fixture.whenStable();
    const badge = (fixture.nativeElement as HTMLElement).querySelector('.badge')!;
    expect(badge.textContent).toBe('verify');
    expect(badge.getAttribute('aria-label')).toBe(
      'Verify: IECC 2021 Section C405.2.2 — Washington state text standing in for the model code. Override controlling at most 5,000 ft².',
    );
    fixture.componentRef.setInput('units', 'si');
    await fixture.whenStable();
    // 5,000 ft² × 0.09290304 m²/ft² (exact) = 464.5 m².
    expect(badge.getAttribute('aria-label')).toContain('at most 464.5 m²');
  });
});
