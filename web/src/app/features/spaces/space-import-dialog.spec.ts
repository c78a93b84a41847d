import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import type { ImportAlias, SpaceTypeView } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { SpaceImportDialog, type SpaceImportData } from './space-import-dialog';

// Invented rows and schedule; the space types are rows of IECC 2021 Table C405.3.2(2), via PNNL building-energy-standards-data.
const data: SpaceImportData = {
  projectId: 'p1',
  units: 'ip',
  method: 'space-by-space',
  spaceTypes: [
    { key: 'office-enclosed', label: 'Office — Enclosed', sourceLabel: 'Office | Enclosed' },
    { key: 'emergency-vehicle-garage', label: 'Emergency Vehicle Garage', sourceLabel: 'Emergency Vehicle Garage' },
    { key: 'corridor-otherwise', label: 'Corridor — Otherwise', sourceLabel: 'Corridor | Otherwise' },
  ] as SpaceTypeView[],
  buildingAreaTypes: [],
  luminaireTags: ['A1'],
};

describe('SpaceImportDialog', () => {
  let fixture: ComponentFixture<SpaceImportDialog>;
  let http: HttpTestingController;
  let element: HTMLElement;
  const closed: unknown[] = [];

  async function open(aliases: ImportAlias[], sheets: { name: string; table: string[][] }[], mapping: (string | null)[]): Promise<void> {
    closed.length = 0;
    TestBed.configureTestingModule({
      imports: [SpaceImportDialog],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: MatDialogRef, useValue: { disableClose: false, close: (value: unknown) => closed.push(value) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SpaceImportDialog);
    element = fixture.nativeElement as HTMLElement;
    http.expectOne((request) => request.method === 'GET' && request.url === '/api/projects/p1/import-aliases').flush(aliases);
    // The workbook as the file and column steps leave it.
    const dialog = fixture.componentInstance as unknown as Record<string, { set(value: unknown): void }>;
    dialog['sheets']!.set(sheets);
    dialog['mapping']!.set(mapping);
    if (sheets.length > 1) {
      dialog['typesSheet']!.set(1);
      dialog['typeMapping']!.set(['tag', 'description', 'inputWatts', 'use']);
    }
    dialog['stage']!.set('preview');
    await fixture.whenStable();
  }

  const button = (text: string) =>
    Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find((candidate) => candidate.textContent?.includes(text))!;
  const post = () => http.expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/spaces/bulk');
  const ready = [
    ['Name', 'Space type', 'Area'],
    ['Exam 1', 'office-enclosed', '120'],
    ['Exam 2', 'office-enclosed', '110'],
  ];

  it('sends a new key with each import, and the same one again when the answer to the last was lost', async () => {
    await open([], [{ name: 'Rooms', table: ready }], ['name', 'spaceType', 'area']);
    button('Import 2 spaces').click();
    const first = post();
    const key = first.request.headers.get('Idempotency-Key');
    expect(key).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(first.request.body.spaces.map((space: { name: string }) => space.name)).toEqual(['Exam 1', 'Exam 2']);
    expect(first.request.body.luminaireTypes).toBeUndefined();
    first.error(new ProgressEvent('error'), { status: 0, statusText: '' });
    await fixture.whenStable();
    expect(element.textContent).toContain('The service cannot be reached');

    button('Import 2 spaces').click();
    const retry = post();
    expect(retry.request.headers.get('Idempotency-Key')).toBe(key);
    retry.flush([{ id: 's1' }, { id: 's2' }], { status: 201, statusText: 'Created' });
    expect(closed).toEqual([{ spaces: [{ id: 's1' }, { id: 's2' }], luminaireTypes: 0 }]);
  });

  it('starts a new key after the service refused the import', async () => {
    await open([], [{ name: 'Rooms', table: ready }], ['name', 'spaceType', 'area']);
    button('Import 2 spaces').click();
    const first = post();
    const key = first.request.headers.get('Idempotency-Key');
    first.flush({ error: { code: 'archived', message: 'This project is archived.' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    button('Import 2 spaces').click();
    const next = post();
    expect(next.request.headers.get('Idempotency-Key')).not.toBe(key);
    expect(next.request.headers.get('Idempotency-Key')).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('lets the engineer match an unknown name, remembers it for the project, and imports the types and counts with the spaces', async () => {
    const rooms = [
      ['Name', 'Space type', 'Area', 'H1', 'A1'],
      ['Bay 1', 'Apparatus bay', '3000', '10', ''],
      ['Bay 2', 'apparatus-bay', '2800', '8', ''],
      ['Hall', 'Corr', '400', '', '4'],
    ];
    const schedule = [
      ['Tag', 'Description', 'Rated input (W)', 'Use'],
      ['H1', 'High-bay', '151.5', 'General lighting'],
    ];
    await open(
      [{ name: 'Bunk room', spaceType: 'office-enclosed', buildingAreaType: null }],
      [
        { name: 'Rooms', table: rooms },
        { name: 'Luminaires', table: schedule },
      ],
      ['name', 'spaceType', 'area', 'count:H1', 'count:A1'],
    );
    expect(element.textContent).toContain('2 rows with problems');
    expect(button('Import 3 spaces').disabled).toBe(true);
    const picker = element.querySelector('al-space-import-name-picker')!;
    expect(picker.textContent).toContain('“Apparatus bay”');
    expect(picker.textContent).toContain('2 rows');
    // "Corr" needed no help: the general corridor row.
    expect(element.textContent).toContain('from “Corr”');

    const input = picker.querySelector('input')!;
    input.focus();
    input.dispatchEvent(new Event('focusin'));
    input.value = 'vehicle';
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    const options = Array.from(document.querySelectorAll<HTMLElement>('.cdk-overlay-container mat-option'));
    expect(options.map((option) => option.textContent?.trim())).toEqual(['Emergency Vehicle Garage']);
    options[0]!.click();
    await fixture.whenStable();
    expect(element.textContent).toContain('all ready to import');

    button('Import 3 spaces').click();
    const remember = http.expectOne((request) => request.method === 'PUT' && request.url === '/api/projects/p1/import-aliases');
    expect(remember.request.body).toEqual({
      aliases: [{ name: 'Apparatus bay', spaceType: 'emergency-vehicle-garage', buildingAreaType: null }],
    });
    http.expectNone((request) => request.url === '/api/projects/p1/spaces/bulk');
    remember.flush([]);
    const bulk = post();
    expect(bulk.request.body.luminaireTypes).toEqual([
      { tag: 'H1', description: 'High-bay', inputWatts: '151.5', use: 'general', basis: 'rated' },
    ]);
    expect(
      bulk.request.body.spaces.map((space: { spaceType: string; luminaires: unknown[] }) => [space.spaceType, space.luminaires]),
    ).toEqual([
      ['emergency-vehicle-garage', [{ tag: 'H1', count: '10' }]],
      ['emergency-vehicle-garage', [{ tag: 'H1', count: '8' }]],
      ['corridor-otherwise', [{ tag: 'A1', count: '4' }]],
    ]);
    bulk.flush([{ id: 's1' }, { id: 's2' }, { id: 's3' }], { status: 201, statusText: 'Created' });
    expect(closed).toEqual([{ spaces: [{ id: 's1' }, { id: 's2' }, { id: 's3' }], luminaireTypes: 1 }]);
  });

  it('applies the names the project remembered, so they need no matching again', async () => {
    await open(
      [{ name: 'APPARATUS BAY', spaceType: 'emergency-vehicle-garage', buildingAreaType: null }],
      [
        {
          name: 'Rooms',
          table: [
            ['Name', 'Space type', 'Area'],
            ['Bay 1', 'Apparatus bay', '3000'],
          ],
        },
      ],
      ['name', 'spaceType', 'area'],
    );
    expect(element.querySelector('al-space-import-name-picker')).toBeNull();
    expect(element.textContent).toContain('Emergency Vehicle Garage');
    expect(element.textContent).toContain('all ready to import');
  });

  it('puts a tag clash the service reports on the type row, and imports nothing', async () => {
    await open(
      [],
      [
        {
          name: 'Rooms',
          table: [
            ['Name', 'Space type', 'Area', 'H1'],
            ['Bay 1', 'office-enclosed', '300', '2'],
          ],
        },
        {
          name: 'Luminaires',
          table: [
            ['Tag', 'Description', 'Rated input (W)', 'Use'],
            ['H1', 'High-bay', '150', ''],
          ],
        },
      ],
      ['name', 'spaceType', 'area', 'count:H1'],
    );
    button('Import 1 space').click();
    post().flush(
      {
        error: {
          code: 'conflict',
          message: 'A luminaire type tagged "H1" already exists in this project. Nothing was imported.',
          details: [{ path: 'luminaireTypes.0.tag', message: 'Tags are unique within a project.' }],
        },
      },
      { status: 409, statusText: 'Conflict' },
    );
    await fixture.whenStable();
    expect(element.textContent).toContain('already exists in this project. Nothing was imported.');
    expect(element.querySelector('[aria-label="Luminaire types to import"] .has-problem')?.textContent).toContain(
      'Tags are unique within a project.',
    );
    expect(closed).toEqual([]);
  });
});
