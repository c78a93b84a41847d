import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, concatMap, from, map, of, toArray } from 'rxjs';
import type { ProjectRole } from '../../core/api/api-types';
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
import { SetupFields, type SetupSection } from './setup-fields';
import { TeamEditor, type TeamEntry } from './team-editor';
import { setupForm, setupValue, showServerErrors } from './setup-form';

/** A new project, step by step; creating it makes the signed-in person its engineer. */
@Component({
  selector: 'al-setup-wizard',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    MatStepperModule,
    SetupFields,
    TeamEditor,
  ],
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
  private readonly snackBar = inject(MatSnackBar);
  private created = false;
  /** People to add once the project exists. */
  private readonly invited = signal<{ email: string; role: ProjectRole }[]>([]);
  protected readonly team = computed<TeamEntry[]>(() => {
    const user = this.auth.user();
    const self: TeamEntry[] = user ? [{ userId: user.id, name: user.name, email: user.email, role: 'engineer' }] : [];
    return [...self, ...this.invited()];
  });

  protected invite(entry: { email: string; role: ProjectRole }): void {
    const email = entry.email.toLowerCase();
    if (email === this.auth.user()?.email.toLowerCase()) return;
    this.invited.update((list) => [...list.filter((other) => other.email.toLowerCase() !== email), entry]);
  }

  protected uninvite(entry: TeamEntry): void {
    this.invited.update((list) => list.filter((other) => other.email !== entry.email));
  }

  protected readonly steps: readonly { section: SetupSection; label: string }[] = [
    { section: 'identity', label: 'Project and permit' },
    { section: 'site', label: 'Location' },
    { section: 'code', label: 'Jurisdiction, edition, method and units' },
    { section: 'building', label: 'Building' },
    { section: 'exterior', label: 'Exterior lighting zone' },
    { section: 'people', label: 'Designer of record and contractor' },
  ];

  /**
   * A linear stepper stays on a step with a missing or wrong value but only marks the step; touching
   * its fields puts each message beside its field, where the person looks.
   */
  protected showProblems(section: SetupSection): void {
    this.form.controls[section].markAllAsTouched();
  }

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
        // Each invitation is sent on its own, so one refused address does not stop the others. The
        // service answers with the team whether or not an address has an account: an address the
        // team does not hold afterwards was not added, and the words say no more than that.
        from(this.invited())
          .pipe(
            concatMap((entry) =>
              this.api.setMember(project.id, entry.email, entry.role).pipe(
                map((members): string | null =>
                  members.some((member) => member.email.toLocaleLowerCase() === entry.email.toLocaleLowerCase()) ? null : entry.email,
                ),
                catchError(() => of(entry.email)),
              ),
            ),
            toArray(),
          )
          .subscribe((outcomes) => {
            const missing = outcomes.filter((email): email is string => email !== null);
            if (missing.length) {
              this.snackBar.open(
                `No one was added for ${missing.join(', ')}. Check ${missing.length === 1 ? 'it' : 'them'} on the Set-up page, or invite ${missing.length === 1 ? 'the person' : 'them'} by e-mail there: the invitation makes the account.`,
                'Dismiss',
                { duration: 12_000 },
              );
            }
            void this.router.navigate(['/projects', project.id, 'spaces']);
          });
      },
      error: (error: unknown) => {
        this.saving.set(false);
        if (error instanceof ApiError && error.status === 400) {
          const unplaced = showServerErrors(this.form, error.details);
          this.failure.set(
            unplaced.length
              ? unplaced.map((detail) => detail.message).join(' ')
              : 'Some fields need attention; see the messages beside them.',
          );
        } else {
          this.failure.set(error instanceof ApiError ? error.message : 'The project could not be created.');
        }
      },
    });
  }
}
