import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { Citation, UnitSystem } from '../core/api/api-types';
import { inProjectUnits } from './unit-words';

/**
 * The small "verify" mark on a value not checked against a published source. Its tooltip (and
 * what a screen reader hears) is the source's citation and note in words, in the project's units.
 */
@Component({
  selector: 'al-verify-badge',
  imports: [MatTooltipModule],
  template: `<span class="badge" tabindex="0" [matTooltip]="text()" matTooltipClass="al-source-note" [attr.aria-label]="'Verify: ' + text()"
    >verify</span
  >`,
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
  /** The value's citation: its short form and its note make the tooltip. */
  readonly citation = input<Citation | null>(null);
  /** Words of our own, where the doubt is not about a source (a requirement the data cannot settle). */
  readonly note = input('');
  readonly units = input<UnitSystem>('ip');

  protected readonly text = computed(() => {
    const citation = this.citation();
    const words = citation ? [citation.short, citation.note].filter(Boolean).join('. ') : this.note();
    return inProjectUnits(words, this.units());
  });
}
