import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { Router, RouterLink } from '@angular/router';
import { of } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { InvitationApi } from './invitation-api';
import { NewPasswordFields, newPasswordGroup } from './new-password-fields';
import { passwordRuleWords } from './password-api';
import { PublicCard } from './public-card';

const roleWords: Record<string, string> = { engineer: 'an engineer', reviewer: 'a reviewer', contractor: 'a contractor' };
const day = new Intl.DateTimeFormat('en-US', { dateStyle: 'long' });

/** The page an invitation's link opens, before sign-in: who invites to what, then a name and a password, and into the project. */
@Component({
  selector: 'al-invitation-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    PublicCard,
    NewPasswordFields,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
  ],
  template: `
    <al-public-card
      heading="Join a project"
      subtitle="An invitation to Allowlight"
      [busy]="busy() || preview.isLoading()"
      [busyLabel]="busyLabel()"
    >
      @if (!token()) {
        <p class="failure" role="alert">
          <mat-icon aria-hidden="true">error</mat-icon>This link is incomplete. Open the whole link from the message.
        </p>
      } @else if (refusal(); as message) {
        <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
        <a mat-stroked-button routerLink="/sign-in">Go to sign-in</a>
      } @else if (preview.hasValue() && preview.value(); as invitation) {
        <p class="invited">
          {{ invitation.invitedBy ?? 'Someone' }} invites you to the team of <strong>{{ invitation.projectName }}</strong> as
          {{ role(invitation.role) }}.
        </p>
        <p class="hint">Your account will be {{ invitation.email }}. The invitation works until {{ until(invitation.expiresAt) }}.</p>
        <form [formGroup]="form" (ngSubmit)="submit()" novalidate>
          <mat-form-field appearance="outline">
            <mat-label>Your name</mat-label>
            <input matInput formControlName="name" autocomplete="name" required />
            @if (form.controls.name.hasError('required')) {
              <mat-error>Enter your name as your team will read it.</mat-error>
            } @else if (form.controls.name.hasError('maxlength')) {
              <mat-error>Use at most 200 characters.</mat-error>
            }
          </mat-form-field>
          <p class="hint" id="password-rules">{{ rules }}</p>
          <al-new-password-fields [group]="form.controls.password" rulesId="password-rules" />
          @if (failure(); as message) {
            <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
          }
          <button mat-flat-button type="submit" [disabled]="busy()">Join the project</button>
        </form>
      }
    </al-public-card>
  `,
  styleUrl: './sign-in-page.scss',
  styles: `
    .invited {
      margin: 16px 0 4px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationPage {
  private readonly api = inject(InvitationApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly fb = inject(NonNullableFormBuilder);
  /** From the link's query string. */
  readonly token = input<string>('');
  protected readonly rules = passwordRuleWords;
  protected readonly preview = rxResource({
    params: () => this.token(),
    stream: ({ params }) => (params ? this.api.preview(params) : of(null)),
  });
  /** Why the link cannot be used (not ours, expired, used, withdrawn), in the service's words. */
  protected readonly refusal = computed(() => {
    const error = this.preview.error();
    if (!error) return this.spent();
    return error instanceof ApiError ? error.message : 'The invitation could not be read. Reload the page to try again.';
  });
  /** Set when accepting finds the link no longer usable. */
  private readonly spent = signal<string | null>(null);
  protected readonly form = this.fb.group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    password: newPasswordGroup(this.fb),
  });
  protected readonly busy = signal(false);
  protected readonly busyLabel = computed(() => (this.busy() ? 'Making your account' : 'Reading the invitation'));
  protected readonly failure = signal<string | null>(null);

  protected role(role: string): string {
    return roleWords[role] ?? 'a member';
  }

  protected until(at: string): string {
    return day.format(new Date(at));
  }

  protected submit(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { name, password } = this.form.getRawValue();
    this.busy.set(true);
    this.failure.set(null);
    this.auth.acceptInvitation(this.token(), name.trim(), password.password).subscribe({
      next: (projectId) => void this.router.navigate(['/projects', projectId]),
      error: (error: unknown) => {
        this.busy.set(false);
        if (error instanceof ApiError && [404, 409, 410].includes(error.status)) {
          this.spent.set(error.message);
          return;
        }
        this.failure.set(error instanceof ApiError ? error.message : 'Your account could not be made. Try again.');
      },
    });
  }
}
