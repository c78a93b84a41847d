import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { EMPTY } from 'rxjs';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { LuminaireTypeEditor, type LuminaireTypeEditorData } from './luminaire-type-editor';

describe('LuminaireTypeEditor', () => {
  let fixture: ComponentFixture<LuminaireTypeEditor>;
  let http: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    const data: LuminaireTypeEditorData = { projectId: 'p1', type: null, units: 'ip', reload: () => undefined };
    TestBed.configureTestingModule({
      imports: [LuminaireTypeEditor],
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
    fixture = TestBed.createComponent(LuminaireTypeEditor);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  function fill(label: string, value: string): void {
    const field = Array.from(element.querySelectorAll('mat-form-field')).find(
      (candidate) => candidate.querySelector('mat-label')?.textContent?.trim() === label,
    )!;
    const input = field.querySelector('input')!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  it('sends the catalogue fields with the type', async () => {
    // An invented product.
    fill('Type tag', 'H1');
    fill('Rated input (W)', '151.5');
    fill('Manufacturer', 'Invented Lighting Co.');
    fill('Catalogue number', 'HB-150-40K');
    fill('Light source', 'LED, 4000 K');
    fill('Driver', '0–10 V dimming');
    fill('Voltage', '120–277 V');
    Array.from(element.querySelectorAll<HTMLButtonElement>('button'))
      .find((button) => button.textContent?.includes('Add type'))!
      .click();
    await fixture.whenStable();
    const request = http.expectOne((candidate) => candidate.method === 'POST' && candidate.url === '/api/projects/p1/luminaire-types');
    expect(request.request.body).toMatchObject({
      tag: 'H1',
      inputWatts: '151.5',
      manufacturer: 'Invented Lighting Co.',
      catalogNumber: 'HB-150-40K',
      lightSource: 'LED, 4000 K',
      driver: '0–10 V dimming',
      voltage: '120–277 V',
    });
  });

  it("refuses a rated input out of the service's range beside the field", async () => {
    fill('Type tag', 'H1');
    fill('Rated input (W)', '250000');
    Array.from(element.querySelectorAll<HTMLButtonElement>('button'))
      .find((button) => button.textContent?.includes('Add type'))!
      .click();
    await fixture.whenStable();
    http.expectNone('/api/projects/p1/luminaire-types');
    expect(element.querySelector('mat-error')?.textContent).toContain('Out of range. Enter a number from 0 to 100,000.');
  });

  it('offers the cut sheet once the type is added', () => {
    expect(element.textContent).toContain('Attach the manufacturer’s cut sheet once the type is added.');
    expect(element.querySelector('al-cut-sheet-panel')).toBeNull();
  });
});
