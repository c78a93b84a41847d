import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { Observable } from 'rxjs';
import type { ProjectDetail } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';

/** The service's limit on a transition's comment (service/src/review/review.routes.ts). */
export const returnCommentLimit = 2000;

export interface ReturnDialogData {
  projectName: string;
  /** Makes the return with the comment; a refusal stays in the dialog. */
  send: (comment: string) => Observable<ProjectDetail>;
}

/** Opens the dialog; answers the returned project, or undefined when the reviewer cancels. */
export function openReturnDialog(dialogs: MatDialog, data: ReturnDialogData): Observable<ProjectDetail | undefined> {
  return dialogs
    .open<ReturnDialog, ReturnDialogData, ProjectDetail>(ReturnDialog, { data, width: '560px', maxWidth: '96vw' })
    .afterClosed();
}

/** Asks the reviewer what needs revision before the design goes back to the engineer: a return needs a comment. */
@Component({
  selector: 'al-return-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  template: `
    <h2 mat-dialog-title>Return “{{ data.projectName }}” to the engineer</h2>
    <form [formGroup]="form" (ngSubmit)="send()" novalidate>
      <mat-dialog-content>
        <p class="note">Say what needs revision. The engineer reads it with the project, and can change the design again.</p>
        <mat-form-field appearance="outline" class="comment">
          <mat-label>What needs revision</mat-label>
          <textarea matInput formControlName="comment" rows="5" required cdkFocusInitial></textarea>
          <mat-hint align="end">{{ comment.value.length }} / {{ limit }}</mat-hint>
          @if (comment.hasError('required') || comment.hasError('pattern')) {
            <mat-error>Write what needs revision: a return needs a comment.</mat-error>
          } @else if (comment.hasError('maxlength')) {
            <mat-error>Use at most {{ limit }} characters.</mat-error>
          }
        </mat-form-field>
        @if (failure(); as message) {
          <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
        }
        @if (busy()) {
          <mat-progress-bar mode="indeterminate" aria-label="Returning the design" />
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close [disabled]="busy()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()"><mat-icon>undo</mat-icon>Return to the engineer</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .note {
      margin-top: 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .comment {
      width: 100%;
    }
    .failure {
      display: flex;
      align-items: center;
      gap: 8px;
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReturnDialog {
  protected readonly data = inject<ReturnDialogData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<ReturnDialog, ProjectDetail>>(MatDialogRef);
  protected readonly limit = returnCommentLimit;
  /** Blank or spaces only counts as no comment, as the service reads it. */
  protected readonly comment = new FormControl('', {
    nonNullable: true,
    validators: [Validators.required, Validators.pattern(/\S/), Validators.maxLength(returnCommentLimit)],
  });
  protected readonly form = new FormGroup({ comment: this.comment });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected send(): void {
    this.comment.markAsTouched();
    if (this.comment.invalid || this.busy()) return;
    this.busy.set(true);
    this.failure.set(null);
    this.data.send(this.comment.value.trim()).subscribe({
      next: (project) => this.dialog.close(project),
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(error instanceof ApiError ? error.message : 'The design could not be returned. Try again.');
      },
    });
  }
}
