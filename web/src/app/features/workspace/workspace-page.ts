import { ChangeDetectionStrategy, Component, computed, effect, inject, input } from '@angular/core';
import { MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { stateLabels } from '../projects/project-states';
import { ProjectStore } from './project-store';

interface WorkspaceArea {
  path: string;
  label: string;
  icon: string;
}

/** The project's areas, in the order the work goes. Review, Package, Field tests and Team follow. */
export const workspaceAreas: readonly WorkspaceArea[] = [
  { path: 'setup', label: 'Set-up', icon: 'tune' },
  { path: 'spaces', label: 'Spaces', icon: 'floor_lamp' },
  { path: 'luminaires', label: 'Luminaires', icon: 'light' },
  { path: 'controls', label: 'Controls', icon: 'toggle_on' },
  { path: 'daylight', label: 'Daylight', icon: 'wb_sunny' },
  { path: 'exterior', label: 'Exterior', icon: 'nightlight' },
  { path: 'results', label: 'Results', icon: 'fact_check' },
];

@Component({
  selector: 'al-workspace-page',
  imports: [MatSidenavModule, MatListModule, MatIconModule, MatChipsModule, MatProgressBarModule, MatTooltipModule, RouterLink, RouterLinkActive, RouterOutlet],
  providers: [ProjectStore],
  templateUrl: './workspace-page.html',
  styleUrl: './workspace-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WorkspacePage {
  protected readonly store = inject(ProjectStore);
  protected readonly areas = workspaceAreas;
  protected readonly stateLabels = stateLabels;

  /** Bound from the route. */
  readonly projectId = input.required<string>();

  protected readonly verdict = computed(() => {
    const state = this.store.results();
    if (state.status === 'ready') return state.result.complies ? 'complies' : 'does-not-comply';
    return state.status;
  });

  constructor() {
    effect(() => {
      const id = this.projectId();
      this.store.load(id).subscribe();
    });
  }
}
