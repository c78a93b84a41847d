import { ChangeDetectionStrategy, Component, inject, signal, viewChild } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { FormGroupDirective, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { CardRows } from '../../shared/card-rows';
import { askToConfirm } from '../../shared/confirm-dialog';
import { accountChangeWords } from './account-change-words';
import { PeopleApi, type AccountView } from './people-api';

const moment = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });

/** For administrators: every account, a new one (its owner chooses the password by mail), and who may administer. */
@Component({
  selector: 'al-people-page',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    CardRows,
  ],
  template: `
    <header class="heading"><h1>People</h1></header>
    <p class="hint">
      Everyone with an Allowlight account. A new account gets a message with a link to choose its password. A disabled account cannot sign
      in and its sessions end; its work stays in the projects.
    </p>
    <section class="new" aria-labelledby="new-heading">
      <h2 id="new-heading">New account</h2>
      <form [formGroup]="form" (ngSubmit)="create()" novalidate>
        <mat-form-field appearance="outline">
          <mat-label>Name</mat-label>
          <input matInput formControlName="name" autocomplete="off" required />
          @if (form.controls.name.hasError('required')) {
            <mat-error>Enter the name.</mat-error>
          }
        </mat-form-field>
        <mat-form-field appearance="outline">
          <mat-label>E-mail</mat-label>
          <input matInput type="email" formControlName="email" autocomplete="off" required />
          @if (form.controls.email.hasError('required')) {
            <mat-error>Enter the e-mail address.</mat-error>
          } @else if (form.controls.email.hasError('email')) {
            <mat-error>Enter a valid e-mail address.</mat-error>
          } @else if (form.controls.email.hasError('service')) {
            <mat-error>{{ form.controls.email.getError('service') }}</mat-error>
          }
        </mat-form-field>
        <mat-checkbox formControlName="isAdmin">Administrator</mat-checkbox>
        <button mat-flat-button type="submit" [disabled]="busy()">Create the account</button>
      </form>
    </section>
    @if (notice(); as message) {
      <p class="notice" role="status"><mat-icon aria-hidden="true">check_circle</mat-icon>{{ message }}</p>
    }
    @if (failure(); as message) {
      <p class="failure" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
    }
    @if (accounts.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the accounts" />
    }
    @if (accounts.hasValue()) {
      <table alCardRows class="accounts">
        <caption class="visually-hidden">
          Accounts
        </caption>
        <thead>
          <tr>
            <th scope="col">Name</th>
            <th scope="col">E-mail</th>
            <th scope="col">Role</th>
            <th scope="col">State</th>
            <th scope="col"><span class="visually-hidden">Changes</span></th>
          </tr>
        </thead>
        <tbody>
          @for (account of accounts.value(); track account.id) {
            <tr [class.disabled]="account.disabled">
              <td>{{ account.name }}</td>
              <td>{{ account.email }}</td>
              <td>{{ account.isAdmin ? 'Administrator' : 'Project roles only' }}</td>
              <td>{{ account.disabled ? 'Disabled' : 'Enabled' }}</td>
              <td class="actions">
                @if (account.id !== auth.user()?.id) {
                  <button mat-stroked-button type="button" [disabled]="busy()" (click)="toggleAdmin(account)">
                    {{ account.isAdmin ? 'Remove administrator' : 'Make administrator' }}
                  </button>
                  <button mat-stroked-button type="button" [disabled]="busy()" (click)="toggleDisabled(account)">
                    {{ account.disabled ? 'Enable' : 'Disable' }}
                  </button>
                } @else {
                  <span class="hint">You</span>
                }
              </td>
            </tr>
          }
        </tbody>
      </table>
    }
    <section class="changes" aria-labelledby="changes-heading">
      <h2 id="changes-heading">Changes to accounts</h2>
      <p class="hint">Newest first: accounts made, administrators made or removed, accounts disabled or enabled.</p>
      @if (changes.hasValue()) {
        @if (changes.value().length === 0) {
          <p class="hint">No account has changed yet.</p>
        } @else {
          <ol class="change-list">
            @for (change of changes.value(); track change.id) {
              <li>
                <span>{{ words(change) }}</span>
                <time class="hint" [attr.datetime]="change.at">{{ when(change.at) }}</time>
              </li>
            }
          </ol>
        }
      } @else if (changes.error()) {
        <p class="failure" role="alert">
          <mat-icon aria-hidden="true">error</mat-icon>The changes could not be read. Reload the page to try again.
        </p>
      }
    </section>
  `,
  styles: `
    :host {
      display: block;
      max-width: 1100px;
    }
    .heading h1 {
      font: var(--mat-sys-headline-medium);
      margin: 0 0 8px;
    }
    h2 {
      font: var(--mat-sys-title-large);
      margin: 0 0 8px;
    }
    .hint {
      color: var(--mat-sys-on-surface-variant);
    }
    .new {
      padding: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
      margin-bottom: 16px;
    }
    form {
      display: flex;
      flex-wrap: wrap;
      gap: 0 16px;
      align-items: baseline;
    }
    mat-form-field {
      flex: 1 1 240px;
    }
    .accounts {
      width: 100%;
      border-collapse: collapse;
    }
    .accounts th,
    .accounts td {
      text-align: left;
      padding: 6px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .actions {
      display: flex;
      gap: 8px;
      flex-wrap: wrap;
    }
    tr.disabled td:not(.actions) {
      color: var(--mat-sys-on-surface-variant);
    }
    .changes {
      margin-top: 24px;
    }
    .change-list {
      list-style: none;
      margin: 0;
      padding: 0;
      display: grid;
      gap: 8px;
    }
    .change-list li {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 12px;
      padding-bottom: 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .notice,
    .failure {
      display: flex;
      align-items: center;
      gap: 8px;
    }
    .notice {
      color: var(--mat-sys-primary);
    }
    .failure {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeoplePage {
  private readonly api = inject(PeopleApi);
  private readonly dialog = inject(MatDialog);
  protected readonly auth = inject(AuthStore);
  protected readonly accounts = rxResource({ stream: () => this.api.list() });
  protected readonly changes = rxResource({ stream: () => this.api.changes() });
  protected readonly words = accountChangeWords;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    email: ['', [Validators.required, Validators.email, Validators.maxLength(320)]],
    isAdmin: [false],
  });
  protected readonly busy = signal(false);
  protected readonly notice = signal<string | null>(null);
  protected readonly failure = signal<string | null>(null);
  private readonly formDirective = viewChild.required(FormGroupDirective);

  protected create(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.start();
    this.api.create(this.form.getRawValue()).subscribe({
      next: (account) => {
        this.formDirective().resetForm({ name: '', email: '', isAdmin: false });
        this.done(`${account.name} has an account now; a message with a link to choose the password is on its way to ${account.email}.`);
      },
      error: (error: unknown) => {
        if (error instanceof ApiError && error.details[0]?.path === 'email') {
          this.busy.set(false);
          this.form.controls.email.setErrors({ service: error.details[0].message });
          return;
        }
        this.failed(error);
      },
    });
  }

  protected toggleAdmin(account: AccountView): void {
    this.change(
      account,
      { isAdmin: !account.isAdmin },
      account.isAdmin ? `${account.name} is no longer an administrator.` : `${account.name} is an administrator now.`,
    );
  }

  protected toggleDisabled(account: AccountView): void {
    if (account.disabled) {
      this.change(account, { disabled: false }, `${account.name}'s account is enabled again.`);
      return;
    }
    askToConfirm(this.dialog, {
      title: `Disable ${account.name}'s account?`,
      message: 'They are signed out everywhere and cannot sign in until the account is enabled again.',
      confirm: 'Disable the account',
    }).subscribe((confirmed) => {
      if (confirmed) this.change(account, { disabled: true }, `${account.name}'s account is disabled.`);
    });
  }

  private change(account: AccountView, change: { isAdmin?: boolean; disabled?: boolean }, words: string): void {
    this.start();
    this.api.change(account.id, change).subscribe({ next: () => this.done(words), error: (error: unknown) => this.failed(error) });
  }

  private start(): void {
    this.busy.set(true);
    this.notice.set(null);
    this.failure.set(null);
  }

  private done(words: string): void {
    this.busy.set(false);
    this.notice.set(words);
    this.accounts.reload();
    this.changes.reload();
  }

  protected when(at: string): string {
    return moment.format(new Date(at));
  }

  private failed(error: unknown): void {
    this.busy.set(false);
    this.failure.set(error instanceof ApiError ? error.message : 'The change could not be made. Try again.');
  }
}
