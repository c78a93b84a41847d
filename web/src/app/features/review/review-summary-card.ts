import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import { ProjectStore } from '../workspace/project-store';
import { countsByKind } from './review-items';

/** On Results: the review's open items by kind, and the way to the Review page. Nothing before a first submission. */
@Component({
  selector: 'al-review-summary-card',
  imports: [MatIconModule, RouterLink],
  template: `
    @if (items().length > 0) {
      <section class="review-card" aria-labelledby="review-card-heading" data-testid="review-summary">
        <h3 id="review-card-heading"><mat-icon aria-hidden="true">rate_review</mat-icon>Review, round {{ round() }}</h3>
        @if (counts().length === 0) {
          <p>Every check item has a verdict, and none needs revision.</p>
        } @else {
          <p>{{ openTotal() }} without a verdict · {{ revisionTotal() }} {{ revisionTotal() === 1 ? 'needs' : 'need' }} revision</p>
          <ul>
            @for (count of counts(); track count.kind) {
              <li>
                {{ count.label }}: {{ count.open }} open{{
                  count.needsRevision > 0 ? ', ' + count.needsRevision + ' needing revision' : ''
                }}
              </li>
            }
          </ul>
        }
        <a routerLink="../review">Open the review</a>
      </section>
    }
  `,
  styles: `
    .review-card {
      margin: 16px 0;
      padding: 12px 16px;
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 12px;
    }
    h3 {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0 0 8px;
    }
    ul {
      margin: 4px 0 8px;
      padding-inline-start: 20px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewSummaryCard {
  private readonly store = inject(ProjectStore);
  protected readonly items = computed(() => {
    const state = this.store.reviewItems();
    return state.status === 'ready' ? state.items : [];
  });
  protected readonly round = computed(() => Math.max(0, ...this.items().map((item) => item.round)));
  protected readonly counts = computed(() => countsByKind(this.items()));
  protected readonly openTotal = computed(() => this.counts().reduce((sum, count) => sum + count.open, 0));
  protected readonly revisionTotal = computed(() => this.counts().reduce((sum, count) => sum + count.needsRevision, 0));
}
