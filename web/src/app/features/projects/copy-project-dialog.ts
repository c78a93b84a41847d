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
import { placeServerErrors } from '../../shared/write-failure';
import { ProjectApi } from './project-api';

export interface CopyProjectData {
  projectId: string;
  name: string;
}

/** Asks for the copy's name, makes the copy, and closes with it (the caller opens it). */
@Component({
  selector: 'al-copy-project-dialog',
  imports: [ReactiveFormsModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatInputModule, MatProgressBarModule],
  template: `
    <h2 mat-dialog-title>Copy “{{ data.name }}”</h2>
    <form [formGroup]="form" (ngSubmit)="copy()" novalidate>
      <mat-dialog-content>
        <p class="note">
          The copy is a new draft with this project's whole set-up and design, for a similar building or to try another method. You become
          its engineer; the team and the history stay with the original.
        </p>
        <mat-form-field appearance="outline" subscriptSizing="dynamic" class="name">
          <mat-label>Name of the copy</mat-label>
          <input matInput formControlName="name" required autocomplete="off" cdkFocusInitial />
          @if (name.hasError('required')) {
            <mat-error>Give the copy a name.</mat-error>
          } @else if (name.hasError('maxlength')) {
            <mat-error>Use at most 200 characters.</mat-error>
          } @else if (name.getError('server'); as message) {
            <mat-error>{{ message }}</mat-error>
          }
        </mat-form-field>
        @if (failure(); as message) {
          <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
        }
        @if (busy()) {
          <mat-progress-bar mode="indeterminate" aria-label="Copying the project" />
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" mat-dialog-close [disabled]="busy()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="busy()"><mat-icon>content_copy</mat-icon>Copy and open</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .note {
      margin-top: 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .name {
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
export class CopyProjectDialog {
  protected readonly data = inject<CopyProjectData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<CopyProjectDialog, ProjectDetail>>(MatDialogRef);
  private readonly api = inject(ProjectApi);
  protected readonly form = new FormGroup({
    name: new FormControl(`${this.data.name} (copy)`, { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
  });
  protected readonly name = this.form.controls.name;
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected copy(): void {
    if (this.name.invalid) {
      this.name.markAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    this.dialog.disableClose = true;
    this.api.copy(this.data.projectId, this.name.value.trim()).subscribe({
      next: (copy) => this.dialog.close(copy),
      error: (error: unknown) => {
        this.busy.set(false);
        this.dialog.disableClose = false;
        if (error instanceof ApiError && error.status === 400) {
          const unplaced = placeServerErrors(error.details, (path) => (path === 'name' ? this.name : null));
          if (unplaced.length) this.failure.set(unplaced.map((detail) => detail.message).join(' '));
          return;
        }
        this.failure.set(error instanceof ApiError ? error.message : 'The project could not be copied.');
      },
    });
  }
}

/** Opens the dialog for a project; emits the copy once made, or undefined when the person cancels. */
export function openCopyDialog(dialogs: MatDialog, project: { id: string; name: string }): Observable<ProjectDetail | undefined> {
  return dialogs
    .open<CopyProjectDialog, CopyProjectData, ProjectDetail>(CopyProjectDialog, {
      data: { projectId: project.id, name: project.name },
      width: '520px',
      maxWidth: '96vw',
    })
    .afterClosed();
}
