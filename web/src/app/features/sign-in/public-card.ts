import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** The one card the pages before sign-in stand in: the lamp, a heading, a line under it, and the product's caution below. */
@Component({
  selector: 'al-public-card',
  imports: [MatCardModule, MatIconModule, MatProgressBarModule],
  template: `
    <section class="page">
      <mat-card appearance="outlined" class="card">
        @if (busy()) {
          <mat-progress-bar mode="indeterminate" [attr.aria-label]="busyLabel()" />
        }
        <mat-card-header>
          <mat-icon mat-card-avatar class="lamp" aria-hidden="true">lightbulb</mat-icon>
          <mat-card-title
            ><h1 class="title">{{ heading() }}</h1></mat-card-title
          >
          <mat-card-subtitle>{{ subtitle() }}</mat-card-subtitle>
        </mat-card-header>
        <mat-card-content>
          <ng-content />
        </mat-card-content>
      </mat-card>
      <p class="caution">
        Allowlight checks lighting energy-code compliance only. It does not design emergency, egress or other life-safety lighting.
      </p>
    </section>
  `,
  styles: `
    .page {
      min-height: 100vh;
      display: flex;
      flex-direction: column;
      align-items: center;
      justify-content: center;
      gap: 16px;
      padding: 24px;
      box-sizing: border-box;
      // Quiet: the theme's low surface with a faint warm glow from above, like lamplight, never a bright field.
      background:
        radial-gradient(ellipse 80% 50% at 50% 0%, color-mix(in srgb, var(--mat-sys-tertiary) 10%, transparent), transparent 75%),
        var(--mat-sys-surface-container-low);
    }
    .card {
      width: min(420px, 100%);
      overflow: hidden;
    }
    .lamp {
      color: var(--mat-sys-tertiary);
      font-size: 40px;
      width: 40px;
      height: 40px;
    }
    .title {
      font: inherit;
      margin: 0;
    }
    .caution {
      max-width: 420px;
      text-align: center;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PublicCard {
  readonly heading = input.required<string>();
  readonly subtitle = input.required<string>();
  readonly busy = input(false);
  /** What the progress bar is for, read out while it runs. */
  readonly busyLabel = input('Working');
}
