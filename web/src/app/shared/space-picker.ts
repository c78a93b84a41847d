import { ChangeDetectionStrategy, Component, input, ViewEncapsulation } from '@angular/core';

/**
 * A list of spaces beside the chosen one's detail (the Controls, Daylight and Allowances pages).
 * The page projects the list, marked `pickerList` (a filter, a note, the `mat-action-list` whose
 * chosen button carries `aria-current`), and the detail as the rest. Below 1000 px the list sits
 * above the detail with a height of its own; in print it is gone and the detail takes the width.
 */
@Component({
  selector: 'al-space-picker',
  template: `
    <nav class="space-list" [attr.aria-label]="label()">
      <ng-content select="[pickerList]" />
    </nav>
    <ng-content />
  `,
  styleUrl: './space-picker.scss',
  // The list's buttons and filter are the page's own elements: the styles reach them under this element's name.
  encapsulation: ViewEncapsulation.None,
  host: { '[style.--picker-list-height.px]': 'narrowHeight()' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpacePicker {
  /** The list's name as a navigation landmark. */
  readonly label = input('Spaces');
  /** The list's height when it sits above the detail. */
  readonly narrowHeight = input(240);
}
