import { HttpClient, HttpHeaders } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { photoMaxBytes, photosPerItem, type FieldTestPhoto } from '../../../../../contract/field-tests';
import { failureWords } from '../../shared/write-failure';

/** The photos of one plan item: thumbnails that open the display copy; the contractor adds (camera on a phone) and removes. */
@Component({
  selector: 'al-field-test-photos',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="photos" data-testid="field-test-photos">
      @if (shown().length > 0) {
        <ul class="thumbs">
          @for (photo of shown(); track photo.id) {
            <li>
              <a [href]="url(photo, 'display')" target="_blank" rel="noopener">
                <img [src]="url(photo, 'thumb')" [alt]="altOf(photo)" loading="lazy" data-testid="field-test-thumb" />
              </a>
              @if (canRecord()) {
                <button mat-button type="button" (click)="remove(photo)" [disabled]="busy()" [attr.aria-label]="'Remove ' + altOf(photo)">
                  Remove
                </button>
              }
            </li>
          }
        </ul>
      }
      @if (canRecord()) {
        @if (shown().length < max) {
          <label class="add" mat-stroked-button>
            <mat-icon aria-hidden="true">add_a_photo</mat-icon>
            <span>Add photo</span>
            <input
              type="file"
              accept="image/jpeg,image/png"
              capture="environment"
              (change)="picked($event)"
              [disabled]="busy()"
              data-testid="field-test-photo-input"
              [attr.aria-label]="'Add photo of ' + itemTitle()"
            />
          </label>
        } @else {
          <p>This test has {{ max }} photos, the most it keeps. Remove one to add another.</p>
        }
      }
      @if (busy()) {
        <mat-progress-bar mode="indeterminate" aria-label="Sending the photo" />
        <p role="status">Sending the photo…</p>
      }
      @if (message(); as message) {
        <p class="refusal" role="alert" data-testid="field-test-photo-refusal">{{ message }}</p>
      }
    </div>
  `,
  styles: `
    .thumbs {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
      list-style: none;
      padding: 0;
      margin: 8px 0;
    }
    .thumbs li {
      display: flex;
      flex-direction: column;
      align-items: flex-start;
    }
    .thumbs img {
      width: 96px;
      height: 96px;
      object-fit: cover;
      border-radius: 4px;
    }
    .add {
      display: inline-flex;
      align-items: center;
      gap: 8px;
      min-height: 48px;
      cursor: pointer;
    }
    .add input {
      position: absolute;
      opacity: 0;
      width: 1px;
      height: 1px;
    }
    .add:focus-within {
      outline: 2px solid currentColor;
      outline-offset: 2px;
    }
    .refusal {
      color: var(--mat-sys-error);
    }
  `,
})
export class FieldTestPhotos {
  private readonly http = inject(HttpClient);

  readonly projectId = input.required<string>();
  readonly itemId = input.required<string>();
  readonly itemTitle = input.required<string>();
  readonly photos = input<FieldTestPhoto[]>([]);
  readonly canRecord = input(false);

  protected readonly max = photosPerItem;
  /** The photos as shown: the plan's, then what was added or removed here. */
  protected readonly shown = signal<FieldTestPhoto[]>([]);
  protected readonly busy = signal(false);
  protected readonly message = signal<string | null>(null);
  private readonly base = computed(() => `/api/projects/${this.projectId()}/test-plan/items/${encodeURIComponent(this.itemId())}/photos`);

  constructor() {
    effect(() => {
      const photos = this.photos();
      untracked(() => this.shown.set(photos));
    });
  }

  protected url(photo: FieldTestPhoto, size: 'thumb' | 'display'): string {
    return `${this.base()}/${photo.id}?size=${size}`;
  }

  protected altOf(photo: FieldTestPhoto): string {
    return photo.caption ?? `Photo of the test: ${this.itemTitle()}`;
  }

  protected picked(event: Event): void {
    const field = event.target as HTMLInputElement;
    const file = field.files?.[0];
    field.value = '';
    if (!file) return;
    this.message.set(null);
    if (file.type !== 'image/jpeg' && file.type !== 'image/png') {
      this.message.set('Choose a JPEG or PNG photo.');
      return;
    }
    if (file.size > photoMaxBytes) {
      this.message.set('This photo is larger than 10 MB. Take it at a smaller size, or choose a smaller file.');
      return;
    }
    this.busy.set(true);
    this.http.post<FieldTestPhoto>(this.base(), file, { headers: new HttpHeaders({ 'Content-Type': file.type }) }).subscribe({
      next: (photo) => {
        this.busy.set(false);
        this.shown.update((photos) => [...photos, photo]);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.message.set(failureWords(error));
      },
    });
  }

  protected remove(photo: FieldTestPhoto): void {
    this.message.set(null);
    this.busy.set(true);
    this.http.delete(`${this.base()}/${photo.id}`).subscribe({
      next: () => {
        this.busy.set(false);
        this.shown.update((photos) => photos.filter((entry) => entry.id !== photo.id));
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.message.set(failureWords(error));
      },
    });
  }
}
