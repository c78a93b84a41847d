import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { switchMap, takeWhile, timer } from 'rxjs';
import {
  packageFormatLabels,
  packageStepLabels,
  type MadePackage,
  type PackageComparison,
  type PackageJob,
  type PackageRevision,
} from '../../../../../contract/package';
import { AuthStore } from '../../core/auth/auth-store';
import { failureWords } from '../../shared/write-failure';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { PackageApi } from './package-api';
import { changeValue, changeWords, controlStatusWords, fingerprintGroups, makeWords, revisionName, verdictChange } from './package-words';

/** How often a package job is read while it runs. */
const pollMs = 1000;

type ListState = { status: 'loading' } | { status: 'ready' } | { status: 'failed'; message: string };
type CompareState =
  { status: 'idle' } | { status: 'loading' } | { status: 'ready'; comparison: PackageComparison } | { status: 'failed'; message: string };

/** The project's submittal packages: make one (a draft, or the final one of an accepted design), download each revision, compare two. */
@Component({
  selector: 'al-package-page',
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './package-page.html',
  styleUrl: './package-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PackagePage {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(PackageApi);
  private readonly workspaceApi = inject(WorkspaceApi);
  private readonly auth = inject(AuthStore);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly formatLabels = packageFormatLabels;
  protected readonly revisionName = revisionName;
  protected readonly fingerprintGroups = fingerprintGroups;
  protected readonly changeWords = changeWords;
  protected readonly changeValue = changeValue;
  protected readonly controlStatusWords = controlStatusWords;
  protected readonly verdictChange = verdictChange;

  protected readonly state = signal<ListState>({ status: 'loading' });
  protected readonly revisions = signal<PackageRevision[]>([]);
  /** Newest first, as people look for the latest. */
  protected readonly newestFirst = computed(() => [...this.revisions()].reverse());
  protected readonly making = signal(false);
  /** The background job making a large project's package, while it runs. */
  protected readonly job = signal<PackageJob | null>(null);
  /** Where the job is, in words: the step and the share done. */
  protected readonly jobWords = computed(() => {
    const job = this.job();
    if (!job) return null;
    if (job.state === 'queued' || job.step === null) return `Waiting for the server to start — ${job.progress} %`;
    return `${packageStepLabels[job.step]} — ${job.progress} %`;
  });
  /** What the last package job's failure said, shown beside the button. */
  protected readonly jobFailure = signal<string | null>(null);
  protected readonly from = signal<string | null>(null);
  protected readonly to = signal<string | null>(null);
  protected readonly comparison = signal<CompareState>({ status: 'idle' });

  /** Engineers (and administrators) make packages, unless the project is archived. */
  protected readonly canMake = computed(() => {
    const project = this.store.project();
    return !!project && !project.archivedAt && (project.role === 'engineer' || (this.auth.user()?.isAdmin ?? false));
  });
  protected readonly make = computed(() => makeWords(this.store.project()?.state ?? 'draft'));
  protected readonly isContractor = computed(() => this.store.project()?.role === 'contractor');

  constructor() {
    effect(() => {
      const projectId = this.store.projectId();
      if (projectId) untracked(() => this.load(projectId));
    });
  }

  private load(projectId: string): void {
    this.api
      .revisions(projectId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ revisions }) => {
          this.revisions.set(revisions);
          this.state.set({ status: 'ready' });
          // The two latest revisions are compared unless the person chose others that still exist.
          const ids = new Set(revisions.map((revision) => revision.id));
          if (!this.from() || !ids.has(this.from()!)) this.from.set(revisions.at(-2)?.id ?? null);
          if (!this.to() || !ids.has(this.to()!)) this.to.set(revisions.at(-1)?.id ?? null);
        },
        error: (error: unknown) => this.state.set({ status: 'failed', message: failureWords(error) }),
      });
  }

  protected makePackage(): void {
    const projectId = this.store.projectId();
    if (!projectId || this.making()) return;
    this.making.set(true);
    this.jobFailure.set(null);
    this.api
      .make(projectId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (answer) => {
          if ('job' in answer) this.follow(projectId, answer.job);
          else this.made(projectId, answer);
        },
        error: (error: unknown) => this.failed(failureWords(error)),
      });
  }

  /** Reads a large project's job every second until it is done or failed. */
  private follow(projectId: string, job: PackageJob): void {
    this.job.set(job);
    timer(pollMs, pollMs)
      .pipe(
        switchMap(() => this.api.job(projectId, job.id)),
        takeWhile(({ job: current }) => current.state === 'queued' || current.state === 'running', true),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: ({ job: current }) => {
          this.job.set(current);
          if (current.state === 'done' && current.package) {
            this.job.set(null);
            this.made(projectId, current.package);
          } else if (current.state === 'failed') {
            this.job.set(null);
            this.failed(current.error ?? 'The package could not be made.');
          }
        },
        error: (error: unknown) => {
          this.job.set(null);
          this.failed(failureWords(error));
        },
      });
  }

  private made(projectId: string, made: MadePackage): void {
    this.making.set(false);
    this.snackBar.open(
      made.draft ? `Draft package made: revision ${made.revision}.` : `Final package made: revision ${made.revision}.`,
      'Dismiss',
      { duration: 6000 },
    );
    this.from.set(this.to());
    this.to.set(made.id);
    this.load(projectId);
    // A final package of an accepted design issues it: the workspace shows the new state.
    if (!made.draft) this.workspaceApi.project(projectId).subscribe((project) => this.store.setProject(project));
  }

  private failed(message: string): void {
    this.making.set(false);
    this.jobFailure.set(message);
    this.snackBar.open(message, 'Dismiss', { duration: 10000, politeness: 'assertive' });
  }

  protected compare(): void {
    const projectId = this.store.projectId();
    const from = this.from();
    const to = this.to();
    if (!projectId || !from || !to) return;
    this.comparison.set({ status: 'loading' });
    this.api
      .compare(projectId, from, to)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (comparison) => this.comparison.set({ status: 'ready', comparison }),
        error: (error: unknown) => this.comparison.set({ status: 'failed', message: failureWords(error) }),
      });
  }

  protected nothingChanged(comparison: PackageComparison): boolean {
    const { spaces } = comparison;
    return (
      !comparison.verdict &&
      comparison.totals.length === 0 &&
      spaces.added.length + spaces.removed.length + spaces.changed.length === 0 &&
      comparison.controls.length === 0 &&
      comparison.exterior.length === 0
    );
  }

  protected sizeWords(bytes: number): string {
    return bytes < 1024 * 1024 ? `${Math.max(1, Math.round(bytes / 1024))} KB` : `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  }
}
