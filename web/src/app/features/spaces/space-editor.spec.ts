import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { EMPTY } from 'rxjs';
import type { BuildingAreaTypeView, ComplianceMethod, SpaceRecord, SpaceTypeView, UnitSystem } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { SpaceEditor, type SpaceEditorData } from './space-editor';

// IECC 2021 Tables C405.3.2(1) and C405.3.2(2), via PNNL building-energy-standards-data: library 0.78 W/ft² (building
// area); library reading area 0.96 W/ft², storage room 0.38 W/ft² (space by space). The rooms are invented.
const spaceTypes = [
  {
    key: 'library-in-a-reading-area',
    label: 'Library — In a Reading area',
    sourceLabel: 'Library | In a Reading area',
    category: 'building-specific',
    lpdWPerFt2: '0.96',
    verified: true,
  },
  { key: 'storage-room', label: 'Storage Room', sourceLabel: 'Storage Room', category: 'common', lpdWPerFt2: '0.38', verified: true },
] as SpaceTypeView[];
const buildingAreaTypes = [
  { key: 'library', label: 'Library', sourceLabel: 'Library', lpdWPerFt2: '0.78', verified: true },
] as BuildingAreaTypeView[];
const stamp = { version: 4, updatedAt: '', updatedBy: null };

function room(fields: Partial<SpaceRecord>): SpaceRecord {
  return {
    id: 's1',
    name: 'Reading room',
    position: 1,
    area: '1200',
    luminaires: [],
    controls: [],
    windows: [],
    skylights: [],
    ...stamp,
    ...fields,
  };
}

