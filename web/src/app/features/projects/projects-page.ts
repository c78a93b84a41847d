import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatChipsModule } from '@angular/material/chips';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginator, MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatTableDataSource, MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { Router, RouterLink } from '@angular/router';
import { catchError, from, map, mergeMap, of, startWith, switchMap } from 'rxjs';
import type { ProjectSummary } from '../../core/api/api-types';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { askToConfirm, type ConfirmDialogData } from '../../shared/confirm-dialog';
import { formatPercent } from '../../shared/format';
import { openCopyDialog } from './copy-project-dialog';
import { ProjectApi } from './project-api';
import { stateLabels } from './project-states';
import { fieldTestStatus, type FieldTestStatus } from '../field-tests/field-test-status';
import { verdictOf, type ProjectVerdict } from './project-verdict';
import { CardRows } from '../../shared/card-rows';
import { editionLabel } from '../../shared/edition-labels';

type ListState = { status: 'loading' } | { status: 'ready'; projects: ProjectSummary[] } | { status: 'failed'; message: string };

/** At most this many result requests in flight, so a long list stays cheap for the service. */
const verdictConcurrency = 3;

@Component({
  selector: 'al-projects-page',
  imports: [
    CardRows,
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatChipsModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSlideToggleModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
  ],
  templateUrl: './projects-page.html',
  styleUrl: './projects-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProjectsPage {
  private readonly api = inject(ProjectApi);
  private readonly auth = inject(AuthStore);
  private readonly router = inject(Router);
  private readonly dialogs = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly columns = ['name', 'state', 'edition', 'role', 'updatedAt', 'margin', 'verdict', 'actions'];
  protected readonly dataSource = new MatTableDataSource<ProjectSummary>([]);
  protected readonly verdicts = signal<ReadonlyMap<string, ProjectVerdict>>(new Map());
  protected readonly filter = signal('');

  private readonly sort = viewChild(MatSort);
  private readonly paginator = viewChild(MatPaginator);

  /** The archived projects instead of the current ones. */
  protected readonly showArchived = signal(false);
  private readonly reloads = signal(0);
  protected readonly busy = signal<string | null>(null);

  protected readonly list = toSignal(
    toObservable(computed(() => ({ archived: this.showArchived(), reload: this.reloads() }))).pipe(
      switchMap(({ archived }) =>
        this.api.list(archived).pipe(
          map((projects): ListState => ({ status: 'ready', projects })),
          catchError((error: unknown) =>
            of<ListState>({ status: 'failed', message: error instanceof ApiError ? error.message : 'The projects could not be loaded.' }),
          ),
          startWith<ListState>({ status: 'loading' }),
        ),
      ),
    ),
    { initialValue: { status: 'loading' } as ListState },
  );

  protected readonly projectCount = computed(() => {
    const state = this.list();
    return state.status === 'ready' ? state.projects.length : 0;
  });

  constructor() {
    this.dataSource.sortingDataAccessor = (project, column) => {
      switch (column) {
        case 'state':
          return stateLabels[project.state];
        case 'edition':
          return this.editionLabel(project);
        case 'updatedAt':
          return project.updatedAt;
        case 'margin': {
          const verdict = this.verdicts().get(project.id);
          return verdict && 'marginPct' in verdict && verdict.marginPct !== null ? Number(verdict.marginPct) : Number.NEGATIVE_INFINITY;
        }
        default:
          return (project[column as keyof ProjectSummary] ?? '').toString().toLocaleLowerCase();
      }
    };
    this.dataSource.filterPredicate = (project, filter) =>
      [
        project.name,
        stateLabels[project.state],
        this.editionLabel(project),
        project.role ?? '',
        fieldTestStatus(project.fieldTests)?.words ?? '',
      ]
        .join(' ')
        .toLocaleLowerCase()
        .includes(filter);

    effect(() => {
      const state = this.list();
      if (state.status !== 'ready') return;
      this.dataSource.data = state.projects;
      this.loadVerdicts(state.projects);
    });
    effect(() => {
      const sort = this.sort();
      const paginator = this.paginator();
      if (sort) this.dataSource.sort = sort;
      if (paginator) this.dataSource.paginator = paginator;
    });
  }

  /** Engineers on a project, and administrators, archive it and bring it back. */
  protected mayArchive(project: ProjectSummary): boolean {
    return project.role === 'engineer' || (this.auth.user()?.isAdmin ?? false);
  }

  protected archive(project: ProjectSummary): void {
    const data: ConfirmDialogData = {
      title: `Archive “${project.name}”?`,
      message:
        'The project keeps its whole design and history and can still be read, but no one can change it. It leaves this list; turn on “Show archived projects” to find it and unarchive it.',
      confirm: 'Archive',
    };
    askToConfirm(this.dialogs, data).subscribe((confirmed) => {
      if (confirmed) this.setArchived(project, true);
    });
  }

  protected copy(project: ProjectSummary): void {
    openCopyDialog(this.dialogs, project).subscribe((copy) => {
      if (copy) void this.router.navigate(['/projects', copy.id]);
    });
  }

  protected unarchive(project: ProjectSummary): void {
    this.setArchived(project, false);
  }

  private setArchived(project: ProjectSummary, archived: boolean): void {
    this.busy.set(project.id);
    (archived ? this.api.archive(project.id) : this.api.unarchive(project.id)).subscribe({
      next: () => {
        this.busy.set(null);
        this.snackBar.open(archived ? `“${project.name}” archived` : `“${project.name}” is back among the current projects`, undefined, {
          duration: 4000,
        });
        this.reloads.update((count) => count + 1);
      },
      error: (error: unknown) => {
        this.busy.set(null);
        this.snackBar.open(error instanceof ApiError ? error.message : 'The project could not be changed.', 'Dismiss', {
          duration: 8000,
          politeness: 'assertive',
        });
      },
    });
  }

  protected toggleArchived(show: boolean): void {
    this.showArchived.set(show);
    this.applyFilter('');
  }

  protected applyFilter(value: string): void {
    this.filter.set(value);
    this.dataSource.filter = value.trim().toLocaleLowerCase();
    this.dataSource.paginator?.firstPage();
  }

  protected open(project: ProjectSummary): void {
    void this.router.navigate(['/projects', project.id]);
  }

  protected fieldTests(project: ProjectSummary): FieldTestStatus | null {
    return fieldTestStatus(project.fieldTests);
  }

  protected stateLabel(project: ProjectSummary): string {
    return stateLabels[project.state];
  }

  protected editionLabel(project: ProjectSummary): string {
    return project.edition ? editionLabel(project.edition) : '—';
  }

  /** The margin without its unit: the column header carries it. */
  protected margin(verdict: ProjectVerdict): string {
    return 'marginPct' in verdict ? formatPercent(verdict.marginPct).replace(' %', '') : '—';
  }

  protected verdict(id: string): ProjectVerdict {
    return this.verdicts().get(id) ?? { status: 'pending' };
  }

  /** Kept verdicts come with the list; only projects changed since their last evaluation are evaluated now. */
  private loadVerdicts(projects: ProjectSummary[]): void {
    const kept = new Map<string, ProjectVerdict>();
    for (const project of projects) {
      const summary = project.resultSummary;
      if (summary)
        kept.set(
          project.id,
          summary.verdict === 'incomplete'
            ? { status: 'incomplete' }
            : { status: summary.complies ? 'complies' : 'does-not-comply', marginPct: summary.marginPct },
        );
    }
    this.verdicts.set(kept);
    from(projects.filter((project) => project.edition && !project.resultSummary))
      .pipe(
        mergeMap(
          (project) =>
            this.api.results(project.id).pipe(
              map((result) => [project.id, verdictOf(result)] as const),
              catchError(() => of([project.id, { status: 'incomplete' } as ProjectVerdict] as const)),
            ),
          verdictConcurrency,
        ),
      )
      .subscribe(([id, verdict]) => this.verdicts.update((verdicts) => new Map(verdicts).set(id, verdict)));
  }
}
