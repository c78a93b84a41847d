import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** How many values a page shows with the "verify" mark: what the engineer of record still checks there. */
@Component({
  selector: 'al-unverified-count',
  imports: [MatIconModule],
  template: `
    @if (count() > 0) {
      <p class="unverified-count" data-testid="unverified-count">
        <mat-icon aria-hidden="true">rule</mat-icon>
        {{ count() === 1 ? '1 value on this page rests' : count() + ' values on this page rest' }} on a source not yet confirmed against the
        printed code; each carries a “verify” mark that names it.
      </p>
    }
  `,
  styles: `
    .unverified-count {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0 0 12px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
      color: var(--mat-sys-tertiary);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UnverifiedCount {
  readonly count = input.required<number>();
}
