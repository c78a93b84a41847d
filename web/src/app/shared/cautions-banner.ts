import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

export const defaultCautions = [
  'Energy-code compliance only: this is not a design for emergency, egress or other life-safety lighting.',
  'Local amendments and the authority having jurisdiction govern.',
  'The engineer of record verifies every value marked "verify" against the adopted code text.',
];

/** The cautions every results view and document carries. */
@Component({
  selector: 'al-cautions-banner',
  imports: [MatIconModule],
  template: `
    <aside class="cautions" role="note" aria-label="Cautions">
      <mat-icon aria-hidden="true">health_and_safety</mat-icon>
      <ul>
        @for (caution of cautions(); track caution) {
          <li>{{ caution }}</li>
        }
      </ul>
    </aside>
  `,
  styles: `
    .cautions {
      display: flex;
      gap: 12px;
      padding: 12px 16px;
      border-radius: 12px;
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      font: var(--mat-sys-body-small);
    }
    ul {
      margin: 0;
      padding-left: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CautionsBanner {
  readonly cautions = input<readonly string[]>(defaultCautions);
}
