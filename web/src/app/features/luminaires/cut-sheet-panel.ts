import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, signal, type OnInit } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { cutSheetMaxBytes, type CutSheet } from '../../../../../contract/cut-sheets';
import { ApiError } from '../../core/http/api-error';
import { askToConfirm } from '../../shared/confirm-dialog';
import { CutSheetApi } from './cut-sheet-api';

/** A file's size as people read it: bytes, kB or MB (1,024 to the step, as file managers count). */
export function sizeWords(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} kB`;
  return `${Number((bytes / (1024 * 1024)).toFixed(1))} MB`;
}

const tooLargeWords = `This file is larger than ${sizeWords(cutSheetMaxBytes)}. Choose a smaller PDF.`;

/**
 * The cut sheet of one luminaire type, inside its editor: what is on file and its download, and
 * (for those who may edit the design) attach, replace and remove. The file goes up as it is; the
 * service decides from its content whether it is a PDF, and its refusal is shown here in its words.
 */
@Component({
  selector: 'al-cut-sheet-panel',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  template: `
    <section class="panel" aria-labelledby="cut-sheet-heading">
      <h3 id="cut-sheet-heading" class="group-heading">Cut sheet</h3>
      @if (loading()) {
        <p class="note">Looking for the cut sheet on file…</p>
      } @else if (sheet(); as sheet) {
        <p class="on-file">
          <mat-icon aria-hidden="true">picture_as_pdf</mat-icon>
          <span>
            <strong class="name">{{ sheet.fileName }}</strong>
            <span class="note"
              >{{ size(sheet.size) }} · attached {{ sheet.uploadedAt | date: 'mediumDate'
              }}{{ sheet.uploadedBy ? ' by ' + sheet.uploadedBy : '' }}</span
            >
          </span>
        </p>
      } @else {
        <p class="note">No cut sheet is on file for this type.</p>
      }
      @if (progress(); as percent) {
        <mat-progress-bar mode="determinate" [value]="percent" aria-label="Uploading the cut sheet" />
        <p class="note" aria-live="polite">Uploading… {{ percent }} %</p>
      } @else if (busy()) {
        <mat-progress-bar mode="indeterminate" aria-label="Working on the cut sheet" />
      }
      @if (failure(); as message) {
        <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
      }
      <div class="actions">
        @if (sheet(); as sheet) {
          <a mat-stroked-button [href]="sheet.url" download> <mat-icon aria-hidden="true">download</mat-icon>Download </a>
        }
        @if (canEdit()) {
          <input #picker type="file" accept="application/pdf,.pdf" hidden (change)="chosen(picker)" />
          <button mat-stroked-button type="button" [disabled]="busy() || loading()" (click)="picker.click()">
            <mat-icon aria-hidden="true">upload_file</mat-icon>{{ sheet() ? 'Replace' : 'Attach a PDF' }}
          </button>
          @if (sheet()) {
            <button mat-button type="button" [disabled]="busy()" (click)="remove()">
              <mat-icon aria-hidden="true">delete</mat-icon>Remove
            </button>
          }
        }
      </div>
      @if (canEdit()) {
        <p class="note">A PDF of at most {{ size(maxBytes) }}, listed in the submittal package’s luminaire schedule.</p>
      }
    </section>
  `,
  styles: `
    .panel {
      display: grid;
      gap: 8px;
      min-width: 0;
    }
    .group-heading {
      margin: 8px 0 0;
      font: var(--mat-sys-title-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .on-file {
      display: flex;
      align-items: flex-start;
      gap: 8px;
      margin: 0;
      min-width: 0;
    }
    .on-file > span {
      display: grid;
      min-width: 0;
    }
    .name {
      overflow-wrap: anywhere;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .note {
      margin: 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .failure {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0;
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutSheetPanel implements OnInit {
  readonly projectId = input.required<string>();
  readonly typeId = input.required<string>();
  readonly canEdit = input(false);

  private readonly api = inject(CutSheetApi);
  private readonly dialogs = inject(MatDialog);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly sheet = signal<CutSheet | null>(null);
  protected readonly loading = signal(true);
  protected readonly busy = signal(false);
  /** The upload's progress in percent, while the browser reports it. */
  protected readonly progress = signal<number | null>(null);
  protected readonly failure = signal<string | null>(null);
  protected readonly maxBytes = cutSheetMaxBytes;
  protected readonly size = sizeWords;

  ngOnInit(): void {
    this.api
      .list(this.projectId())
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (sheets) => {
          this.sheet.set(sheets.find((sheet) => sheet.luminaireTypeId === this.typeId()) ?? null);
          this.loading.set(false);
        },
        error: (error: unknown) => {
          this.loading.set(false);
          this.failure.set(`The cut sheet could not be looked up. ${messageOf(error)}`);
        },
      });
  }

  protected chosen(picker: HTMLInputElement): void {
    const file = picker.files?.[0];
    // The same file chosen again after a refusal still fires a change.
    picker.value = '';
    if (!file) return;
    this.failure.set(null);
    if (file.size > cutSheetMaxBytes) {
      this.failure.set(tooLargeWords);
      return;
    }
    this.busy.set(true);
    this.api
      .attach(this.projectId(), this.typeId(), file)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress && event.total) {
            this.progress.set(Math.max(1, Math.min(100, Math.round((100 * event.loaded) / event.total))));
          } else if (event.type === HttpEventType.Response && event.body) {
            this.sheet.set(event.body);
          }
        },
        error: (error: unknown) => {
          this.busy.set(false);
          this.progress.set(null);
          this.failure.set(messageOf(error));
        },
        complete: () => {
          this.busy.set(false);
          this.progress.set(null);
        },
      });
  }

  protected remove(): void {
    const sheet = this.sheet();
    if (!sheet) return;
    askToConfirm(this.dialogs, {
      title: 'Remove the cut sheet?',
      message: `“${sheet.fileName}” will no longer be on file for this type, and the next submittal package lists none.`,
      confirm: 'Remove',
      cancel: 'Keep it',
    }).subscribe((confirmed) => {
      if (!confirmed) return;
      this.failure.set(null);
      this.busy.set(true);
      this.api
        .remove(this.projectId(), this.typeId())
        .pipe(takeUntilDestroyed(this.destroyRef))
        .subscribe({
          next: () => {
            this.sheet.set(null);
            this.busy.set(false);
          },
          error: (error: unknown) => {
            this.busy.set(false);
            this.failure.set(messageOf(error));
          },
        });
    });
  }
}

/** The service's refusal in its words, with what it says of the file itself. */
function messageOf(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Try again.';
  return [error.message, ...error.details.map((detail) => detail.message)].join(' ');
}
