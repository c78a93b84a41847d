import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { WriteFailure } from '../../shared/conflict';
import { ProjectApi } from '../projects/project-api';
import { stateLabels } from '../projects/project-states';
import { openItemWords, reasonTitles } from '../results/verdict-reasons';
import { ProjectStore } from './project-store';

interface WorkspaceArea {
  path: string;
  label: string;
  icon: string;
}

/** The project's areas, in the order the work goes, then its history. Review, Package, Field tests and Team follow. */
export const workspaceAreas: readonly WorkspaceArea[] = [
  { path: 'setup', label: 'Set-up', icon: 'tune' },
  { path: 'spaces', label: 'Spaces', icon: 'floor_lamp' },
  { path: 'luminaires', label: 'Luminaires', icon: 'light' },
  { path: 'controls', label: 'Controls', icon: 'toggle_on' },
  { path: 'daylight', label: 'Daylight', icon: 'wb_sunny' },
  { path: 'exterior', label: 'Exterior', icon: 'nightlight' },
  { path: 'results', label: 'Results', icon: 'fact_check' },
  { path: 'history', label: 'History', icon: 'history' },
];

@Component({
  selector: 'al-workspace-page',
  imports: [MatButtonModule, MatSidenavModule, MatListModule, MatIconModule, MatChipsModule, MatProgressBarModule, MatTooltipModule, RouterLink, RouterLinkActive, RouterOutlet],
  providers: [ProjectStore],
  templateUrl: './workspace-page.html',
  styleUrl: './workspace-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkspacePage {
  protected readonly store = inject(ProjectStore);
  private readonly projects = inject(ProjectApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly writeFailure = inject(WriteFailure);
  protected readonly areas = workspaceAreas;
  protected readonly unarchiving = signal(false);
  protected readonly stateLabels = stateLabels;

  /** Bound from the route. */
  readonly projectId = input.required<string>();

  protected readonly verdict = computed(() => {
    const state = this.store.results();
    if (state.status === 'ready') return state.result.verdict;
    return state.status;
  });

  /**
   * Why there is no pass, in a few words (plain text: the area names it holds must not read as
   * the navigation's links); "See why" leads to the Results page, where each reason is linked.
   */
  protected readonly verdictDetail = computed(() => {
    const state = this.store.results();
    if (state.status === 'incomplete') return 'the results cannot be computed yet';
    if (state.status !== 'ready') return '';
    const result = state.result;
    if (result.verdict === 'does-not-comply') return reasonTitles(result);
    return openItemWords(result);
  });

  constructor() {
    effect(() => {
      const id = this.projectId();
      this.store.load(id).subscribe();
    });
  }

  protected unarchive(): void {
    const id = this.store.projectId();
    if (!id) return;
    this.unarchiving.set(true);
    this.projects.unarchive(id).subscribe({
      next: (project) => {
        this.unarchiving.set(false);
        this.store.setProject(project);
        this.snackBar.open(`“${project.name}” is back among the current projects and can be changed again.`, undefined, { duration: 5000 });
      },
      error: (error: unknown) => {
        this.unarchiving.set(false);
        this.writeFailure.report(error, () => this.store.load(id).subscribe());
      },
    });
  }
}
