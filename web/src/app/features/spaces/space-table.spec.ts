import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import type { ProjectDetail, SpaceRecord, SpaceTypeView } from '../../core/api/api-types';
import { evaluated, type SpecDocument } from '../../../testing/evaluate';
import { reviewItem } from '../../../testing/review-items';
import { ProjectStore } from '../workspace/project-store';
import { groupByLevel, spaceStatus } from './space-rows';
import { SpacesPage } from './spaces-page';

// Invented demo project and spaces.
const project = {
  id: 'p1',
  name: 'Harbour Pavilion',
  state: 'draft',
  role: 'engineer',
  edition: 'iecc-2021',
  method: 'space-by-space',
  units: 'ip',
  version: 1,
  members: [],
} as unknown as ProjectDetail;

function space(id: string, name: string, level: string | undefined, position: number, area: string, spaceType: string): SpaceRecord {
  return {
    id,
    name,
    level,
    position,
    area,
    spaceType,
    luminaires: [],
    controls: [],
    windows: [],
    skylights: [],
    version: 1,
    updatedAt: '',
    updatedBy: null,
  };
}

const spaces = [
  space('s1', 'Reading room', 'Level 2', 1, '1200', 'library-reading'),
  space('s2', 'Office 101', 'Level 1', 2, '200', 'office-enclosed'),
  space('s3', 'Store 102', 'Level 1', 3, '100', 'storage'),
];

// IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data (the calculation tests' edition, test/calc/fixtures.ts):
// library reading area 0.96 W/ft², office enclosed 0.74, storage room 0.38. Installed watts are invented.
const spaceTypes = [
  { key: 'library-reading', label: 'Library — In a Reading area', category: 'building-specific', lpdWPerFt2: '0.96', verified: true },
  { key: 'office-enclosed', label: 'Office — Enclosed', category: 'common', lpdWPerFt2: '0.74', verified: true },
  { key: 'storage', label: 'Storage Room', category: 'common', lpdWPerFt2: '0.38', verified: true },
] as SpaceTypeView[];

/** The three spaces with 10 W troffers: 1,000 W, 240 W and 20 W installed; `change` alters one space. */
function designOf(change: (space: SpecDocument['spaces'][number]) => SpecDocument['spaces'][number] = (space) => space): SpecDocument {
  const counts: Record<string, string> = { s1: '100', s2: '24', s3: '2' };
  return {
    edition: 'iecc-2021',
    method: 'space-by-space',
    units: 'ip',
    luminaireTypes: [{ tag: 'A', description: 'Troffer', inputWatts: '10', use: 'general' }],
    spaces: spaces.map((entry) =>
      change({
        id: entry.id,
        name: entry.name,
        area: entry.area,
        spaceType: entry.spaceType,
        luminaires: [{ tag: 'A', count: counts[entry.id]! }],
      }),
    ),
  };
}

// 0.96 × 1200 = 1152 W; 0.74 × 200 = 148 W; 0.38 × 100 = 38 W.
const evaluation = evaluated(designOf());

