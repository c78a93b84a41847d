import { MediaMatcher } from '@angular/cdk/layout';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { LuminaireTypeRecord, SpaceRecord, UnitSystem } from '../../core/api/api-types';
import { loadMath } from '../../shared/measure';
import { phoneScreen } from '../../shared/media-queries';
import { CountGrid, type CountEdit } from './count-grid';

// Invented spaces and types.
const stamp = { version: 1, updatedAt: '', updatedBy: null };
const types: LuminaireTypeRecord[] = [
  { id: 't1', tag: 'A1', description: 'Troffer', inputWatts: '30', use: 'general', basis: 'rated', ...stamp },
];
const spaces: SpaceRecord[] = [
  {
    id: 's1',
    name: 'Office 1',
    position: 1,
    area: '200',
    spaceType: 'office-enclosed',
    luminaires: [{ tag: 'A1', count: '4', luminaireTypeId: 't1' }],
    controls: [],
    windows: [],
    skylights: [],
    ...stamp,
  },
  {
    id: 's2',
    name: 'Office 2',
    position: 2,
    area: '200',
    spaceType: 'office-enclosed',
    luminaires: [],
    controls: [],
    windows: [],
    skylights: [],
    ...stamp,
  },
];

describe('CountGrid', () => {
  // mathjs, read on first use, takes a while to load in jsdom.
  beforeAll(() => loadMath().then(() => undefined), 60_000);
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

  it('reads arithmetic typed in a cell and saves the count it comes to', async () => {
    const input = cell('A1 in Office 2');
    await enter(input, '4*3');
    await vi.waitFor(() => expect(edits.map((edit) => [edit.space.id, edit.tag, edit.count])).toEqual([['s2', 'A1', '12']]));
    expect(input.value).toBe('12');
  });

  it('refuses arithmetic that comes to no whole count, keeping what was typed', async () => {
    const input = cell('A1 in Office 1');
    await enter(input, '10/4');
    await vi.waitFor(() => expect(problem()?.textContent).toContain('Must be a whole number. Enter a whole number from 0 to 1,000,000.'));
    expect(edits).toEqual([]);
    expect(input.value).toBe('10/4');
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

/** A phone held upright: only the phone's query matches (jsdom has no matchMedia of its own). */
const onPhone = {
  provide: MediaMatcher,
  useValue: {
    matchMedia: (query: string) => ({
      matches: query === phoneScreen,
      media: query,
      addListener: () => undefined,
      removeListener: () => undefined,
    }),
  },
};

describe('CountGrid on a phone', () => {
  // Invented types: a troffer, a track run without a limiter, and a circuit counted at its limiter.
  const phoneTypes: LuminaireTypeRecord[] = [
    ...types,
    {
      id: 't2',
      tag: 'T',
      description: 'Line-voltage track, 8 ft',
      inputWatts: '180',
      use: 'general',
      basis: 'line-voltage-track',
      length: '8',
      ...stamp,
    },
    {
      id: 't3',
      tag: 'L',
      description: 'Display case circuit',
      inputWatts: '0',
      use: 'display',
      basis: 'current-limited',
      limitWatts: '240',
      ...stamp,
    },
  ];
  // Office 1 keeps its four troffers; the reading room has its troffers split across two daylight zones.
  const phoneSpaces: SpaceRecord[] = [
    { ...spaces[0]!, level: 'Level 1' },
    {
      id: 's3',
      name: 'Reading room',
      position: 3,
      area: '1200',
      spaceType: 'library-in-a-reading-area',
      luminaires: [
        { tag: 'A1', count: '6', zone: 'primary-sidelit', luminaireTypeId: 't1' },
        { tag: 'A1', count: '10', luminaireTypeId: 't1' },
      ],
      controls: [],
      windows: [],
      skylights: [],
      ...stamp,
    },
  ];
  let fixture: ComponentFixture<CountGrid>;
  let element: HTMLElement;
  const edits: CountEdit[] = [];
  const opened: string[] = [];

  async function create(canEdit: boolean, units: UnitSystem = 'ip'): Promise<void> {
    edits.length = 0;
    opened.length = 0;
    TestBed.configureTestingModule({ imports: [CountGrid], providers: [provideZonelessChangeDetection(), onPhone] });
    fixture = TestBed.createComponent(CountGrid);
    fixture.componentRef.setInput('spaces', phoneSpaces);
    fixture.componentRef.setInput('types', phoneTypes);
    fixture.componentRef.setInput('canEdit', canEdit);
    fixture.componentRef.setInput('units', units);
    fixture.componentInstance.changeCount.subscribe((edit) => edits.push(edit));
    fixture.componentInstance.openSpace.subscribe((space) => opened.push(space.id));
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  const card = (name: string) =>
    Array.from(element.querySelectorAll<HTMLElement>('[role="listitem"]')).find(
      (item) => item.querySelector('h3')?.textContent?.trim() === name,
    )!;
  /** A count field by the words of its label, the way a person finds it. */
  const field = (within: HTMLElement, tag: string) => {
    const label = Array.from(within.querySelectorAll<HTMLLabelElement>('label')).find(
      (candidate) => candidate.querySelector('.field-tag')?.textContent?.trim() === tag,
    )!;
    return { label, input: label.control as HTMLInputElement | null, text: (label.textContent ?? '').replace(/\s+/g, ' ').trim() };
  };
  const problem = () => document.querySelector<HTMLElement>('.cdk-overlay-container #count-problem');

  it('lists one card per space, with its name and area and one labelled count per type, instead of the grid', async () => {
    await create(true);
    expect(element.querySelector('[role="grid"]')).toBeNull();
    expect(element.querySelectorAll('[role="listitem"]')).toHaveLength(2);
    const office = card('Office 1');
    expect(office.textContent).toContain('200 ft²');
    expect(office.textContent).toContain('Level 1 · 4 luminaires');
    const troffer = field(office, 'A1');
    expect(troffer.text).toBe('A1 Troffer 30.0 W each');
    expect(troffer.input?.value).toBe('4');
    // The type's counted watts in words (service/src/compliance/installed.ts): a track run at least its specified watts, a limited circuit at its limiter.
    expect(field(office, 'T').text).toBe('T Line-voltage track, 8 ft at least 180.0 W a run');
    expect(field(office, 'L').text).toBe('L Display case circuit 240 W a circuit (limiter rating)');
    expect(field(office, 'T').input?.value).toBe('');
  });

  it('saves a changed count as the grid does, and keeps a refused one with the reason and a way back', async () => {
    await create(true);
    const troffer = field(card('Office 1'), 'A1').input!;
    troffer.focus();
    troffer.value = '2.5';
    troffer.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    expect(problem()?.getAttribute('role')).toBe('alert');
    expect(problem()?.textContent).toContain('Must be a whole number. Enter a whole number from 0 to 1,000,000.');
    expect(troffer.getAttribute('aria-invalid')).toBe('true');
    expect(troffer.getAttribute('aria-describedby')).toBe('count-problem');
    expect(edits).toEqual([]);

    // A phone's keyboard has no Esc: the reason offers to keep the stored count.
    const keep = problem()!.querySelector<HTMLButtonElement>('button')!;
    expect(keep.textContent?.trim()).toBe('Keep 4');
    keep.click();
    await fixture.whenStable();
    expect(problem()).toBeNull();
    expect(troffer.value).toBe('4');
    expect(troffer.getAttribute('aria-invalid')).toBeNull();

    troffer.value = '5';
    troffer.dispatchEvent(new Event('change'));
    await fixture.whenStable();
    expect(edits.map((edit) => [edit.space.id, edit.tag, edit.count])).toEqual([['s1', 'A1', '5']]);
  });

  it('goes on to the next count with Enter, then to the next space', async () => {
    await create(true);
    const office = card('Office 1');
    field(office, 'L').input!.focus();
    field(office, 'L').input!.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
    await fixture.whenStable();
    // The reading room's troffers are split, so its first count to type is the track.
    expect(document.activeElement).toBe(element.querySelector('input[data-row="1"][data-column="1"]'));
    expect(document.activeElement).toBe(field(card('Reading room'), 'T').input);
  });

  it('shows a count split across daylight zones as a total to change in the space, reached from the card', async () => {
    await create(true);
    const room = card('Reading room');
    const split = field(room, 'A1');
    expect(split.input).toBeNull();
    expect(split.text).toBe('A1 Troffer 30.0 W each, split by daylight zone');
    expect(room.querySelector('.field-value')?.textContent).toContain('16');
    const zones = room.querySelector<HTMLButtonElement>('button.zones')!;
    expect(zones.getAttribute('aria-label')).toBe('Daylight zones of Reading room');
    zones.click();
    expect(opened).toEqual(['s3']);
  });

  it('shows counts without fields to a reader, and areas in m² in an SI project', async () => {
    await create(false, 'si');
    const office = card('Office 1');
    expect(office.querySelector('input')).toBeNull();
    expect(office.textContent).toContain('200 m²');
    expect(office.querySelector('.field-value')?.textContent?.trim()).toBe('4');
  });
});