describe('SpaceEditor', () => {
  let fixture: ComponentFixture<SpaceEditor>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(method: ComplianceMethod, space: SpaceRecord | null, units: UnitSystem = 'ip'): Promise<void> {
    const data: SpaceEditorData = {
      projectId: 'p1',
      space,
      method,
      units,
      spaceTypes,
      buildingAreaTypes,
      levels: [],
      reload: () => undefined,
    };
    TestBed.configureTestingModule({
      imports: [SpaceEditor],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        { provide: MAT_DIALOG_DATA, useValue: data },
        {
          provide: MatDialogRef,
          useValue: { disableClose: false, close: () => undefined, backdropClick: () => EMPTY, keydownEvents: () => EMPTY },
        },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SpaceEditor);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  const button = (text: string) =>
    Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find((candidate) => candidate.textContent?.includes(text))!;
  const labels = () => Array.from(element.querySelectorAll('mat-label')).map((label) => label.textContent?.trim());

  async function save(): Promise<Record<string, unknown>> {
    button('Save space').click();
    await fixture.whenStable();
    return http.expectOne((request) => request.method === 'PUT' && request.url === '/api/projects/p1/spaces/s1').request.body as Record<
      string,
      unknown
    >;
  }

  it('keeps the building area type under the space-by-space method, folded away for the other method', async () => {
    await open('space-by-space', room({ spaceType: 'library-in-a-reading-area', buildingAreaType: 'library' }));
    expect(element.querySelector('mat-expansion-panel-header')?.textContent).toContain('For the other compliance method');
    expect(element.querySelector('mat-expansion-panel-header')?.textContent).toContain('Building area type: Library');
    const body = await save();
    expect(body).toMatchObject({ spaceType: 'library-in-a-reading-area', buildingAreaType: 'library', version: 4 });
  });

  it('under the building area method shows the space type as setting the controls and keeps it on the record', async () => {
    await open('building-area', room({ spaceType: 'library-in-a-reading-area', buildingAreaType: 'library' }));
    expect(labels()).toContain('Space type (sets the controls)');
    expect(element.querySelector('mat-expansion-panel')).toBeNull();
    const body = await save();
    expect(body).toMatchObject({ spaceType: 'library-in-a-reading-area', buildingAreaType: 'library' });
    expect(body['controlSpaceType']).toBeUndefined();
  });

  it('reads a control space type stored alone as the space type, and keeps one that differs from the space type apart', async () => {
    await open('building-area', room({ buildingAreaType: 'library', controlSpaceType: 'storage-room' }));
    expect((await save())['spaceType']).toBe('storage-room');
    TestBed.resetTestingModule();

    await open(
      'building-area',
      room({ spaceType: 'library-in-a-reading-area', buildingAreaType: 'library', controlSpaceType: 'storage-room' }),
    );
    expect(labels()).toEqual(expect.arrayContaining(['Space type (sets the controls)', 'Space type (space-by-space method)']));
    expect(await save()).toMatchObject({
      spaceType: 'library-in-a-reading-area',
      controlSpaceType: 'storage-room',
      buildingAreaType: 'library',
    });
  });

  it('offers "No lighting in this space" when no luminaires are counted, and writes it as unlit', async () => {
    await open('space-by-space', room({ spaceType: 'storage-room' }));
    const box = element.querySelector<HTMLInputElement>('mat-checkbox input[type="checkbox"]')!;
    expect(element.querySelector('mat-checkbox')?.textContent).toContain('No lighting in this space');
    box.click();
    await fixture.whenStable();
    expect((await save())['unlit']).toBe(true);
  });

  it('keeps how many like rooms the entry stands for, bounded like the service, and stores no 1', async () => {
    await open('space-by-space', room({ spaceType: 'storage-room', rooms: '4' }));
    const input = element.querySelector<HTMLInputElement>('input[formcontrolname="rooms"]')!;
    expect(input.value).toBe('4');
    // The service's range for like rooms (compliance/bounds.ts ranges.rooms): a whole number from 1 to 100,000.
    for (const [typed, message] of <[string, string][]>[
      ['2.5', 'Must be a whole number. Enter a whole number from 1 to 100,000.'],
      ['0', 'Out of range. Enter a whole number from 1 to 100,000.'],
    ]) {
      input.value = typed;
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
      button('Save space').click();
      await fixture.whenStable();
      http.expectNone('/api/projects/p1/spaces/s1');
      expect(element.textContent).toContain(message);
    }
    input.value = '6';
    input.dispatchEvent(new Event('input'));
    expect((await save())['rooms']).toBe('6');
    TestBed.resetTestingModule();
    await open('space-by-space', room({ spaceType: 'storage-room', rooms: '4' }));
    const again = element.querySelector<HTMLInputElement>('input[formcontrolname="rooms"]')!;
    again.value = '1';
    again.dispatchEvent(new Event('input'));
    expect((await save())['rooms']).toBeUndefined();
  });

  it('reads a size refusal of the service in the project units', async () => {
    await open('space-by-space', room({ spaceType: 'storage-room', area: '25' }), 'si');
    button('Save space').click();
    await fixture.whenStable();
    // The service writes the row's own label (with its ft²) inside a message already in the project's units.
    http.expectOne('/api/projects/p1/spaces/s1').flush(
      {
        error: {
          code: 'validation_failed',
          message: 'Some values do not fit.',
          details: [{ path: 'spaceType', message: '“Office — Enclosed and ≤ 250 ft²” is for spaces at most 23.2 m²; this one is 25 m².' }],
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(Array.from(element.querySelectorAll('mat-error')).map((error) => error.textContent?.trim())).toContain(
      '“Office — Enclosed and ≤ 23.2 m²” is for spaces at most 23.2 m²; this one is 25 m².',
    );

    // Giving the like rooms answers it: the refusal goes, and the next save asks the service again.
    const rooms = element.querySelector<HTMLInputElement>('input[formcontrolname="rooms"]')!;
    rooms.value = '2';
    rooms.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(element.textContent).not.toContain('is for spaces at most');
    expect((await save())['rooms']).toBe('2');
  });

  it('does not offer it once the space has luminaires, and leaves the stored flag alone', async () => {
    await open('space-by-space', room({ spaceType: 'storage-room', luminaires: [{ tag: 'A1', count: '2', luminaireTypeId: 't1' }] }));
    expect(element.querySelector('mat-checkbox')).toBeNull();
    expect((await save())['unlit']).toBeUndefined();
  });
});