describe('the space table', () => {
  let fixture: ComponentFixture<SpacesPage>;
  let store: ProjectStore;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      imports: [SpacesPage],
      providers: [provideZonelessChangeDetection(), provideHttpClient(), provideHttpClientTesting(), provideRouter([]), ProjectStore],
    });
    store = TestBed.inject(ProjectStore);
    store.seed({ project });
    store.seed({ spaces });
    store.seed({ tables: { spaceTypes, buildingAreaTypes: [], controlStrategies: [], exteriorApplications: [], lightingZones: [] } });
    store.seed({ results: { status: 'ready', result: evaluation } });
    fixture = TestBed.createComponent(SpacesPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const rowText = (name: string) =>
    Array.from(element.querySelectorAll('[role="row"]'))
      .find((row) => row.textContent?.includes(name))
      ?.textContent?.replace(/\s+/g, ' ') ?? '';

  it('flattens levels and spaces into one list, levels in the order first entered', () => {
    expect(groupByLevel(spaces).map((row) => (row.kind === 'level' ? `# ${row.level} (${row.count})` : row.space.name))).toEqual([
      '# Level 2 (1)',
      'Reading room',
      '# Level 1 (2)',
      'Office 101',
      'Store 102',
    ]);
  });

  it('renders level headers and spaces with their type, watts and status in icon and words', () => {
    const headers = Array.from(element.querySelectorAll('.row.level .level-name')).map((cell) => cell.textContent?.trim());
    expect(headers).toEqual(['Level 2', 'Level 1']);
    expect(rowText('Reading room')).toContain('Library — In a Reading area');
    expect(rowText('Reading room')).toContain('Within allowance, 152 W (13.2 %) to spare');
    expect(rowText('Office 101')).toContain('Over allowance by 92 W');
    const over = Array.from(element.querySelectorAll('.status.over'));
    expect(over.length).toBe(1);
    expect(over[0]!.querySelector('mat-icon')?.textContent?.trim()).toBe('warning');
    expect(element.querySelector('.status.within mat-icon')?.textContent?.trim()).toBe('check_circle');
    expect(element.textContent).toContain('Installed (W)');
    expect(element.textContent).toContain('Area (ft²)');
  });

  it('says a space without luminaires has none entered, and a confirmed one is unlit, never "to spare"', async () => {
    // Store 102 has no luminaires yet, Office 101 is confirmed unlit.
    const result = evaluated(
      designOf((entry) =>
        entry.id === 's2' ? { ...entry, luminaires: [], unlit: true } : entry.id === 's3' ? { ...entry, luminaires: [] } : entry,
      ),
    );
    store.seed({ results: { status: 'ready', result } });
    await fixture.whenStable();
    expect(rowText('Store 102')).toContain('No luminaires entered');
    expect(rowText('Store 102')).not.toContain('to spare');
    expect(rowText('Office 101')).toContain('Unlit (confirmed)');
    expect(rowText('Office 101')).not.toContain('Within allowance');
  });

  it('opens the space a link names, ready at the field to fix', async () => {
    fixture.componentRef.setInput('space', 's2');
    fixture.componentRef.setInput('field', 'area');
    await fixture.whenStable();
    const dialog = document.querySelector('mat-dialog-container')!;
    expect(dialog).not.toBeNull();
    expect(dialog.querySelector<HTMLInputElement>('input[formcontrolname="name"]')?.value).toBe('Office 101');
    TestBed.inject(MatDialog).closeAll();
  });

  it('says how many like rooms an entry stands for where it is more than one', async () => {
    store.seed({ spaces: [{ ...spaces[1]!, rooms: '12' }, { ...spaces[2]!, rooms: '1' }, spaces[0]!] });
    await fixture.whenStable();
    // Whitespace as the browser shows it: runs of it collapse to one space.
    expect(element.querySelector('[data-space-id="s2"] .name')?.textContent?.replace(/\s+/g, ' ')).toContain('Office 101 × 12 rooms');
    expect(element.querySelector('[data-space-id="s3"] .name')?.textContent).not.toContain('rooms');
    expect(element.querySelector('[data-space-id="s1"] .name')?.textContent).not.toContain('rooms');
  });

  it('gives no verdict while the results are updating', async () => {
    store.seed({ results: { status: 'updating', previous: evaluation } });
    await fixture.whenStable();
    expect(element.querySelectorAll('.status.within, .status.over').length).toBe(0);
    expect(rowText('Office 101')).toContain('Updating…');
    expect(spaceStatus(evaluation.interior.spaces[1]!, 'updating')).toEqual({ kind: 'updating' });
  });

  it('renders only the rows in view when the project has 5,000 spaces', async () => {
    const many = Array.from({ length: 5000 }, (_, index) =>
      space(`m${index}`, `Room ${index}`, `Level ${Math.floor(index / 500) + 1}`, index, '100', 'office-enclosed'),
    );
    store.seed({ spaces: many });
    await fixture.whenStable();
    const rendered = element.querySelectorAll('cdk-virtual-scroll-viewport [role="row"]').length;
    expect(rendered).toBeGreaterThan(0);
    expect(rendered).toBeLessThan(100);
    expect(element.querySelector('[role="table"]')?.getAttribute('aria-rowcount')).toBe(String(5000 + 10 + 1));
  });

  it('deletes a space and brings it back with its id on Undo', async () => {
    const http = TestBed.inject(HttpTestingController);
    element.querySelector<HTMLButtonElement>('button[aria-label="More for Store 102"]')!.click();
    await fixture.whenStable();
    const remove = Array.from(document.querySelectorAll<HTMLButtonElement>('.mat-mdc-menu-item')).find((item) =>
      item.textContent?.includes('Delete'),
    )!;
    remove.click();
    const deletion = http.expectOne((request) => request.method === 'DELETE' && request.url === '/api/projects/p1/spaces/s3');
    expect(deletion.request.params.get('version')).toBe('1');
    deletion.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(store.spaces().map((kept) => kept.id)).toEqual(['s1', 's2']);

    const undo = Array.from(document.querySelectorAll<HTMLButtonElement>('.mat-mdc-snack-bar-container button')).find((button) =>
      button.textContent?.includes('Undo'),
    )!;
    expect(document.querySelector('.mat-mdc-snack-bar-container')?.textContent).toContain('Space “Store 102” deleted');
    undo.click();
    // The restore route, not a new space: the same id keeps its history and the counts that name it.
    http.expectNone((request) => request.method === 'POST' && request.url === '/api/projects/p1/spaces');
    const restore = http.expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/spaces/s3/restore');
    restore.flush(spaces[2]!, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(store.spaces().map((kept) => kept.id)).toEqual(['s1', 's2', 's3']);
    expect(rowText('Store 102')).toContain('Storage Room');
  });

  it('shows edit actions to the engineer and none to a reader', async () => {
    expect(element.querySelector('button[aria-label="Edit Office 101"]')).not.toBeNull();
    expect(element.textContent).toContain('Add space');
    store.seed({ project: { ...project, role: 'reviewer' } });
    await fixture.whenStable();
    expect(element.querySelector('button[aria-label="Edit Office 101"]')).toBeNull();
    expect(element.querySelector('button[aria-label="More for Office 101"]')).toBeNull();
    expect(element.textContent).not.toContain('Add space');
    expect(element.textContent).not.toContain('Import spreadsheet');
  });

  it('shows the engineer the editing disabled while the design is in review, and marks a space with items that need revision', async () => {
    store.seed({
      project: { ...project, state: 'in-review' },
      reviewItems: [
        reviewItem('i1', { spaceId: 's2', verdict: 'needs-revision' }),
        reviewItem('i2', { spaceId: 's1', verdict: 'confirmed' }),
      ],
    });
    await fixture.whenStable();
    const add = Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find((button) =>
      button.textContent?.includes('Add space'),
    );
    expect(add?.disabled).toBe(true);
    expect(element.querySelector('button[aria-label="Edit Office 101"]')).toBeNull();
    expect(rowText('Office 101')).toContain('1 item needs revision');
    expect(rowText('Reading room')).not.toContain('needs revision');
  });
});
