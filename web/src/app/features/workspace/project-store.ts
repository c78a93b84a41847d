import { computed, DestroyRef, inject, Injectable, signal, type WritableSignal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { catchError, debounceTime, forkJoin, map, of, Subject, switchMap, tap, type Observable } from 'rxjs';
import type {
  BuildingAreaTypeView,
  ControlStrategyView,
  EvaluationResult,
  ExteriorApplicationRecord,
  ExteriorApplicationView,
  LightingZoneView,
  LuminaireTypeRecord,
  ProjectDetail,
  SpaceRecord,
  SpaceTypeView,
} from '../../core/api/api-types';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { problemLine, type ProblemContext, type ProblemLine } from '../../shared/problem-words';
import { editableStates, projectStateLabels, type ProjectState, type ReviewItem } from '../../../../../contract/review';
import { ReviewApi } from '../review/review-api';
import { WorkspaceApi } from './workspace-api';

/**
 * What the results panel may show. While `updating`, the last result is kept only so the page does
 * not jump; its verdict must not be shown as current.
 */
export type ResultsState =
  | { status: 'idle' }
  | { status: 'updating'; previous: EvaluationResult | null }
  | { status: 'ready'; result: EvaluationResult }
  | { status: 'incomplete'; problems: readonly ProblemLine[]; message: string }
  | { status: 'failed'; message: string };

/** The project's check items as last read; `failed` keeps the words of why they could not be read. */
export type ReviewItemsState =
  { status: 'loading' } | { status: 'ready'; items: readonly ReviewItem[] } | { status: 'failed'; message: string };

/** Why the design cannot be changed in a state that locks it, in words for the banner. */
export const lockedWords: Partial<Record<ProjectState, string>> = {
  'in-review': 'The design is in review: it cannot be changed until the reviewer returns it.',
  accepted: 'The design is accepted: it cannot be changed unless the engineer reopens it as a draft, which starts a new revision.',
  issued: 'The design is issued: it cannot be changed unless the engineer reopens it as a draft, which starts a new revision.',
};

/**
 * Why a review reading failed, in words. A 404 names the route it missed (a service without the
 * review's routes, or a project gone), which is not for people to read.
 */
export function reviewReadFailure(error: unknown, fallback: string): string {
  if (!(error instanceof ApiError)) return fallback;
  if (error.status === 404) return `${fallback} The service did not find what was asked for.`;
  return error.message;
}

export interface EditionTables {
  spaceTypes: SpaceTypeView[];
  buildingAreaTypes: BuildingAreaTypeView[];
  controlStrategies: ControlStrategyView[];
  exteriorApplications: ExteriorApplicationView[];
  lightingZones: LightingZoneView[];
}

/** The records read again, with each one whose version did not move replaced by the copy already held. */
export function sameWhereUnchanged<T extends { id: string; version: number }>(held: readonly T[], read: readonly T[]): T[] {
  const byId = new Map(held.map((record) => [record.id, record]));
  const next = read.map((record) => {
    const kept = byId.get(record.id);
    return kept && kept.version === record.version ? kept : record;
  });
  return next.length === held.length && next.every((record, index) => record === held[index]) ? (held as T[]) : next;
}

/**
 * Puts records written into a list: each replaces the held record of its id unless the held one is
 * newer (a change read back from the stream may arrive before the answer to the write), and the
 * rest are added.
 */
function upsertInto<T extends { id: string; version: number }>(
  list: WritableSignal<T[]>,
  records: readonly T[],
  order?: (a: T, b: T) => number,
): void {
  list.update((held) => {
    const incoming = new Map(records.map((record) => [record.id, record]));
    const next = held.map((record) => {
      const written = incoming.get(record.id);
      if (!written) return record;
      incoming.delete(record.id);
      return written.version >= record.version ? written : record;
    });
    next.push(...incoming.values());
    return order ? next.sort(order) : next;
  });
}

/** One project's data for every page of the workspace; provided by the workspace page. */
@Injectable()
export class ProjectStore {
  private readonly api = inject(WorkspaceApi);
  private readonly reviewApi = inject(ReviewApi);
  private readonly reviewRead = new Subject<string>();
  private readonly auth = inject(AuthStore);
  private readonly recompute = new Subject<string>();
  /** A change someone made (another tab, another person, the API): the project is read again. */
  private readonly changed = new Subject<string>();
  private stream: EventSource | null = null;

  // Pages read these; only the store's methods change them.
  private readonly projectState = signal<ProjectDetail | null>(null);
  private readonly spaceList = signal<SpaceRecord[]>([]);
  private readonly typeList = signal<LuminaireTypeRecord[]>([]);
  private readonly exteriorList = signal<ExteriorApplicationRecord[]>([]);
  private readonly tableState = signal<EditionTables | null>(null);
  private readonly resultState = signal<ResultsState>({ status: 'idle' });
  private readonly loadErrorState = signal<string | null>(null);
  private readonly reviewState = signal<ReviewItemsState>({ status: 'loading' });
  readonly project = this.projectState.asReadonly();
  readonly spaces = this.spaceList.asReadonly();
  readonly luminaireTypes = this.typeList.asReadonly();
  readonly exterior = this.exteriorList.asReadonly();
  readonly tables = this.tableState.asReadonly();
  readonly results = this.resultState.asReadonly();
  readonly loadError = this.loadErrorState.asReadonly();
  readonly reviewItems = this.reviewState.asReadonly();

  readonly projectId = computed(() => this.project()?.id ?? null);
  readonly units = computed(() => this.project()?.units ?? 'ip');
  /** Engineers (and administrators) archive a project and bring it back. */
  readonly canArchive = computed(() => this.project()?.role === 'engineer' || (this.auth.user()?.isAdmin ?? false));
  readonly archived = computed(() => !!this.project()?.archivedAt);
  /** The same people change the design, unless the project is archived; everyone else reads. */
  readonly mayEdit = computed(() => this.canArchive() && !this.archived());
  /** The review state lets the design change: a draft or a returned design; in review, accepted and issued lock it. */
  readonly editable = computed(() => {
    const state = this.project()?.state;
    return state !== undefined && editableStates.includes(state);
  });
  /** Why the design is locked, in words; null while it is editable. */
  readonly lockedReason = computed(() => {
    const state = this.project()?.state;
    return state && !this.editable() ? (lockedWords[state] ?? `The design is ${projectStateLabels[state].toLowerCase()}.`) : null;
  });
  /** What every editing control follows: the person may change the design, and its state lets it change. The server refuses the rest anyway. */
  readonly canEdit = computed(() => this.mayEdit() && this.editable());
  /** Per space, how many of its check items need revision in the present round (only spaces with any). */
  readonly needsRevisionBySpace = computed(() => {
    const state = this.reviewItems();
    const counts = new Map<string, number>();
    if (state.status !== 'ready') return counts;
    for (const item of state.items) {
      if (item.spaceId && item.verdict === 'needs-revision') counts.set(item.spaceId, (counts.get(item.spaceId) ?? 0) + 1);
    }
    return counts;
  });
  readonly spaceTypeByKey = computed(() => new Map((this.tables()?.spaceTypes ?? []).map((type) => [type.key, type])));
  readonly resultBySpace = computed(() => {
    const state = this.results();
    const result = state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null;
    return new Map((result?.interior.spaces ?? []).map((space) => [space.id, space]));
  });

  constructor() {
    // Edits come in bursts: wait for a pause, and let a newer request cancel the one in flight.
    this.recompute
      .pipe(
        tap(() =>
          this.resultState.update((state) => ({
            status: 'updating',
            previous: state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null,
          })),
        ),
        debounceTime(350),
        switchMap((projectId) =>
          this.api.results(projectId).pipe(
            map((result): ResultsState => ({ status: 'ready', result })),
            catchError((error: unknown) =>
              error instanceof ApiError && error.status === 400
                ? this.problemContext(projectId).pipe(
                    map((context): ResultsState => ({
                      status: 'incomplete',
                      problems: error.details.map((detail) => problemLine(detail, context)),
                      message: error.message,
                    })),
                  )
                : of<ResultsState>({
                    status: 'failed',
                    message: error instanceof ApiError ? error.message : 'The results could not be computed.',
                  }),
            ),
          ),
        ),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe((state) => this.resultState.set(state));
    // A newer change cancels the reading in flight; the last one read wins.
    this.changed
      .pipe(
        switchMap((projectId) => this.reread(projectId)),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe();
    // The last reading asked for wins; a project that has none yet (never submitted) answers an empty list.
    this.reviewRead
      .pipe(
        switchMap((projectId) =>
          this.reviewApi.items(projectId).pipe(
            map((items): ReviewItemsState => ({ status: 'ready', items })),
            catchError((error: unknown) =>
              of<ReviewItemsState>({ status: 'failed', message: reviewReadFailure(error, 'The check items could not be read.') }),
            ),
            map((state) => ({ projectId, state })),
          ),
        ),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe(({ projectId, state }) => {
        if (this.projectId() === projectId) this.reviewState.set(state);
      });
    inject(DestroyRef).onDestroy(() => this.unfollow());
  }

  /**
   * Follows the project's change stream: every write anyone commits is read back into the store
   * and the results recomputed. After a lost connection the browser reconnects by itself (the
   * stream's retry) and the project is read again, since changes may have been missed meanwhile.
   * Browsers without server-sent events simply do not follow.
   */
  follow(projectId: string): void {
    this.unfollow();
    if (typeof EventSource === 'undefined') return;
    const stream = new EventSource(`/api/projects/${encodeURIComponent(projectId)}/events`);
    let connections = 0;
    stream.addEventListener('ready', () => {
      connections += 1;
      if (connections > 1) this.changed.next(projectId);
    });
    stream.addEventListener('change', () => this.changed.next(projectId));
    this.stream = stream;
  }

  private unfollow(): void {
    this.stream?.close();
    this.stream = null;
  }

  /** Reads the project's set-up and design again after someone else's change. */
  private reread(projectId: string): Observable<void> {
    return forkJoin({
      project: this.api.project(projectId),
      spaces: this.api.spaces(projectId),
      luminaireTypes: this.api.luminaireTypes(projectId),
      exterior: this.api.exteriorApplications(projectId),
    }).pipe(
      map((loaded) => {
        if (this.projectId() !== projectId) return;
        const editionChanged = loaded.project.edition !== this.project()?.edition;
        // What did not change keeps its identity, so a page editing it is not started again.
        if (loaded.project.version !== this.project()?.version) this.projectState.set(loaded.project);
        this.spaceList.set(sameWhereUnchanged(this.spaces(), loaded.spaces));
        this.typeList.set(sameWhereUnchanged(this.luminaireTypes(), loaded.luminaireTypes));
        this.exteriorList.set(sameWhereUnchanged(this.exterior(), loaded.exterior));
        if (editionChanged && loaded.project.edition) this.loadTables(loaded.project.edition).subscribe();
        this.refreshResults();
        this.reloadReviewItems();
      }),
      catchError((error: unknown) => {
        // Taken off the team, or the project gone: say so; anything else waits for the next change.
        if (error instanceof ApiError && (error.status === 403 || error.status === 404)) {
          this.unfollow();
          this.loadErrorState.set(error.message);
        }
        return of(undefined);
      }),
    );
  }

  /**
   * What the paths of the results' problems count through: the document the evaluation read (its
   * order is the service's), or the spaces as loaded here when it cannot be read.
   */
  private problemContext(projectId: string): Observable<ProblemContext> {
    const labels = new Map((this.tables()?.exteriorApplications ?? []).map((application) => [application.key, application.label]));
    const fallback: ProblemContext = { spaces: this.spaces(), luminaireTags: this.luminaireTypes().map((type) => type.tag) };
    return this.api.document(projectId).pipe(
      map((document): ProblemContext => ({
        spaces: document.spaces,
        luminaireTags: document.luminaireTypes.map((type) => type.tag),
        exteriorApplications: (document.exterior?.applications ?? []).map((application) => ({
          label: labels.get(application.key) ?? 'An exterior application',
        })),
      })),
      catchError(() => of(fallback)),
    );
  }

  load(projectId: string): Observable<void> {
    this.loadErrorState.set(null);
    return forkJoin({
      project: this.api.project(projectId),
      spaces: this.api.spaces(projectId),
      luminaireTypes: this.api.luminaireTypes(projectId),
      exterior: this.api.exteriorApplications(projectId),
    }).pipe(
      switchMap((loaded) => {
        this.projectState.set(loaded.project);
        this.spaceList.set(loaded.spaces);
        this.typeList.set(loaded.luminaireTypes);
        this.exteriorList.set(loaded.exterior);
        this.refreshResults();
        this.reviewState.set({ status: 'loading' });
        this.reloadReviewItems();
        return loaded.project.edition ? this.loadTables(loaded.project.edition) : of(undefined);
      }),
      catchError((error: unknown) => {
        this.loadErrorState.set(error instanceof ApiError ? error.message : 'The project could not be loaded.');
        return of(undefined);
      }),
    );
  }

  loadTables(edition: string): Observable<void> {
    return forkJoin({
      spaceTypes: this.api.spaceTypes(edition),
      buildingAreaTypes: this.api.buildingAreaTypes(edition),
      controlStrategies: this.api.controlStrategies(edition),
      exteriorApplications: this.api.exteriorApplicationTypes(edition),
      lightingZones: this.api.lightingZones(edition),
    }).pipe(
      tap((tables) => this.tableState.set(tables)),
      map(() => undefined),
    );
  }

  /** Ask for fresh results; call after every successful write. */
  refreshResults(): void {
    const id = this.projectId();
    if (id) this.recompute.next(id);
  }

  /** Reads the project again, as after someone else's change: after a refusal that says it moved meanwhile. */
  readAgain(): void {
    const id = this.projectId();
    if (id) this.changed.next(id);
  }

  /** Reads the check items again: after a verdict, a reply, a bulk confirmation or a move of the state. */
  reloadReviewItems(): void {
    const id = this.projectId();
    if (id) this.reviewRead.next(id);
  }

  /**
   * Moves the project's review state from the version held; the project that comes back replaces
   * it, and the check items are read again (a submission makes a new round). A refusal is the
   * caller's to show.
   */
  move(to: ProjectState, comment?: string): Observable<ProjectDetail> {
    const project = this.project();
    if (!project) return of();
    return this.reviewApi.transition(project.id, { to, version: project.version, ...(comment ? { comment } : {}) }).pipe(
      tap((moved) => {
        this.setProject(moved);
        this.reloadReviewItems();
      }),
    );
  }

  setProject(project: ProjectDetail): void {
    const editionChanged = project.edition !== this.project()?.edition;
    this.projectState.set(project);
    if (editionChanged && project.edition) this.loadTables(project.edition).subscribe();
    this.refreshResults();
  }

  /** Where the field tests stand, as the test plan just read says: the state bar follows the tests recorded. */
  setFieldTests(summary: ProjectDetail['fieldTests']): void {
    this.projectState.update((project) => (project ? { ...project, fieldTests: summary } : project));
  }

  /** The project's team changed: the rest of the set-up is as it was. */
  setMembers(members: ProjectDetail['members']): void {
    this.projectState.update((project) => (project ? { ...project, members } : project));
  }

  upsertSpace(space: SpaceRecord): void {
    this.upsertSpaces([space]);
  }

  /** Spaces written (one or many at once, new or changed): one recompute for all of them. */
  upsertSpaces(saved: readonly SpaceRecord[]): void {
    upsertInto(this.spaceList, saved);
    this.refreshResults();
  }

  /** The spaces as read from the service, in place of those held (after a stale write, a reload). */
  replaceSpaces(spaces: SpaceRecord[]): void {
    this.spaceList.set(sameWhereUnchanged(this.spaceList(), spaces));
    this.refreshResults();
  }

  /** Reads the spaces again, after a stale write: what others saved replaces what is on screen. */
  reloadSpaces(): Observable<SpaceRecord[]> {
    const id = this.projectId();
    if (!id) return of([]);
    return this.api.spaces(id).pipe(tap((spaces) => this.replaceSpaces(spaces)));
  }

  removeSpace(spaceId: string): void {
    this.spaceList.update((spaces) => spaces.filter((space) => space.id !== spaceId));
    this.refreshResults();
  }

  upsertLuminaireType(type: LuminaireTypeRecord): void {
    upsertInto(this.typeList, [type], (a, b) => a.tag.localeCompare(b.tag, undefined, { numeric: true }));
    this.refreshResults();
  }

  replaceLuminaireTypes(types: LuminaireTypeRecord[]): void {
    this.typeList.set(sameWhereUnchanged(this.typeList(), types));
    this.refreshResults();
  }

  removeLuminaireType(typeId: string): void {
    this.typeList.update((types) => types.filter((type) => type.id !== typeId));
    this.refreshResults();
  }

  upsertExterior(application: ExteriorApplicationRecord): void {
    upsertInto(this.exteriorList, [application]);
    this.refreshResults();
  }

  replaceExterior(applications: ExteriorApplicationRecord[]): void {
    this.exteriorList.set(sameWhereUnchanged(this.exteriorList(), applications));
    this.refreshResults();
  }

  removeExterior(applicationId: string): void {
    this.exteriorList.update((applications) => applications.filter((application) => application.id !== applicationId));
    this.refreshResults();
  }

  /**
   * Puts data in place without asking the service: for component tests, which give a page the
   * store's state directly.
   */
  seed(state: {
    project?: ProjectDetail;
    spaces?: SpaceRecord[];
    luminaireTypes?: LuminaireTypeRecord[];
    exterior?: ExteriorApplicationRecord[];
    tables?: EditionTables;
    results?: ResultsState;
    reviewItems?: readonly ReviewItem[];
  }): void {
    if (state.project) this.projectState.set(state.project);
    if (state.spaces) this.spaceList.set(state.spaces);
    if (state.luminaireTypes) this.typeList.set(state.luminaireTypes);
    if (state.exterior) this.exteriorList.set(state.exterior);
    if (state.tables) this.tableState.set(state.tables);
    if (state.results) this.resultState.set(state.results);
    if (state.reviewItems) this.reviewState.set({ status: 'ready', items: state.reviewItems });
  }
}
