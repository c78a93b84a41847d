import { computed, DestroyRef, inject, Injectable, signal } from '@angular/core';
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

export interface EditionTables {
  spaceTypes: SpaceTypeView[];
  buildingAreaTypes: BuildingAreaTypeView[];
  controlStrategies: ControlStrategyView[];
  exteriorApplications: ExteriorApplicationView[];
  lightingZones: LightingZoneView[];
}

/** One project's data for every page of the workspace; provided by the workspace page. */
@Injectable()
export class ProjectStore {
  private readonly api = inject(WorkspaceApi);
  private readonly auth = inject(AuthStore);
  private readonly recompute = new Subject<string>();

  readonly project = signal<ProjectDetail | null>(null);
  readonly spaces = signal<SpaceRecord[]>([]);
  readonly luminaireTypes = signal<LuminaireTypeRecord[]>([]);
  readonly exterior = signal<ExteriorApplicationRecord[]>([]);
  readonly tables = signal<EditionTables | null>(null);
  readonly results = signal<ResultsState>({ status: 'idle' });
  readonly loadError = signal<string | null>(null);

  readonly projectId = computed(() => this.project()?.id ?? null);
  readonly units = computed(() => this.project()?.units ?? 'ip');
  /** Engineers (and administrators) archive a project and bring it back. */
  readonly canArchive = computed(() => this.project()?.role === 'engineer' || (this.auth.user()?.isAdmin ?? false));
  readonly archived = computed(() => !!this.project()?.archivedAt);
  /** The same people edit, unless the project is archived; everyone else reads. The server refuses the rest anyway. */
  readonly canEdit = computed(() => this.canArchive() && !this.archived());
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
        tap(() => this.results.update((state) => ({ status: 'updating', previous: state.status === 'ready' ? state.result : state.status === 'updating' ? state.previous : null }))),
        debounceTime(350),
        switchMap((projectId) =>
          this.api.results(projectId).pipe(
            map((result): ResultsState => ({ status: 'ready', result })),
            catchError((error: unknown) =>
              error instanceof ApiError && error.status === 400
                ? this.problemContext(projectId).pipe(map((context): ResultsState => ({ status: 'incomplete', problems: error.details.map((detail) => problemLine(detail, context)), message: error.message })))
                : of<ResultsState>({ status: 'failed', message: error instanceof ApiError ? error.message : 'The results could not be computed.' }),
            ),
          ),
        ),
        takeUntilDestroyed(inject(DestroyRef)),
      )
      .subscribe((state) => this.results.set(state));
  }

  /**
   * What the paths of the results' problems count through: the document the evaluation read (its
   * order is the service's), or the spaces as loaded here when it cannot be read.
   */
  private problemContext(projectId: string): Observable<ProblemContext> {
    const labels = new Map((this.tables()?.exteriorApplications ?? []).map((application) => [application.key, application.label]));
    const fallback: ProblemContext = { spaces: this.spaces(), luminaireTags: this.luminaireTypes().map((type) => type.tag) };
    return this.api.document(projectId).pipe(
      map(
        (document): ProblemContext => ({
          spaces: document.spaces,
          luminaireTags: document.luminaireTypes.map((type) => type.tag),
          exteriorApplications: (document.exterior?.applications ?? []).map((application) => ({ label: labels.get(application.key) ?? 'An exterior application' })),
        }),
      ),
      catchError(() => of(fallback)),
    );
  }

  load(projectId: string): Observable<void> {
    this.loadError.set(null);
    return forkJoin({
      project: this.api.project(projectId),
      spaces: this.api.spaces(projectId),
      luminaireTypes: this.api.luminaireTypes(projectId),
      exterior: this.api.exteriorApplications(projectId),
    }).pipe(
      switchMap((loaded) => {
        this.project.set(loaded.project);
        this.spaces.set(loaded.spaces);
        this.luminaireTypes.set(loaded.luminaireTypes);
        this.exterior.set(loaded.exterior);
        this.refreshResults();
        return loaded.project.edition ? this.loadTables(loaded.project.edition) : of(undefined);
      }),
      catchError((error: unknown) => {
        this.loadError.set(error instanceof ApiError ? error.message : 'The project could not be loaded.');
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
      tap((tables) => this.tables.set(tables)),
      map(() => undefined),
    );
  }

  /** Ask for fresh results; call after every successful write. */
  refreshResults(): void {
    const id = this.projectId();
    if (id) this.recompute.next(id);
  }

  setProject(project: ProjectDetail): void {
    const editionChanged = project.edition !== this.project()?.edition;
    this.project.set(project);
    if (editionChanged && project.edition) this.loadTables(project.edition).subscribe();
    this.refreshResults();
  }

  upsertSpace(space: SpaceRecord): void {
    this.spaces.update((spaces) => {
      const index = spaces.findIndex((existing) => existing.id === space.id);
      return index === -1 ? [...spaces, space] : spaces.map((existing) => (existing.id === space.id ? space : existing));
    });
    this.refreshResults();
  }

  /** Many spaces written at once (one control on many): one recompute for all of them. */
  upsertSpaces(saved: readonly SpaceRecord[]): void {
    const byId = new Map(saved.map((space) => [space.id, space]));
    this.spaces.update((spaces) => spaces.map((space) => byId.get(space.id) ?? space));
    this.refreshResults();
  }

  /** Reads the spaces again, after a stale write: what others saved replaces what is on screen. */
  reloadSpaces(): Observable<SpaceRecord[]> {
    const id = this.projectId();
    if (!id) return of([]);
    return this.api.spaces(id).pipe(
      tap((spaces) => {
        this.spaces.set(spaces);
        this.refreshResults();
      }),
    );
  }

  removeSpace(spaceId: string): void {
    this.spaces.update((spaces) => spaces.filter((space) => space.id !== spaceId));
    this.refreshResults();
  }

  upsertLuminaireType(type: LuminaireTypeRecord): void {
    this.luminaireTypes.update((types) => {
      const index = types.findIndex((existing) => existing.id === type.id);
      const next = index === -1 ? [...types, type] : types.map((existing) => (existing.id === type.id ? type : existing));
      return next.sort((a, b) => a.tag.localeCompare(b.tag, undefined, { numeric: true }));
    });
    this.refreshResults();
  }

  removeLuminaireType(typeId: string): void {
    this.luminaireTypes.update((types) => types.filter((type) => type.id !== typeId));
    this.refreshResults();
  }

  upsertExterior(application: ExteriorApplicationRecord): void {
    this.exterior.update((applications) => {
      const index = applications.findIndex((existing) => existing.id === application.id);
      return index === -1 ? [...applications, application] : applications.map((existing) => (existing.id === application.id ? application : existing));
    });
    this.refreshResults();
  }

  removeExterior(applicationId: string): void {
    this.exterior.update((applications) => applications.filter((application) => application.id !== applicationId));
    this.refreshResults();
  }
}
