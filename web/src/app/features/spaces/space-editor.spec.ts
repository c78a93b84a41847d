import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { EMPTY } from 'rxjs';
import type { BuildingAreaTypeView, ComplianceMethod, SpaceRecord, SpaceTypeView } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { SpaceEditor, type SpaceEditorData } from './space-editor';

// IECC 2021 Tables C405.3.2(1) and C405.3.2(2), via PNNL building-energy-standards-data: library 0.78 W/ft² (building
// area); library reading area 0.96 W/ft², storage room 0.38 W/ft² (space by space). The rooms are invented.
const spaceTypes = [
  { key: 'library-in-a-reading-area', label: 'Library — In a Reading area', sourceLabel: 'Library | In a Reading area', category: 'building-specific', lpdWPerFt2: '0.96', verified: true },
  { key: 'storage-room', label: 'Storage Room', sourceLabel: 'Storage Room', category: 'common', lpdWPerFt2: '0.38', verified: true },
] as SpaceTypeView[];
const buildingAreaTypes = [{ key: 'library', label: 'Library', sourceLabel: 'Library', lpdWPerFt2: '0.78', verified: true }] as BuildingAreaTypeView[];
const stamp = { version: 4, updatedAt: '', updatedBy: null };

function room(fields: Partial<SpaceRecord>): SpaceRecord {
  return { id: 's1', name: 'Reading room', position: 1, area: '1200', luminaires: [], controls: [], windows: [], skylights: [], ...stamp, ...fields };
}

describe('SpaceEditor', () => {
  let fixture: ComponentFixture<SpaceEditor>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(method: ComplianceMethod, space: SpaceRecord | null): Promise<void> {
    const data: SpaceEditorData = { projectId: 'p1', space, method, units: 'ip', spaceTypes, buildingAreaTypes, levels: [], reload: () => undefined };
    TestBed.configureTestingModule({
      imports: [SpaceEditor],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: MatDialogRef, useValue: { disableClose: false, close: () => undefined, backdropClick: () => EMPTY, keydownEvents: () => EMPTY } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SpaceEditor);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  const button = (text: string) => Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find((candidate) => candidate.textContent?.includes(text))!;
  const labels = () => Array.from(element.querySelectorAll('mat-label')).map((label) => label.textContent?.trim());

  async function save(): Promise<Record<string, unknown>> {
    button('Save space').click();
    await fixture.whenStable();
    return http.expectOne((request) => request.method === 'PUT' && request.url === '/api/projects/p1/spaces/s1').request.body as Record<string, unknown>;
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

    await open('building-area', room({ spaceType: 'library-in-a-reading-area', buildingAreaType: 'library', controlSpaceType: 'storage-room' }));
    expect(labels()).toEqual(expect.arrayContaining(['Space type (sets the controls)', 'Space type (space-by-space method)']));
    expect(await save()).toMatchObject({ spaceType: 'library-in-a-reading-area', controlSpaceType: 'storage-room', buildingAreaType: 'library' });
  });

  it('offers "No lighting in this space" when no luminaires are counted, and writes it as unlit', async () => {
    await open('space-by-space', room({ spaceType: 'storage-room' }));
    const box = element.querySelector<HTMLInputElement>('mat-checkbox input[type="checkbox"]')!;
    expect(element.querySelector('mat-checkbox')?.textContent).toContain('No lighting in this space');
    box.click();
    await fixture.whenStable();
    expect((await save())['unlit']).toBe(true);
  });

  it('does not offer it once the space has luminaires, and leaves the stored flag alone', async () => {
    await open('space-by-space', room({ spaceType: 'storage-room', luminaires: [{ tag: 'A1', count: '2', luminaireTypeId: 't1' }] }));
    expect(element.querySelector('mat-checkbox')).toBeNull();
    expect((await save())['unlit']).toBeUndefined();
  });
});
