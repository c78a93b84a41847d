import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { exitSign, libraryAnnex, readingRoom, storageRoom, troffer, type SpecLuminaireType } from '../../../testing/demo-building';
import { evaluated, spaceOf } from '../../../testing/evaluate';
import { SpaceResultsTable } from './space-results-table';

describe('SpaceResultsTable', () => {
  beforeEach(() => TestBed.configureTestingModule({ imports: [SpaceResultsTable], providers: [provideZonelessChangeDetection()] }));

  // The row whose name cell starts with the space's name (the cell goes on with the space type's name).
  const rowOf = (element: HTMLElement, name: string) =>
    Array.from(element.querySelectorAll('tr.mat-mdc-row')).find((entry) =>
      entry.querySelector('td.name')?.textContent?.trim().startsWith(name),
    )!;

  it('says a space without luminaires has none entered, with no margin, and a confirmed one is unlit', async () => {
    // The invented library annex (testing/demo-building.ts) with its storage room's luminaires not yet entered,
    // and an invented shaft confirmed unlit.
    const result = evaluated(
      libraryAnnex([
        readingRoom,
        { ...storageRoom, luminaires: [] },
        { id: 's3', name: 'Shaft', level: 'Level 2', spaceType: 'storage', area: '50', unlit: true },
      ]),
    );
    const storage = spaceOf(result, storageRoom.id);
    expect([spaceOf(result, readingRoom.id).lighting, storage.lighting, spaceOf(result, 's3').lighting]).toEqual([
      'entered',
      'none-entered',
      'unlit',
    ]);
    const fixture = TestBed.createComponent(SpaceResultsTable);
    fixture.componentRef.setInput('spaces', result.interior.spaces);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const row = (name: string) => rowOf(element, name);
    expect(row('Storage').textContent).toContain('No luminaires entered');
    expect(row('Storage').textContent).not.toContain('to spare');
    // With nothing installed the whole allowance is a margin of 100 %, which means nothing yet: it is not shown.
    expect(storage.marginPct).toBe('100');
    expect(row('Storage').textContent).not.toContain('100.0');
    expect(row('Shaft').textContent).toContain('Unlit (confirmed)');
    expect(row('Reading room').textContent).toContain('Within allowance');
    // The margin and the status stay in view when the table scrolls sideways.
    const sticky = Array.from(element.querySelectorAll('th.mat-mdc-table-sticky')).map((cell) => cell.textContent?.trim());
    expect(sticky).toEqual(expect.arrayContaining(['Space', 'Margin (W)', 'Margin (%)', 'Status']));
  });

  it('marks a row whose figures rest on an unverified value, named by id in the result’s list', async () => {
    // The invented library annex with a 4 ft line-voltage track added to the reading room: the calculation tests' IECC 2021
    // edition counts it at the greater of its 50 W and 30 W/ft × 4 ft, a rule it marks unverified
    // ([S-ed] ASHRAE 90.1 §9.1.4(c); the IECC 2021 track rule not found).
    const track: SpecLuminaireType = {
      tag: 'T',
      description: 'Track',
      inputWatts: '50',
      use: 'general',
      basis: 'line-voltage-track',
      length: '4',
    };
    const result = evaluated(
      libraryAnnex([{ ...readingRoom, luminaires: [...(readingRoom.luminaires ?? []), { tag: 'T', count: '1' }] }, storageRoom], {
        luminaireTypes: [troffer, exitSign, track],
      }),
    );
    const trackRule = result.unverifiedValues.find((value) => value.what.startsWith('Line-voltage track'))!;
    const reading = spaceOf(result, readingRoom.id);
    // Both rows also rest on unverified control values, which belong to the Controls page.
    expect(reading.unverified).toContain(trackRule.id);
    const controlValue = result.unverifiedValues.find((value) => value.what.startsWith('Control strategy:'))!;
    expect(reading.unverified).toContain(controlValue.id);
    expect(spaceOf(result, storageRoom.id).unverified).toContain(controlValue.id);

    const fixture = TestBed.createComponent(SpaceResultsTable);
    fixture.componentRef.setInput('spaces', result.interior.spaces);
    fixture.componentRef.setInput('unverifiedValues', result.unverifiedValues);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const badge = rowOf(element, 'Reading room').querySelector('al-verify-badge .badge')!;
    expect(badge.getAttribute('aria-label')).toBe(`Verify: ${trackRule.what}: ${trackRule.citation.short}`);
    expect(badge.getAttribute('aria-label')).not.toContain(controlValue.what);
    expect(rowOf(element, 'Storage').querySelector('al-verify-badge')).toBeNull();
  });
});
