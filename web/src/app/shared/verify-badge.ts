import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatTooltipModule } from '@angular/material/tooltip';

/** The small "verify" mark on a value that does not come from a verified published source. */
@Component({
  selector: 'al-verify-badge',
  imports: [MatTooltipModule],
  template: `<span class="badge" tabindex="0" [matTooltip]="note()" [attr.aria-label]="'Verify: ' + note()">verify</span>`,
  styles: `
    .badge {
      display: inline-block;
      padding: 0 6px;
      margin-left: 4px;
      border-radius: 6px;
      border: 1px solid var(--mat-sys-tertiary);
      color: var(--mat-sys-on-tertiary-container);
      background: var(--mat-sys-tertiary-container);
      font: var(--mat-sys-label-small);
      line-height: 16px;
      vertical-align: middle;
      cursor: help;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class VerifyBadge {
  /** The source's note, shown on hover and read by screen readers. */
  readonly note = input.required<string>();
}
