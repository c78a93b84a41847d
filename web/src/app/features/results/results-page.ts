import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import type { EvaluationResult } from '../../core/api/api-types';
import { CautionsBanner, defaultCautions } from '../../shared/cautions-banner';
import { WriteFailure } from '../../shared/write-failure';
import { ProblemList } from '../../shared/problem-list';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { AllowanceChart } from './allowance-chart';
import { ResultsSummary } from './results-summary';
import { SpaceResultsTable } from './space-results-table';
import { ReviewSummaryCard } from '../review/review-summary-card';

/** The project's evaluation: the summary, a chart, and every space; recomputed as the design changes. */
@Component({
  selector: 'al-results-page',
  imports: [
    MatIconModule,
    MatProgressBarModule,
    CautionsBanner,
    ProblemList,
    ResultsSummary,
    SpaceResultsTable,
    AllowanceChart,
    ReviewSummaryCard,
  ],
  templateUrl: './results-page.html',
  styleUrl: './results-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsPage {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly failure = inject(WriteFailure);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly state = this.store.results;
  protected readonly updating = computed(() => this.state().status === 'updating' || this.state().status === 'idle');
  /** The result to lay out: the current one, or while updating the previous one, greyed and without its verdict. */
  protected readonly shown = computed(() => {
    const state = this.state();
    return state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null;
  });
  protected readonly cautions = computed(() => this.shown()?.cautions ?? defaultCautions);

  /** The engineer says a space without luminaires has no lighting: it stops holding the verdict back. */
  protected amendmentTitles(result: EvaluationResult): string {
    return result.amendments.map((amendment) => amendment.title).join('; ');
  }

  protected confirmUnlit(spaceId: string): void {
    const projectId = this.store.projectId();
    const space = this.store.spaces().find((candidate) => candidate.id === spaceId);
    if (!projectId || !space) return;
    this.failure.save(this.api.patchSpace(projectId, space.id, space.version, { unlit: true }), {
      saved: (saved) => {
        this.store.upsertSpace(saved);
        this.snackBar.open(`“${saved.name}” is confirmed unlit: it adds no allowance and no longer holds the verdict back.`, undefined, {
          duration: 5000,
        });
      },
      reload: () => this.store.reloadSpaces().subscribe(),
    });
  }
}
