import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { catchError, filter, map, of, startWith, switchMap } from 'rxjs';
import type { ProjectComparison } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { CautionsBanner, defaultCautions } from '../../shared/cautions-banner';
import { ProblemList } from '../../shared/problem-list';
import { VerifyBadge } from '../../shared/verify-badge';
import { ProjectStore } from '../workspace/project-store';
import { CompareApi } from './compare-api';
import { compareView } from './compare-columns';

type CompareState =
  | { status: 'loading' }
  | { status: 'ready'; comparison: ProjectComparison }
  /** The design cannot be evaluated under its own edition yet: the Results page lists why. */
  | { status: 'incomplete'; message: string }
  | { status: 'failed'; message: string };

/**
 * The design under its own edition and every other one, side by side: the power figures, the
 * verdict, the controls whose requirement changes, and what does not map. Columns become stacked
 * cards on a phone and on paper.
 */
@Component({
  selector: 'al-compare-page',
  imports: [MatIconModule, MatProgressBarModule, RouterLink, CautionsBanner, ProblemList, VerifyBadge],
  templateUrl: './compare-page.html',
  styleUrl: './compare-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComparePage {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(CompareApi);

  /**
   * Compared again whenever the project's own results are new (a write here or anyone's change the
   * workspace follows), so the editions never show a design older than the one on Results.
   */
  private readonly design = computed(() => {
    const id = this.store.projectId();
    const results = this.store.results();
    return id !== null && (results.status === 'ready' || results.status === 'incomplete') ? { id, results } : null;
  });

  protected readonly state = toSignal(
    toObservable(this.design).pipe(
      filter((design) => design !== null),
      map((design) => design.id),
      switchMap((id) =>
        this.api.comparison(id).pipe(
          map((comparison): CompareState => ({ status: 'ready', comparison })),
          catchError((error: unknown) =>
            of<CompareState>(
              error instanceof ApiError && error.status === 400
                ? { status: 'incomplete', message: error.message }
                : { status: 'failed', message: error instanceof ApiError ? error.message : 'The editions could not be compared.' },
            ),
          ),
        ),
      ),
      startWith<CompareState>({ status: 'loading' }),
    ),
    { initialValue: { status: 'loading' } as CompareState },
  );

  protected readonly view = computed(() => {
    const state = this.state();
    if (state.status !== 'ready') return null;
    return compareView(state.comparison, {
      spaces: this.store.spaces(),
      luminaireTags: this.store.luminaireTypes().map((type) => type.tag),
      units: this.store.units(),
    });
  });
  protected readonly cautions = computed(() => {
    const state = this.state();
    return state.status === 'ready' ? state.comparison.cautions : defaultCautions;
  });
}
