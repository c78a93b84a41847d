import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, EMPTY, map, of, switchMap } from 'rxjs';
import { projectStateLabels } from '../../../../../contract/review';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { askToConfirm } from '../../shared/confirm-dialog';
import { fieldTestStatus } from '../field-tests/field-test-status';
import { HistoryApi } from '../history/history-api';
import { ProjectStore } from '../workspace/project-store';
import { movesFrom, type ReviewMove } from './review-moves';
import { openReturnDialog } from './return-dialog';

/**
 * The project's review state in words, with the moves the signed-in person may make from it; and,
 * while the state locks the design, the banner that says why.
 */
@Component({
  selector: 'al-review-state-bar',
  imports: [DatePipe, MatButtonModule, MatIconModule],
  template: `
    @if (store.project(); as project) {
      <section class="state-bar" aria-label="Review state" data-testid="review-state">
        <p class="state">
          <span class="label">{{ stateLabel() }}</span>
          <span class="meta">Revision {{ project.revision }}</span>
          @if (fieldTests(); as tests) {
            <span class="field-tests" [class.complete]="tests.complete" data-testid="state-field-tests"
              ><mat-icon aria-hidden="true">{{ tests.complete ? 'task_alt' : 'fact_check' }}</mat-icon
              >{{ tests.words }}{{ tests.completedAt ? ' on ' + (tests.completedAt | date: 'mediumDate') : '' }}</span
            >
          }
        </p>
        @if (moves().length > 0) {
          <div class="moves">
            @for (move of moves(); track move.to) {
              @if (move.primary) {
                <button mat-flat-button type="button" (click)="make(move)" [disabled]="busy()">
                  <mat-icon>{{ move.icon }}</mat-icon>{{ move.label }}
                </button>
              } @else {
                <button mat-stroked-button type="button" (click)="make(move)" [disabled]="busy()">
                  <mat-icon>{{ move.icon }}</mat-icon>{{ move.label }}
                </button>
              }
            }
          </div>
        }
      </section>
      @if (returnNote(); as note) {
        <p class="return-note" role="note" data-testid="return-note">
          <mat-icon aria-hidden="true">undo</mat-icon>
          <span>Returned by {{ note.by }} on {{ note.at | date: 'mediumDate' }}{{ note.comment ? ': “' + note.comment + '”' : '' }}</span>
        </p>
      }
      @if (refusal(); as message) {
        <p class="refusal" role="alert"><mat-icon aria-hidden="true">error</mat-icon>{{ message }}</p>
      }
      @if (store.lockedReason(); as reason) {
        <p class="locked" role="note" data-testid="locked-banner"><mat-icon aria-hidden="true">lock</mat-icon>{{ reason }}</p>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .state-bar {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      justify-content: space-between;
      gap: 8px 16px;
      margin-bottom: 12px;
    }
    .state {
      display: flex;
      flex-wrap: wrap;
      align-items: baseline;
      gap: 4px 12px;
      margin: 0;
    }
    .label {
      font: var(--mat-sys-title-medium);
    }
    .label,
    .meta {
      white-space: nowrap;
    }
    .meta {
      color: var(--mat-sys-on-surface-variant);
    }
    .field-tests {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      color: var(--mat-sys-on-surface-variant);
    }
    .field-tests.complete {
      color: var(--mat-sys-primary);
    }
    .field-tests mat-icon {
      align-self: center;
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    .moves {
      display: flex;
      flex-wrap: wrap;
      gap: 8px;
    }
    .return-note {
      display: flex;
      align-items: flex-start;
      gap: 8px;
      margin: 0 0 12px;
      white-space: pre-wrap;
    }
    .refusal,
    .locked {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0 0 12px;
      padding: 8px 12px;
      border-radius: 8px;
    }
    .refusal {
      color: var(--mat-sys-on-error-container);
      background: var(--mat-sys-error-container);
    }
    .locked {
      color: var(--mat-sys-on-tertiary-container);
      background: var(--mat-sys-tertiary-container);
    }
    @media print {
      .moves {
        display: none;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewStateBar {
  protected readonly store = inject(ProjectStore);
  private readonly auth = inject(AuthStore);
  private readonly dialogs = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly history = inject(HistoryApi);
  protected readonly busy = signal(false);
  protected readonly fieldTests = computed(() => fieldTestStatus(this.store.project()?.fieldTests));
  protected readonly refusal = signal<string | null>(null);

  protected readonly stateLabel = computed(() => {
    const project = this.store.project();
    return project ? projectStateLabels[project.state] : '';
  });

  /**
   * While the design is returned, who returned it and why: the last return in the project's
   * history (read again at each new version). Not shown when the history cannot be read or does
   * not hold it within its newest page.
   */
  private readonly lastReturn = rxResource({
    params: () => {
      const project = this.store.project();
      return project?.state === 'returned' ? { id: project.id, version: project.version } : undefined;
    },
    stream: ({ params }) =>
      this.history.history(params.id, { limit: 50 }).pipe(
        map((page) => {
          for (const entry of page.entries) {
            if (entry.entity === 'project' && entry.transition?.to === 'returned') {
              return { by: entry.user?.name ?? 'a reviewer no longer registered', at: entry.at, comment: entry.transition.comment ?? '' };
            }
          }
          return null;
        }),
        catchError(() => of(null)),
      ),
  });
  protected readonly returnNote = computed(() =>
    this.store.project()?.state === 'returned' && this.lastReturn.hasValue() ? this.lastReturn.value() : null,
  );

  /** None on an archived project: it cannot change at all. */
  protected readonly moves = computed(() => {
    const project = this.store.project();
    if (!project || project.archivedAt) return [];
    return movesFrom(project.state, project.role, this.auth.user()?.isAdmin ?? false);
  });

  protected make(move: ReviewMove): void {
    const project = this.store.project();
    if (!project) return;
    this.refusal.set(null);
    if (move.asksComment) {
      openReturnDialog(this.dialogs, { projectName: project.name, send: (comment) => this.store.move(move.to, comment) }).subscribe(
        (moved) => {
          if (moved) this.snackBar.open(move.done, undefined, { duration: 5000 });
        },
      );
      return;
    }
    const going = move.asksConfirm
      ? askToConfirm(this.dialogs, {
          title: 'Reopen the design as a draft?',
          message: `The design can be changed again, as revision ${project.revision + 1}. It needs a new review before it is accepted again.`,
          confirm: 'Reopen as a draft',
        }).pipe(switchMap((yes) => (yes ? this.store.move(move.to) : EMPTY)))
      : this.store.move(move.to);
    this.busy.set(true);
    going.subscribe({
      next: () => this.snackBar.open(move.done, undefined, { duration: 5000 }),
      error: (error: unknown) => {
        this.busy.set(false);
        this.refused(error);
      },
      complete: () => this.busy.set(false),
    });
  }

  /** A 409 names the state the project is in now: it is read again, so the moves offered follow. */
  private refused(error: unknown): void {
    if (!(error instanceof ApiError)) {
      this.refusal.set('The move could not be made. Try again.');
      return;
    }
    this.refusal.set(error.message);
    if (error.status === 409) this.store.readAgain();
  }
}
