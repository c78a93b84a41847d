import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import type { SpaceTypeView } from '../../core/api/api-types';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { SpaceImportDialog, type SpaceImportData } from './space-import-dialog';

// Invented rows; the space type is one our IECC 2021 table lists.
const data: SpaceImportData = {
  projectId: 'p1',
  units: 'ip',
  method: 'space-by-space',
  spaceTypes: [{ key: 'office-enclosed', label: 'Office — Enclosed' }] as SpaceTypeView[],
  buildingAreaTypes: [],
};

describe('SpaceImportDialog', () => {
  let fixture: ComponentFixture<SpaceImportDialog>;
  let http: HttpTestingController;
  const closed: unknown[] = [];

  beforeEach(async () => {
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
    // The sheet as the file step leaves it, checked and ready.
    fixture.componentInstance['table'].set([
      ['Name', 'Space type', 'Area'],
      ['Exam 1', 'office-enclosed', '120'],
      ['Exam 2', 'office-enclosed', '110'],
    ]);
    fixture.componentInstance['mapping'].set(['name', 'spaceType', 'area']);
    fixture.componentInstance['stage'].set('preview');
    await fixture.whenStable();
  });

  const importButton = () => Array.from((fixture.nativeElement as HTMLElement).querySelectorAll<HTMLButtonElement>('button')).find((button) => button.textContent?.includes('Import 2 spaces'))!;
  const post = () => http.expectOne((request) => request.method === 'POST' && request.url === '/api/projects/p1/spaces/bulk');

  it('sends a new key with each import, and the same one again when the answer to the last was lost', async () => {
    importButton().click();
    const first = post();
    const key = first.request.headers.get('Idempotency-Key');
    expect(key).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(first.request.body.spaces.map((space: { name: string }) => space.name)).toEqual(['Exam 1', 'Exam 2']);
    first.error(new ProgressEvent('error'), { status: 0, statusText: '' });
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('The service cannot be reached');

    importButton().click();
    const retry = post();
    expect(retry.request.headers.get('Idempotency-Key')).toBe(key);
    retry.flush([{ id: 's1' }, { id: 's2' }], { status: 201, statusText: 'Created' });
    expect(closed).toEqual([[{ id: 's1' }, { id: 's2' }]]);
  });

  it('starts a new key after the service refused the import', async () => {
    importButton().click();
    const first = post();
    const key = first.request.headers.get('Idempotency-Key');
    first.flush({ error: { code: 'archived', message: 'This project is archived.' } }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    importButton().click();
    const next = post();
    expect(next.request.headers.get('Idempotency-Key')).not.toBe(key);
    expect(next.request.headers.get('Idempotency-Key')).toMatch(/^[0-9a-f-]{36}$/);
  });
});
