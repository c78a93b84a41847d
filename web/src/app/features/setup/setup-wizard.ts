import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatStepperModule } from '@angular/material/stepper';
import { Router, RouterLink } from '@angular/router';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { WorkspaceApi } from '../workspace/workspace-api';
import { SetupFields } from './setup-fields';
import { setupForm, setupValue, showServerErrors } from './setup-form';

/** A new project, step by step; creating it makes the signed-in person its engineer. */
@Component({
  selector: 'al-setup-wizard',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, MatStepperModule, SetupFields],
  templateUrl: './setup-wizard.html',
  styleUrl: './setup-wizard.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupWizard implements HasUnsavedChanges {
  private readonly api = inject(WorkspaceApi);
  private readonly router = inject(Router);
  protected readonly auth = inject(AuthStore);
  protected readonly form = setupForm();
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  private created = false;

  hasUnsavedChanges(): boolean {
    return !this.created && this.form.dirty;
  }

  protected create(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.saving.set(true);
    this.failure.set(null);
    this.api.createProject(setupValue(this.form)).subscribe({
      next: (project) => {
        this.created = true;
        void this.router.navigate(['/projects', project.id, 'spaces']);
      },
      error: (error: unknown) => {
        this.saving.set(false);
        if (error instanceof ApiError && error.status === 400) {
          const unplaced = showServerErrors(this.form, error.details);
          this.failure.set(unplaced.length ? unplaced.map((detail) => detail.message).join(' ') : 'Some fields need attention; see the messages beside them.');
        } else {
          this.failure.set(error instanceof ApiError ? error.message : 'The project could not be created.');
        }
      },
    });
  }
}
