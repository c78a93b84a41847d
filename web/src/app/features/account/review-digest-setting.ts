import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatSlideToggleModule, type MatSlideToggle } from '@angular/material/slide-toggle';
import { of } from 'rxjs';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { AccountApi } from './account-api';

/**
 * The Account page's choice of the daily review digest. Shown to reviewers, and to anyone who has it
 * on (so a person who no longer reviews can still turn it off).
 */
@Component({
  selector: 'al-review-digest-setting',
  imports: [MatSlideToggleModule, MatIconModule],
  template: `
    @if (shown()) {
      <section class="digest" aria-labelledby="digest-heading">
        <h2 id="digest-heading">Review digest</h2>
        <p class="hint" id="digest-hint">
          Once a day, one message listing the projects waiting for your review and how long each has waited. Nothing is sent on a day when
          nothing waits. Each submission is mailed to you as it happens either way.
        </p>
        <mat-slide-toggle
          [checked]="on()"
          [disabled]="saving()"
          (change)="choose($event.checked, $event.source)"
          aria-describedby="digest-hint"
          >Send me the daily review digest</mat-slide-toggle
        >
        @if (failure(); as message) {
          <p class="message" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
        }
        <p class="notice" role="status">{{ notice() }}</p>
      </section>
    }
  `,
  styles: `
    section {
      margin-top: 16px;
      padding: 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    h2 {
      font: var(--mat-sys-title-large);
      margin: 0;
    }
    .hint {
      margin: 8px 0 16px;
      color: var(--mat-sys-on-surface-variant);
    }
    .message {
      display: flex;
      align-items: center;
      gap: 8px;
      color: var(--mat-sys-error);
    }
    .notice {
      margin: 8px 0 0;
      min-height: 1lh;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewDigestSetting {
  private readonly api = inject(AccountApi);
  private readonly auth = inject(AuthStore);

  private readonly settings = rxResource({
    params: () => this.auth.user()?.id,
    stream: ({ params: userId }) => (userId ? this.api.mailSettings() : of(null)),
  });
  /** The value last stored; a refused change falls back to it. */
  private readonly stored = signal<boolean | null>(null);
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly notice = signal('');

  protected readonly on = computed(
    () => this.stored() ?? (this.settings.hasValue() ? (this.settings.value()?.reviewDigest ?? false) : false),
  );
  /** Decided on what was loaded, so turning it off does not take the setting away from under the pointer. */
  protected readonly shown = computed(() => {
    const loaded = this.settings.hasValue() ? this.settings.value() : null;
    if (!loaded) return false;
    return (this.auth.user()?.roles.includes('reviewer') ?? false) || loaded.reviewDigest;
  });

  protected choose(reviewDigest: boolean, toggle: MatSlideToggle): void {
    this.saving.set(true);
    this.failure.set(null);
    this.notice.set('');
    this.api.saveMailSettings({ reviewDigest }).subscribe({
      next: (saved) => {
        this.saving.set(false);
        this.stored.set(saved.reviewDigest);
        this.notice.set(saved.reviewDigest ? 'The daily review digest is on.' : 'The daily review digest is off.');
      },
      error: (error: unknown) => {
        this.saving.set(false);
        // The toggle moved when it was pressed: put it back where the stored choice is.
        toggle.checked = this.on();
        this.failure.set(error instanceof ApiError ? error.message : 'Your choice could not be saved. Try again.');
      },
    });
  }
}
