import { ChangeDetectionStrategy, Component, inject, input, output, signal, viewChild } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { ProjectRole } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { askToConfirm } from '../../shared/confirm-dialog';
import { InvitationsApi, type InvitationView } from './invitations-api';

const roleWords: Record<ProjectRole, string> = { engineer: 'Engineer', reviewer: 'Reviewer', contractor: 'Contractor' };
const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/** When an invitation's link stops working, or stopped, in words. */
export function expiryWords(invitation: Pick<InvitationView, 'expiresAt' | 'expired'>): string {
  const at = when.format(new Date(invitation.expiresAt));
  return invitation.expired ? `Expired ${at}: the link no longer works` : `Expires ${at}`;
}

/**
 * The invitations of a project's team waiting for an answer, and (for those who may) inviting an
 * address by e-mail and withdrawing an invitation.
 */
@Component({
  selector: 'al-invitations-panel',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  template: `
    <h4 id="invitations-heading">Invitations</h4>
    @if (invitations.hasValue() && invitations.value().length > 0) {
      <ul class="invitations" aria-labelledby="invitations-heading">
        @for (invitation of invitations.value(); track invitation.id) {
          <li [class.expired]="invitation.expired">
            <mat-icon aria-hidden="true">{{ invitation.expired ? 'schedule' : 'forward_to_inbox' }}</mat-icon>
            <span class="who">{{ invitation.email }}</span>
            <span class="detail">{{ roles[invitation.role] }}</span>
            <span class="detail">Invited by {{ invitation.invitedBy ?? 'someone no longer here' }}</span>
            <span class="detail">{{ expiry(invitation) }}</span>
            @if (canManage()) {
              <button
                mat-button
                type="button"
                [disabled]="busy()"
                (click)="withdraw(invitation)"
                [attr.aria-label]="'Withdraw the invitation of ' + invitation.email"
              >
                <mat-icon>cancel_schedule_send</mat-icon>Withdraw
              </button>
            }
          </li>
        }
      </ul>
    } @else if (invitations.hasValue()) {
      <p class="hint">No invitation is waiting for an answer.</p>
    }
    @if (canManage()) {
      <form class="invite" [formGroup]="form" (ngSubmit)="invite()" novalidate aria-label="Invite by e-mail">
        <mat-form-field appearance="outline" subscriptSizing="dynamic">
          <mat-label>E-mail address to invite</mat-label>
          <input matInput type="email" formControlName="email" autocomplete="off" />
          <mat-hint>They get a link to choose their name and a password; someone with an account joins at once</mat-hint>
          @if (form.controls.email.hasError('required')) {
            <mat-error>Enter an e-mail address.</mat-error>
          } @else if (form.controls.email.hasError('email')) {
            <mat-error>Enter a valid e-mail address.</mat-error>
          } @else if (form.controls.email.hasError('service')) {
            <mat-error>{{ form.controls.email.getError('service') }}</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>Role of the invited</mat-label>
          <mat-select formControlName="role">
            <mat-option value="reviewer">Reviewer</mat-option>
            <mat-option value="contractor">Contractor</mat-option>
            <mat-option value="engineer">Engineer</mat-option>
          </mat-select>
        </mat-form-field>
        <button mat-stroked-button type="submit" [disabled]="busy()"><mat-icon>send</mat-icon>Send the invitation</button>
      </form>
    }
    <p class="notice" role="status">{{ notice() }}</p>
    @if (failure(); as message) {
      <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
    }
  `,
  styles: `
    h4 {
      font: var(--mat-sys-title-small);
      margin: 16px 0 8px;
    }
    .invitations {
      list-style: none;
      margin: 0 0 12px;
      padding: 0;
      display: grid;
      gap: 8px;
    }
    li {
      display: flex;
      align-items: center;
      gap: 12px;
      flex-wrap: wrap;
    }
    .who {
      font: var(--mat-sys-title-small);
      overflow-wrap: anywhere;
    }
    .detail,
    .hint {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .invite {
      display: flex;
      gap: 12px;
      align-items: baseline;
      flex-wrap: wrap;
    }
    .invite mat-form-field:first-child {
      flex: 1 1 280px;
    }
    .notice:empty {
      display: none;
    }
    .failure {
      display: flex;
      gap: 8px;
      align-items: center;
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InvitationsPanel {
  private readonly api = inject(InvitationsApi);
  private readonly dialog = inject(MatDialog);
  readonly projectId = input.required<string>();
  readonly canManage = input(false);
  /** Someone with an account was added to the team rather than invited: the team needs reading again. */
  readonly joined = output<void>();

  protected readonly roles = roleWords;
  protected readonly expiry = expiryWords;
  protected readonly invitations = rxResource({ params: () => this.projectId(), stream: ({ params }) => this.api.list(params) });
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: ['', [Validators.required, Validators.email, Validators.maxLength(320)]],
    role: ['reviewer' as ProjectRole, Validators.required],
  });
  protected readonly busy = signal(false);
  protected readonly notice = signal('');
  protected readonly failure = signal<string | null>(null);
  private readonly formDirective = viewChild(FormGroupDirective);

  protected invite(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { email, role } = this.form.getRawValue();
    this.start();
    this.api.invite(this.projectId(), email.trim(), role).subscribe({
      next: (answer) => {
        this.busy.set(false);
        this.formDirective()?.resetForm({ email: '', role });
        if (answer.outcome === 'invited') {
          this.invitations.set(answer.invitations);
          this.notice.set(`An invitation is on its way to ${answer.invitation.email}.`);
        } else {
          this.notice.set(
            `${answer.name} has an account already, so they are on the team now as ${roleWords[answer.role].toLowerCase()}; a message tells them.`,
          );
          this.joined.emit();
        }
      },
      error: (error: unknown) => {
        this.busy.set(false);
        const onField = error instanceof ApiError ? error.details.find((detail) => detail.path === 'email') : undefined;
        if (error instanceof ApiError && onField) {
          this.form.controls.email.setErrors({ service: onField.message });
          this.failure.set(error.message);
          return;
        }
        this.failure.set(error instanceof ApiError ? error.message : 'The invitation could not be sent. Try again.');
      },
    });
  }

  protected withdraw(invitation: InvitationView): void {
    askToConfirm(this.dialog, {
      title: `Withdraw the invitation of ${invitation.email}?`,
      message: 'The link in their message stops working. You can invite the address again later.',
      confirm: 'Withdraw the invitation',
      cancel: 'Keep it',
    }).subscribe((confirmed) => {
      if (!confirmed) return;
      this.start();
      this.api.withdraw(this.projectId(), invitation.id).subscribe({
        next: (left) => {
          this.busy.set(false);
          this.invitations.set(left);
          this.notice.set(`The invitation of ${invitation.email} is withdrawn.`);
        },
        error: (error: unknown) => {
          this.busy.set(false);
          this.failure.set(error instanceof ApiError ? error.message : 'The invitation could not be withdrawn. Try again.');
          this.invitations.reload();
        },
      });
    });
  }

  private start(): void {
    this.busy.set(true);
    this.notice.set('');
    this.failure.set(null);
  }
}
