import { ChangeDetectionStrategy, Component, inject, output, signal, viewChild } from '@angular/core';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { ApiError } from '../../core/http/api-error';
import { PasswordApi, passwordRuleWords } from '../sign-in/password-api';
import { NewPasswordFields, newPasswordGroup } from '../sign-in/new-password-fields';

/** The Account page's password change: the current password, the new one twice. */
@Component({
  selector: 'al-password-change',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule, NewPasswordFields],
  template: `
    <form [formGroup]="form" (ngSubmit)="submit()" novalidate aria-labelledby="password-heading">
      <h2 id="password-heading">Password</h2>
      <p class="hint" id="new-password-rules">{{ rules }} Changing it ends your other sessions.</p>
      <div class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Current password</mat-label>
          <input matInput type="password" formControlName="currentPassword" autocomplete="current-password" required />
          @if (form.controls.currentPassword.hasError('required')) {
            <mat-error>Enter your current password.</mat-error>
          } @else if (form.controls.currentPassword.hasError('service')) {
            <mat-error>{{ form.controls.currentPassword.getError('service') }}</mat-error>
          }
        </mat-form-field>
        <al-new-password-fields class="row" [group]="form.controls.next" rulesId="new-password-rules" />
      </div>
      @if (failure(); as message) {
        <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
      }
      @if (done(); as message) {
        <p class="done" role="status"><mat-icon aria-hidden="true">check_circle</mat-icon>{{ message }}</p>
      }
      <button mat-flat-button type="submit" [disabled]="busy()">Change the password</button>
    </form>
  `,
  styles: `
    h2 {
      font: var(--mat-sys-title-large);
      margin: 0;
    }
    .hint {
      margin: 8px 0 16px;
      color: var(--mat-sys-on-surface-variant);
    }
    .fields {
      display: flex;
      flex-wrap: wrap;
      gap: 0 16px;
    }
    mat-form-field {
      flex: 1 1 220px;
    }
    .done {
      display: flex;
      align-items: center;
      gap: 8px;
      color: var(--mat-sys-primary);
      margin: 0 0 8px;
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
export class PasswordChange {
  private readonly api = inject(PasswordApi);
  /** Says how many other sessions ended, so the page can list the sessions again. */
  readonly changed = output<number>();
  protected readonly rules = passwordRuleWords;
  protected readonly form = inject(NonNullableFormBuilder).group({
    currentPassword: ['', [Validators.required, Validators.maxLength(200)]],
    next: newPasswordGroup(inject(NonNullableFormBuilder)),
  });
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly done = signal<string | null>(null);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { currentPassword, next } = this.form.getRawValue();
    const password = next.password;
    this.busy.set(true);
    this.failure.set(null);
    this.done.set(null);
    this.api.change(currentPassword, password).subscribe({
      next: ({ endedSessions }) => {
        this.busy.set(false);
        // Through the directive, so the emptied fields are not shown as a submitted form's errors.
        this.formDirective().resetForm();
        const others =
          endedSessions === 0 ? '' : endedSessions === 1 ? ' One other session has ended.' : ` ${endedSessions} other sessions have ended.`;
        this.done.set(`Your password is changed.${others}`);
        this.changed.emit(endedSessions);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const detail = error instanceof ApiError ? error.details[0] : undefined;
        const control =
          detail?.path === 'currentPassword'
            ? this.form.controls.currentPassword
            : detail?.path === 'newPassword'
              ? this.form.controls.next.controls.password
              : null;
        if (control && detail) {
          // The service's sentence shown on the field it is about.
          control.setErrors({ service: detail.message });
          control.markAsTouched();
        } else {
          this.failure.set(error instanceof ApiError ? error.message : 'The password could not be changed. Try again.');
        }
      },
    });
  }
}
