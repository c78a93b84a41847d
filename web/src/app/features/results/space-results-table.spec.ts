import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { invented, spaceResult } from './results-fixture';
import { SpaceResultsTable } from './space-results-table';

describe('SpaceResultsTable', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [SpaceResultsTable], providers: [provideZonelessChangeDetection()] }));

  it('says a space without luminaires has none entered, with no margin, and a confirmed one is unlit', async () => {
    const fixture = TestBed.createComponent(SpaceResultsTable);
    // Invented spaces: one with luminaires, one waiting for them, one confirmed unlit.
    fixture.componentRef.setInput('spaces', [
      spaceResult({}),
      spaceResult({ id: 's2', name: 'Storage', installedW: '0', marginW: '500', marginPct: '100', lighting: 'none-entered' }),
      spaceResult({ id: 's3', name: 'Shaft', allowanceW: '0', installedW: '0', marginW: '0', marginPct: null, lighting: 'unlit' }),
    ]);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const row = (name: string) =>
      Array.from(element.querySelectorAll('tr.mat-mdc-row')).find((entry) => entry.textContent?.includes(name))!;
    expect(row('Storage').textContent).toContain('No luminaires entered');
    expect(row('Storage').textContent).not.toContain('to spare');
    expect(row('Storage').textContent).not.toContain('100.0');
    expect(row('Shaft').textContent).toContain('Unlit (confirmed)');
    expect(row('Reading room').textContent).toContain('Within allowance');
    // The margin and the status stay in view when the table scrolls sideways.
    const sticky = Array.from(element.querySelectorAll('th.mat-mdc-table-sticky')).map((cell) => cell.textContent?.trim());
    expect(sticky).toEqual(expect.arrayContaining(['Space', 'Margin (W)', 'Margin (%)', 'Status']));
  });

  it('marks a row whose figures rest on an unverified value, named by id in the result’s list', async () => {
    const fixture = TestBed.createComponent(SpaceResultsTable);
    const control = { ...invented, id: 'Control strategy: Occupant sensor', what: 'Control strategy: Occupant sensor' };
    fixture.componentRef.setInput('spaces', [
      spaceResult({ unverified: [invented.id, control.id] }),
      spaceResult({ id: 's2', name: 'Storage', unverified: [] }),
    ]);
    fixture.componentRef.setInput('unverifiedValues', [invented, control]);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const row = (name: string) =>
      Array.from(element.querySelectorAll('tr.mat-mdc-row')).find((entry) => entry.textContent?.includes(name))!;
    const badge = row('Reading room').querySelector('al-verify-badge .badge')!;
    // The row's figures rest on the invented value; the control's value belongs to the Controls page.
    expect(badge.getAttribute('aria-label')).toContain(`Invented value: ${invented.citation.short}`);
    expect(badge.getAttribute('aria-label')).not.toContain('Occupant sensor');
    expect(row('Storage').querySelector('al-verify-badge')).toBeNull();
  });
});
