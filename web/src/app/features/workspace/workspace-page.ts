import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatDialog } from '@angular/material/dialog';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatTooltipModule } from '@angular/material/tooltip';
import { NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, map, startWith, tap } from 'rxjs';
import { WriteFailure } from '../../shared/write-failure';
import { narrowScreen, phoneScreen, screenMatches } from '../../shared/media-queries';
import { openCopyDialog } from '../projects/copy-project-dialog';
import { ProjectApi } from '../projects/project-api';
import { stateLabels } from '../projects/project-states';
import { openItemWords, reasonTitles } from '../results/verdict-reasons';
import { ReviewStateBar } from '../review/review-state-bar';
import { ProjectStore } from './project-store';

interface WorkspaceArea {
  path: string;
  label: string;
  icon: string;
}

/** The project's areas, in the order the work goes: the design, its results and review, the design under other editions, the submittal package, then its history. Field tests and Team follow. */
export const workspaceAreas: readonly WorkspaceArea[] = [
  { path: 'setup', label: 'Set-up', icon: 'tune' },
  { path: 'spaces', label: 'Spaces', icon: 'floor_lamp' },
  { path: 'luminaires', label: 'Luminaires', icon: 'light' },
  { path: 'allowances', label: 'Allowances', icon: 'storefront' },
  { path: 'controls', label: 'Controls', icon: 'toggle_on' },
  { path: 'daylight', label: 'Daylight', icon: 'wb_sunny' },
  { path: 'exterior', label: 'Exterior', icon: 'nightlight' },
  { path: 'results', label: 'Results', icon: 'fact_check' },
  { path: 'review', label: 'Review', icon: 'rate_review' },
  { path: 'compare', label: 'Compare', icon: 'compare_arrows' },
  { path: 'package', label: 'Package', icon: 'inventory_2' },
  { path: 'field-tests', label: 'Field tests', icon: 'checklist' },
  { path: 'history', label: 'History', icon: 'history' },
];

@Component({
  selector: 'al-workspace-page',
  imports: [
    NgTemplateOutlet,
    MatButtonModule,
    MatSidenavModule,
    MatListModule,
    MatIconModule,
    MatChipsModule,
    MatProgressBarModule,
    MatToolbarModule,
    MatTooltipModule,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    ReviewStateBar,
  ],
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
  private readonly dialogs = inject(MatDialog);
  private readonly router = inject(Router);
  protected readonly areas = workspaceAreas;
  protected readonly narrow = screenMatches(narrowScreen);
  /**
   * The opened navigation starts below the shell's bar (56 px high on a phone, 64 px elsewhere:
   * Material's toolbar heights) and the area bar (56 px), so the menu button stays in reach to close it.
   */
  private readonly phone = screenMatches(phoneScreen);
  protected readonly topGap = computed(() => (this.phone() ? 56 : 64) + 56);
  private readonly url = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map(() => this.router.url),
      startWith(this.router.url),
    ),
    { initialValue: this.router.url },
  );
  /** The area on screen, named in the bar that replaces the navigation on a narrow screen. */
  protected readonly currentArea = computed(() => {
    const path = this.url().split(/[?#]/)[0]!.split('/').at(-1);
    return this.areas.find((area) => area.path === path) ?? null;
  });
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

  /** The project of the address: read when it changes (a newer one cancels the reading in flight), then followed. */
  protected readonly loading = rxResource({
    params: () => this.projectId(),
    stream: ({ params: id }) => this.store.load(id).pipe(tap({ complete: () => this.store.follow(id) })),
  });

  protected copy(): void {
    const project = this.store.project();
    if (!project) return;
    openCopyDialog(this.dialogs, project).subscribe((copy) => {
      if (copy) void this.router.navigate(['/projects', copy.id]);
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
