import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { CautionsBanner, defaultCautions } from '../../shared/cautions-banner';
import { ProjectStore } from '../workspace/project-store';
import { AllowanceChart } from './allowance-chart';
import { ResultsSummary } from './results-summary';
import { SpaceResultsTable } from './space-results-table';

/** The project's evaluation: the summary, a chart, and every space; recomputed as the design changes. */
@Component({
  selector: 'al-results-page',
  imports: [MatIconModule, MatProgressBarModule, CautionsBanner, ResultsSummary, SpaceResultsTable, AllowanceChart],
  templateUrl: './results-page.html',
  styleUrl: './results-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResultsPage {
  protected readonly store = inject(ProjectStore);
  protected readonly state = this.store.results;
  protected readonly updating = computed(() => this.state().status === 'updating' || this.state().status === 'idle');
  /** The result to lay out: the current one, or while updating the previous one, greyed and without its verdict. */
  protected readonly shown = computed(() => {
    const state = this.state();
    return state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null;
  });
  protected readonly cautions = computed(() => this.shown()?.cautions ?? defaultCautions);
}
