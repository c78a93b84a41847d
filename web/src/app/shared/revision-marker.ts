import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/** The marker's words on a space, for people who do not see its icon. */
export function revisionWords(count: number): string {
  return count === 1 ? '1 item needs revision' : `${count} items need revision`;
}

/** Before the name of a space whose check items need revision (a long name's end is cut off): an icon with the count, and the words for screen readers. */
@Component({
  selector: 'al-revision-marker',
  imports: [MatIconModule],
  template: `
    @if (count() > 0) {
      <span class="marker" [title]="words()" data-testid="revision-marker"
        ><mat-icon aria-hidden="true">flag</mat-icon><span aria-hidden="true">{{ count() }}</span
        ><span class="visually-hidden">{{ words() }}</span></span
      >
    }
  `,
  styles: `
    .marker {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      margin-inline-end: 6px;
      padding: 0 6px;
      border-radius: 10px;
      color: var(--mat-sys-on-error-container);
      background: var(--mat-sys-error-container);
      font: var(--mat-sys-label-small);
      vertical-align: middle;
      mat-icon {
        font-size: 14px;
        width: 14px;
        height: 14px;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionMarker {
  readonly count = input(0);
  protected readonly words = computed(() => revisionWords(this.count()));
}
