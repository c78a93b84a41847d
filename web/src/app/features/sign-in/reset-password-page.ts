import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ApiError } from '../../core/http/api-error';
import { NewPasswordFields, newPasswordGroup } from './new-password-fields';
import { PublicCard } from './public-card';
import { PasswordApi, passwordRuleWords } from './password-api';

@Component({
  selector: 'al-reset-password-page',
  imports: [ReactiveFormsModule, RouterLink, PublicCard, NewPasswordFields, MatButtonModule, MatIconModule],
  template: `
    <al-public-card
      heading="Choose a new password"
      subtitle="For your Allowlight account"
      [busy]="busy()"
      busyLabel="Saving the new password"
    >
      @if (done()) {
        <p class="sent" role="status">
          <mat-icon aria-hidden="true">check_circle</mat-icon>Your new password is saved. Every session of the account was ended.
        </p>
        <a mat-flat-button routerLink="/sign-in">Sign in</a>
      } @else if (!token()) {
        <p class="failure" role="alert">
          <mat-icon aria-hidden="true">error</mat-icon>This link is incomplete. Open the whole link from the message, or ask for a new one.
        </p>
        <a mat-stroked-button routerLink="/forgot-password">Ask for a new link</a>
      } @else {
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <p class="hint" id="password-rules">{{ rules }}</p>
          <al-new-password-fields [group]="form" rulesId="password-rules" />
          @if (failure(); as message) {
            <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
          }
          @if (expired()) {
            <a mat-stroked-button routerLink="/forgot-password">Ask for a new link</a>
          }
          <button mat-flat-button type="submit" [disabled]="busy()">Save the new password</button>
        </form>
      }
    </al-public-card>
  `,
  styleUrl: './sign-in-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordPage {
  private readonly api = inject(PasswordApi);
  /** From the link's query string. */
  readonly token = input<string>('');
  protected readonly rules = passwordRuleWords;
  protected readonly form = newPasswordGroup(inject(NonNullableFormBuilder));
  protected readonly busy = signal(false);
  protected readonly done = signal(false);
  protected readonly expired = signal(false);
  protected readonly failure = signal<string | null>(null);

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
