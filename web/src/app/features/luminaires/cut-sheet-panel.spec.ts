import { HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { CutSheet } from '../../../../../contract/cut-sheets';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { CutSheetPanel, sizeWords } from './cut-sheet-panel';

const listUrl = '/api/projects/p1/cut-sheets';
const sheetUrl = '/api/projects/p1/luminaire-types/t1/cut-sheet';

const onFile: CutSheet = {
  luminaireTypeId: 't1',
  fileName: 'Invented downlight.pdf',
  size: 1_572_864,
  sha256: 'a'.repeat(64),
  uploadedAt: '2026-11-30T15:00:00Z',
  uploadedBy: 'Ines Halvorsen',
  url: sheetUrl,
};

describe('CutSheetPanel', () => {
  let fixture: ComponentFixture<CutSheetPanel>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(sheets: CutSheet[]): Promise<void> {
    TestBed.configureTestingModule({
      imports: [CutSheetPanel],
      providers: [
        provideZonelessChangeDetection(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        provideRouter([]),
        provideHttpClient(withInterceptors([apiInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(CutSheetPanel);
    fixture.componentRef.setInput('projectId', 'p1');
    fixture.componentRef.setInput('typeId', 't1');
    fixture.componentRef.setInput('canEdit', true);
    element = fixture.nativeElement as HTMLElement;
    fixture.detectChanges();
    http.expectOne(listUrl).flush(sheets);
    await fixture.whenStable();
  }

  function button(name: string, root: ParentNode = element): HTMLButtonElement {
    const found = Array.from(root.querySelectorAll<HTMLButtonElement>('button')).find((candidate) => candidate.textContent?.includes(name));
    if (!found) throw new Error(`no button “${name}”`);
    return found;
  }

  /** Chooses a file in the hidden picker, as the browser's file dialog would. */
  function choose(file: File): void {
    const picker = element.querySelector<HTMLInputElement>('input[type="file"]')!;
    Object.defineProperty(picker, 'files', { value: [file], configurable: true });
    picker.dispatchEvent(new Event('change'));
  }

  afterEach(() => http.verify());

  it('shows the cut sheet on file with its size, who attached it, and its download', async () => {
    await open([{ ...onFile, luminaireTypeId: 'other', fileName: 'Not this one.pdf' }, onFile]);
    expect(element.textContent).toContain('Invented downlight.pdf');
    expect(element.textContent).toContain('1.5 MB');
    expect(element.textContent).toContain('by Ines Halvorsen');
    expect(element.textContent).not.toContain('Not this one.pdf');
    const link = element.querySelector<HTMLAnchorElement>('a[download]')!;
    expect(link.getAttribute('href')).toBe(sheetUrl);
    expect(link.textContent).toContain('Download');
    expect(button('Replace')).toBeTruthy();
  });

  it('says when none is on file, and offers no attach to a reader who may not edit', async () => {
    await open([]);
    expect(element.textContent).toContain('No cut sheet is on file for this type.');
    expect(button('Attach a PDF')).toBeTruthy();
    fixture.componentRef.setInput('canEdit', false);
    await fixture.whenStable();
    expect(element.querySelector('input[type="file"]')).toBeNull();
    expect(element.textContent).not.toContain('Attach a PDF');
  });

  it('uploads the chosen file as it is, shows its progress, then the cut sheet on file', async () => {
    await open([]);
    const file = new File(['%PDF-1.7 invented'], 'Invented downlight.pdf', { type: 'application/pdf' });
    choose(file);
    await fixture.whenStable();
    const upload = http.expectOne((candidate) => candidate.method === 'PUT' && candidate.url === sheetUrl);
    expect(upload.request.body).toBe(file);
    expect(upload.request.params.get('name')).toBe('Invented downlight.pdf');
    expect(upload.request.headers.get('Content-Type')).toBe('application/pdf');
    expect(upload.request.reportProgress).toBe(true);
    upload.event({ type: HttpEventType.UploadProgress, loaded: 8, total: 16 });
    await fixture.whenStable();
    expect(element.querySelector('mat-progress-bar')?.getAttribute('aria-label')).toBe('Uploading the cut sheet');
    expect(element.textContent).toContain('Uploading… 50 %');
    expect(button('Attach a PDF').disabled).toBe(true);
    upload.flush(onFile);
    await fixture.whenStable();
    expect(element.querySelector('mat-progress-bar')).toBeNull();
    expect(element.textContent).toContain('Invented downlight.pdf');
    expect(button('Replace').disabled).toBe(false);
  });

  it('shows the service’s refusal of a file that is not a PDF in its words', async () => {
    await open([]);
    choose(new File(['not really'], 'Spoofed.pdf', { type: 'application/pdf' }));
    await fixture.whenStable();
    http
      .expectOne((candidate) => candidate.url === sheetUrl)
      .flush(
        {
          error: {
            code: 'validation_failed',
            message: 'The cut sheet must be a PDF file. This file is not one, whatever its name says.',
            details: [{ path: 'file', message: 'This file is PNG, not PDF.' }],
          },
        },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    const alert = element.querySelector('[role="alert"]')!;
    expect(alert.textContent).toContain('must be a PDF file');
    expect(alert.textContent).toContain('This file is PNG, not PDF.');
    expect(alert.textContent).not.toContain('file:');
    expect(element.textContent).toContain('No cut sheet is on file for this type.');
  });

  it('refuses a file over 20 MB before sending it', async () => {
    await open([]);
    const file = new File(['%PDF-'], 'Huge.pdf', { type: 'application/pdf' });
    Object.defineProperty(file, 'size', { value: 20 * 1024 * 1024 + 1 });
    choose(file);
    await fixture.whenStable();
    http.expectNone((candidate) => candidate.url === sheetUrl);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('larger than 20 MB');
  });

  it('removes the cut sheet once the person confirms', async () => {
    await open([onFile]);
    button('Remove').click();
    await fixture.whenStable();
    const dialog = document.querySelector<HTMLElement>('mat-dialog-container')!;
    expect(dialog.textContent).toContain('“Invented downlight.pdf” will no longer be on file');
    button('Remove', dialog).click();
    await fixture.whenStable();
    http
      .expectOne((candidate) => candidate.method === 'DELETE' && candidate.url === sheetUrl)
      .flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(element.textContent).toContain('No cut sheet is on file for this type.');
  });
});

describe('sizeWords', () => {
  it('words sizes as file managers do', () => {
    expect(sizeWords(900)).toBe('900 bytes');
    expect(sizeWords(2048)).toBe('2 kB');
    expect(sizeWords(20 * 1024 * 1024)).toBe('20 MB');
    expect(sizeWords(1_572_864)).toBe('1.5 MB');
  });
});
