import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { RouterLink } from '@angular/router';
import { projectStateLabels, type ReviewDeskEntry } from '../../../../../contract/review';
import { CardRows } from '../../shared/card-rows';
import { reviewReadFailure } from '../workspace/project-store';
import { ReviewApi } from './review-api';
import { ageInDays } from './review-items';

/** The reviewer's worklist: every project they review, its state, round and open items, oldest submission first. */
@Component({
  selector: 'al-review-desk-page',
  imports: [DatePipe, RouterLink, MatIconModule, MatProgressBarModule, MatTableModule, CardRows],
  template: `
    <header class="heading">
      <h1>Review desk</h1>
      <p class="lead">The projects you review. Open one to give each check item its verdict.</p>
    </header>
    @if (desk.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Reading the review desk" />
    } @else if (failure(); as message) {
      <p class="message" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
    } @else if (rows().length === 0) {
      <p class="message"><mat-icon aria-hidden="true">inbox</mat-icon>No project is waiting for you: you review none yet.</p>
    } @else {
      <div class="table-frame">
        <table mat-table alCardRows [dataSource]="rows()" aria-label="Projects you review">
          <ng-container matColumnDef="name">
            <th mat-header-cell *matHeaderCellDef>Project</th>
            <td mat-cell *matCellDef="let row">
              <a [routerLink]="['/projects', row.projectId, 'review']">{{ row.name }}</a>
            </td>
          </ng-container>
          <ng-container matColumnDef="state">
            <th mat-header-cell *matHeaderCellDef>State</th>
            <td mat-cell *matCellDef="let row">{{ stateLabels[asRow(row).state] }}</td>
          </ng-container>
          <ng-container matColumnDef="round">
            <th mat-header-cell *matHeaderCellDef>Revision · round</th>
            <td mat-cell *matCellDef="let row">{{ row.revision }} · {{ row.round }}</td>
          </ng-container>
          <ng-container matColumnDef="submitted">
            <th mat-header-cell *matHeaderCellDef>Submitted</th>
            <td mat-cell *matCellDef="let row">
              @if (row.submittedAt) {
                {{ row.submittedAt | date: 'mediumDate' }}{{ row.submittedBy ? ' by ' + row.submittedBy : '' }}
              } @else {
                Not submitted yet
              }
            </td>
          </ng-container>
          <ng-container matColumnDef="items">
            <th mat-header-cell *matHeaderCellDef>Open · needs revision · total</th>
            <td mat-cell *matCellDef="let row" class="numeric">{{ row.open }} · {{ row.needsRevision }} · {{ row.total }}</td>
          </ng-container>
          <ng-container matColumnDef="age">
            <th mat-header-cell *matHeaderCellDef>Waiting</th>
            <td mat-cell *matCellDef="let row" class="numeric">
              {{ row.age === null ? '—' : row.age === 1 ? '1 day' : row.age + ' days' }}
            </td>
          </ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns" [class.waiting]="asRow(row).state === 'in-review'"></tr>
        </table>
      </div>
    }
  `,
  styles: `
    .heading h1 {
      margin-bottom: 4px;
    }
    .lead {
      margin-top: 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .message {
      display: flex;
      align-items: center;
      gap: 8px;
    }
    .table-frame {
      overflow-x: auto;
    }
    .numeric {
      font-variant-numeric: tabular-nums;
    }
    tr.waiting td:first-child {
      font-weight: 600;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewDeskPage {
  private readonly api = inject(ReviewApi);
  protected readonly stateLabels = projectStateLabels;
  protected readonly columns = ['name', 'state', 'round', 'submitted', 'items', 'age'];
  protected readonly desk = rxResource({ stream: () => this.api.desk() });

  protected readonly failure = computed(() => {
    const error = this.desk.error();
    if (!error) return null;
    return reviewReadFailure(error, 'The review desk could not be read.');
  });

  /** Projects waiting in review first, the longest waiting at the top; then the rest by name. */
  protected readonly rows = computed(() => {
    const now = new Date();
    const entries = this.desk.hasValue() ? this.desk.value() : [];
    return entries
      .map((entry) => ({ ...entry, age: entry.submittedAt ? ageInDays(entry.submittedAt, now) : null }))
      .sort(
        (a, b) =>
          Number(b.state === 'in-review') - Number(a.state === 'in-review') ||
          (b.age ?? -1) - (a.age ?? -1) ||
          a.name.localeCompare(b.name),
      );
  });

  protected asRow(row: unknown): ReviewDeskEntry {
    return row as ReviewDeskEntry;
  }
}
