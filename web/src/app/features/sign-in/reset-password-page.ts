import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCardModule } from '@angular/material/card';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { ApiError } from '../../core/http/api-error';
import { PasswordApi, passwordRuleWords } from './password-api';

/** The repeated password must equal the first; the error sits on the repeat field. */
export function sameAsPassword(control: AbstractControl): ValidationErrors | null {
  const password = control.parent?.get('password')?.value as string | undefined;
  return control.value && password !== undefined && control.value !== password ? { mismatch: 'The two passwords differ.' } : null;
}

@Component({
  selector: 'al-reset-password-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatCardModule,
    MatFormFieldModule,
    MatInputModule,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
  ],
  template: `
    <section class="page">
      <mat-card appearance="outlined" class="card">
        @if (busy()) {
          <mat-progress-bar mode="indeterminate" aria-label="Saving the new password" />
        }
        <mat-card-header>
          <mat-icon mat-card-avatar class="lamp" aria-hidden="true">lightbulb</mat-icon>
          <mat-card-title><h1 class="title">Choose a new password</h1></mat-card-title>
          <mat-card-subtitle>For your Allowlight account</mat-card-subtitle>
        </mat-card-header>
        <mat-card-content>
          @if (done()) {
            <p class="sent" role="status">
              <mat-icon aria-hidden="true">check_circle</mat-icon>Your new password is saved. Every session of the account was ended.
            </p>
            <a mat-flat-button routerLink="/sign-in">Sign in</a>
          } @else if (!token()) {
            <p class="failure" role="alert">
              <mat-icon aria-hidden="true">error</mat-icon>This link is incomplete. Open the whole link from the message, or ask for a new
              one.
            </p>
            <a mat-stroked-button routerLink="/forgot-password">Ask for a new link</a>
          } @else {
            <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
              <p class="hint" id="password-rules">{{ rules }}</p>
              <mat-form-field appearance="outline">
                <mat-label>New password</mat-label>
                <input
                  matInput
                  type="password"
                  formControlName="password"
                  autocomplete="new-password"
                  aria-describedby="password-rules"
                  required
                />
                @if (form.controls.password.hasError('required')) {
                  <mat-error>Enter the new password.</mat-error>
                } @else if (form.controls.password.hasError('minlength')) {
                  <mat-error>Use at least 12 characters.</mat-error>
                } @else if (form.controls.password.hasError('maxlength')) {
                  <mat-error>Use at most 64 characters.</mat-error>
                }
              </mat-form-field>
              <mat-form-field appearance="outline">
                <mat-label>New password again</mat-label>
                <input matInput type="password" formControlName="repeat" autocomplete="new-password" required />
                @if (form.controls.repeat.hasError('required')) {
                  <mat-error>Enter the new password again.</mat-error>
                } @else if (form.controls.repeat.hasError('mismatch')) {
                  <mat-error>The two passwords differ.</mat-error>
                }
              </mat-form-field>
              @if (failure(); as message) {
                <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
              }
              @if (expired()) {
                <a mat-stroked-button routerLink="/forgot-password">Ask for a new link</a>
              }
              <button mat-flat-button type="submit" [disabled]="busy()">Save the new password</button>
            </form>
          }
        </mat-card-content>
      </mat-card>
    </section>
  `,
  styleUrl: './sign-in-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly api = inject(PasswordApi);
  /** From the link's query string. */
  readonly token = input<string>('');
  protected readonly rules = passwordRuleWords;
  protected readonly form = inject(NonNullableFormBuilder).group({
    password: ['', [Validators.required, Validators.minLength(12), Validators.maxLength(64)]],
    repeat: ['', [Validators.required, sameAsPassword]],
  });
  protected readonly busy = signal(false);
  protected readonly done = signal(false);
  protected readonly expired = signal(false);
  protected readonly failure = signal<string | null>(null);

  constructor() {
    this.form.controls.password.valueChanges.subscribe(() => this.form.controls.repeat.updateValueAndValidity({ emitEvent: false }));
  }

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    this.api.completeReset(this.token(), this.form.getRawValue().password).subscribe({
      next: () => {
        this.busy.set(false);
        this.done.set(true);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.expired.set(error instanceof ApiError && error.code === 'invalid_token');
        this.failure.set(error instanceof ApiError ? error.message : 'The new password could not be saved. Try again.');
      },
    });
  }
}
