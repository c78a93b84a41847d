import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { ApiError } from '../../core/http/api-error';
import { PublicCard } from './public-card';
import { PasswordApi } from './password-api';

@Component({
  selector: 'al-forgot-password-page',
  imports: [ReactiveFormsModule, RouterLink, PublicCard, MatFormFieldModule, MatInputModule, MatButtonModule, MatIconModule],
  template: `
    <al-public-card heading="Forgot your password?" subtitle="We send a link to choose a new one" [busy]="busy()" busyLabel="Sending">
      @if (sent(); as message) {
        <p class="sent" role="status"><mat-icon aria-hidden="true">mark_email_read</mat-icon>{{ message }}</p>
        <p>The link works once, for a short time. Nothing arrived? Check the address, then ask again.</p>
        <a mat-stroked-button routerLink="/sign-in">Back to sign-in</a>
      } @else {
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <mat-form-field appearance="outline">
            <mat-label>E-mail</mat-label>
            <input matInput type="email" formControlName="email" autocomplete="username" required />
            @if (form.controls.email.hasError('required')) {
              <mat-error>Enter your e-mail address.</mat-error>
            } @else if (form.controls.email.hasError('email')) {
              <mat-error>Enter a valid e-mail address.</mat-error>
            }
          </mat-form-field>
          @if (failure(); as message) {
            <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
          }
          <button mat-flat-button type="submit" [disabled]="busy()">Send the link</button>
          <a mat-button routerLink="/sign-in">Back to sign-in</a>
        </form>
      }
    </al-public-card>
  `,
  styleUrl: './sign-in-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ForgotPasswordPage {
  private readonly api = inject(PasswordApi);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(320)]],
  });
  protected readonly busy = signal(false);
  protected readonly sent = signal<string | null>(null);
  protected readonly failure = signal<string | null>(null);

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    this.api.requestReset(this.form.getRawValue().email).subscribe({
      next: ({ message }) => {
        this.busy.set(false);
        this.sent.set(message);
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(error instanceof ApiError ? error.message : 'The request could not be sent. Try again.');
      },
    });
  }
}
