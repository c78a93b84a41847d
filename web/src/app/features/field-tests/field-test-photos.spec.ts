import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { FieldTestPhoto } from '../../../../../contract/field-tests';
import { apiInterceptor } from '../../core/http/api-interceptor';
import { FieldTestPhotos } from './field-test-photos';

// An invented item and its photos.
const itemId = 'occupant-sensor:occupant-sensor:s1';
const base = `/api/projects/p1/test-plan/items/${encodeURIComponent(itemId)}/photos`;
const door: FieldTestPhoto = {
  id: '0b7c5f3e-6c1a-4f0e-9a53-2d4f6f1d2a11',
  caption: 'Sensor above the door',
  at: '2026-11-20T10:00:00.000Z',
  by: { id: 'u1', name: 'Tomas Reyes' },
  width: 1600,
  height: 1067,
  resultId: null,
};
const uncaptioned: FieldTestPhoto = { ...door, id: '1c8d6a4f-7d2b-4a1f-8b64-3e5a7a2e3b22', caption: null };

describe('FieldTestPhotos', () => {
  let fixture: ComponentFixture<FieldTestPhotos>;
  let http: HttpTestingController;
  let element: HTMLElement;

  async function open(canRecord: boolean, photos: FieldTestPhoto[]) {
    TestBed.configureTestingModule({
      imports: [FieldTestPhotos],
      providers: [provideZonelessChangeDetection(), provideHttpClient(withInterceptors([apiInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(FieldTestPhotos);
    fixture.componentRef.setInput('projectId', 'p1');
    fixture.componentRef.setInput('itemId', itemId);
    fixture.componentRef.setInput('itemTitle', 'Occupant sensor in Exam 1');
    fixture.componentRef.setInput('photos', photos);
    fixture.componentRef.setInput('canRecord', canRecord);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  }

  function pick(file: File) {
    const input = element.querySelector<HTMLInputElement>('[data-testid="field-test-photo-input"]')!;
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
  }

  afterEach(() => http.verify());

  it('shows thumbnails that open the display copy, with the caption or words as their text', async () => {
    await open(false, [door, uncaptioned]);
    const images = Array.from(element.querySelectorAll<HTMLImageElement>('[data-testid="field-test-thumb"]'));
    expect(images.map((image) => image.alt)).toEqual(['Sensor above the door', 'Photo of the test: Occupant sensor in Exam 1']);
    expect(images[0]!.getAttribute('src')).toBe(`${base}/${door.id}?size=thumb`);
    expect(images[0]!.closest('a')!.getAttribute('href')).toBe(`${base}/${door.id}?size=display`);
    // Not the contractor: nothing to add or remove.
    expect(element.querySelector('[data-testid="field-test-photo-input"]')).toBeNull();
    expect(element.textContent).not.toContain('Remove');
  });

  it('sends a picked photo as it is, busy meanwhile, and shows it', async () => {
    await open(true, []);
    const input = element.querySelector<HTMLInputElement>('[data-testid="field-test-photo-input"]')!;
    expect(input.accept).toBe('image/jpeg,image/png');
    expect(input.getAttribute('capture')).toBe('environment');
    const file = new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'door.jpg', { type: 'image/jpeg' });
    pick(file);
    await fixture.whenStable();
    expect(element.textContent).toContain('Sending the photo');
    const request = http.expectOne(base);
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toBe(file);
    expect(request.request.headers.get('Content-Type')).toBe('image/jpeg');
    request.flush(door, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(element.textContent).not.toContain('Sending the photo');
    expect(element.querySelectorAll('[data-testid="field-test-thumb"]')).toHaveLength(1);
  });

  it('refuses in words: a file that is not a photo, one over 10 MB, and what the service refuses', async () => {
    await open(true, []);
    const refusal = () => element.querySelector('[data-testid="field-test-photo-refusal"]')?.textContent ?? '';
    pick(new File(['hello'], 'notes.txt', { type: 'text/plain' }));
    await fixture.whenStable();
    expect(refusal()).toContain('Choose a JPEG or PNG photo');
    pick(new File([new Uint8Array(10 * 1024 * 1024 + 1)], 'huge.jpg', { type: 'image/jpeg' }));
    await fixture.whenStable();
    expect(refusal()).toContain('larger than 10 MB');
    pick(new File([new Uint8Array([1, 2, 3])], 'fake.png', { type: 'image/png' }));
    await fixture.whenStable();
    http.expectOne(base).flush(
      {
        error: {
          code: 'validation_failed',
          message: 'This file is not a JPEG or PNG photo. Take the photo again or choose a JPEG or PNG file.',
        },
      },
      { status: 400, statusText: 'Bad Request' },
    );
    await fixture.whenStable();
    expect(refusal()).toContain('This file is not a JPEG or PNG photo');
    expect(refusal()).not.toMatch(/validation_failed|\/api\//);
  });

  it('removes a photo for the contractor', async () => {
    await open(true, [door]);
    element.querySelector<HTMLButtonElement>('[aria-label^="Remove"]')!.click();
    await fixture.whenStable();
    const request = http.expectOne(`${base}/${door.id}`);
    expect(request.request.method).toBe('DELETE');
    request.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    expect(element.querySelectorAll('[data-testid="field-test-thumb"]')).toHaveLength(0);
  });
});
