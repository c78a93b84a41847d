import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { LuminaireTypeRecord, SpaceRecord } from '../../core/api/api-types';
import { CountGrid, type CountEdit } from './count-grid';

// Invented spaces and types.
const stamp = { version: 1, updatedAt: '', updatedBy: null };
const types: LuminaireTypeRecord[] = [{ id: 't1', tag: 'A1', description: 'Troffer', inputWatts: '30', use: 'general', basis: 'rated', ...stamp }];
const spaces: SpaceRecord[] = [
  { id: 's1', name: 'Office 1', position: 1, area: '200', spaceType: 'office-enclosed', luminaires: [{ tag: 'A1', count: '4', luminaireTypeId: 't1' }], controls: [], windows: [], skylights: [], ...stamp },
  { id: 's2', name: 'Office 2', position: 2, area: '200', spaceType: 'office-enclosed', luminaires: [], controls: [], windows: [], skylights: [], ...stamp },
];

describe('CountGrid', () => {
  let fixture: ComponentFixture<CountGrid>;
  let element: HTMLElement;
  const edits: CountEdit[] = [];

  beforeEach(async () => {
    edits.length = 0;
    TestBed.configureTestingModule({ imports: [CountGrid], providers: [provideZonelessChangeDetection()] });
    fixture = TestBed.createComponent(CountGrid);
    fixture.componentRef.setInput('spaces', spaces);
    fixture.componentRef.setInput('types', types);
    fixture.componentRef.setInput('canEdit', true);
    fixture.componentInstance.changeCount.subscribe((edit) => edits.push(edit));
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const cell = (label: string) => element.querySelector<HTMLInputElement>(`input[aria-label="${label}"]`)!;
  const problem = () => document.querySelector<HTMLElement>('.cdk-overlay-container #count-problem');

  async function enter(input: HTMLInputElement, text: string): Promise<void> {
    input.focus();
    input.value = text;
    input.dispatchEvent(new Event('change'));
    await fixture.whenStable();
  }

  it.each([
    ['-2', 'Must not be negative. Enter a whole number from 0 to 1,000,000.'],
    ['2.5', 'Must be a whole number. Enter a whole number from 0 to 1,000,000.'],
    ['four', '“four” is not a number. Enter a whole number from 0 to 1,000,000.'],
    ['2000000', 'Out of range. Enter a whole number from 0 to 1,000,000.'],
  ])('keeps a refused %s in the cell and says why beside it, without saving', async (text, message) => {
    const input = cell('A1 in Office 1');
    await enter(input, text);
    expect(problem()?.getAttribute('role')).toBe('alert');
    expect(problem()?.textContent).toContain(message);
    expect(problem()?.textContent).toContain('Esc keeps 4.');
    expect(input.value).toBe(text);
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(input.getAttribute('aria-describedby')).toBe('count-problem');
    expect(edits).toEqual([]);
  });

  it('puts the stored count back on Esc, and clears the reason once a good count is entered', async () => {
    const input = cell('A1 in Office 1');
    await enter(input, '2.5');
    input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Escape' }));
    await fixture.whenStable();
    expect(problem()).toBeNull();
    expect(input.value).toBe('4');
    expect(input.getAttribute('aria-invalid')).toBeNull();

    const other = cell('A1 in Office 2');
    await enter(other, 'x');
    expect(problem()?.textContent).toContain('Esc keeps no count.');
    await enter(other, '3');
    expect(problem()).toBeNull();
    expect(edits.map((edit) => [edit.space.id, edit.tag, edit.count])).toEqual([['s2', 'A1', '3']]);
  });
});
