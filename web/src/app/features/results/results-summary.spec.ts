import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { ResultsSummary, unmetControls } from './results-summary';
import { evaluation } from './results-fixture';

describe('ResultsSummary', () => {
  let fixture: ComponentFixture<ResultsSummary>;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [ResultsSummary], providers: [provideZonelessChangeDetection(), provideRouter([])] });
    fixture = TestBed.createComponent(ResultsSummary);
    fixture.componentRef.setInput('result', evaluation());
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const text = (selector: string) => element.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

  it('shows the totals rounded for display: watts to 1 W, margin to 0.1 %', () => {
    const figures = text('.figures');
    expect(figures).toContain('1,500 W');
    expect(figures).toContain('1,330 W');
    expect(figures).toContain('25 W');
    expect(figures).toContain('170 W · 11.3 %');
  });

  it('gives the verdict in an icon and words, with what fails', () => {
    const verdict = element.querySelector('.verdict')!;
    expect(verdict.querySelector('mat-icon')?.textContent).toBe('warning');
    expect(verdict.textContent).toContain('Does not comply: 1 control requirement outstanding');
    expect(text('.figures')).toContain('Within allowance, 170 W (11.3 %) to spare');
  });

  it('lists each unmet control requirement with a link to its space on the Controls page', () => {
    const items = Array.from(element.querySelectorAll('.unmet li'));
    expect(items).toHaveLength(1);
    expect(items[0].textContent).toContain('Not met');
    const link = items[0].querySelector('a')!;
    expect(link.textContent).toContain('Storage: Light-reduction control');
    expect(link.getAttribute('href')).toContain('controls?space=s2');
    expect(unmetControls(evaluation()).map((item) => item.spaceId)).toEqual(['s2']);
  });

  it('shows each level with its status, the excess in watts where over', () => {
    const rows = Array.from(element.querySelectorAll('.levels tbody tr')).map((row) => row.textContent?.replace(/\s+/g, ' '));
    expect(rows[0]).toContain('Within allowance, 200 W to spare');
    expect(rows[1]).toContain('Over allowance, 30 W over');
  });

  it('lists the unverified values with their badge and source', () => {
    expect(text('.unverified')).toContain('Invented value');
    expect(element.querySelector('.unverified al-verify-badge')).not.toBeNull();
    expect(text('.unverified')).toContain('Source: from memory');
  });

  it('withholds the verdict while results are being recomputed', async () => {
    fixture.componentRef.setInput('updating', true);
    await fixture.whenStable();
    const verdict = text('.verdict');
    expect(verdict).toContain('Verdict withheld: results are being recomputed');
    expect(verdict).not.toContain('Does not comply');
    expect(element.textContent).not.toContain('Within allowance');
    expect(element.textContent).not.toContain('Over allowance');
  });
});
