import { ChangeDetectionStrategy, Component, computed, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { provideNativeDateAdapter } from '@angular/material/core';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { catchError, map, of, startWith, Subject, switchMap, tap, type Observable } from 'rxjs';
import type { HistoryEntry, HistoryPage as HistoryPageBody, HistoryQuery } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { WriteFailure } from '../../shared/write-failure';
import { AllowancesApi } from '../allowances/allowances-api';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { HistoryApi } from './history-api';
import {
  describeEntry,
  describeImport,
  exactTime,
  historyItems,
  itemWords,
  relativeTime,
  restoredWords,
  unitsAtEntry,
  unitsChanges,
  type EntryWords,
  type HistoryLabels,
  type UnitsChange,
} from './history-entry';

/** A space the history can be filtered by: one of the project's, or one that was deleted (known by its name in the history). */
export interface SpaceOption {
  id: string;
  name: string;
  deleted: boolean;
}

interface ListedItem {
  key: string;
  at: string;
  words: EntryWords;
  /** The delete entry a Restore button brings back, and the button's name. */
  restorable: HistoryEntry | null;
  restoreLabel: string;
}

type ListState = { status: 'loading' } | { status: 'ready' } | { status: 'failed'; message: string };

/** Entries per page; "Show older" asks for the next. */
export const historyPageSize = 50;
/** Options the space filter offers at once; typing narrows them. */
const spaceOptionLimit = 50;

function isoDate(date: Date): string {
  const pad = (value: number) => String(value).padStart(2, '0');
  return `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}`;
}

/** Who changed what in the project and when, newest first, with filters, paging and Restore for deleted items. */
@Component({
  selector: 'al-history-page',
  imports: [
    ReactiveFormsModule,
    MatAutocompleteModule,
    MatButtonModule,
    MatDatepickerModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  providers: [provideNativeDateAdapter()],
  templateUrl: './history-page.html',
  styleUrl: './history-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HistoryPage {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(HistoryApi);
  private readonly workspaceApi = inject(WorkspaceApi);
  private readonly allowancesApi = inject(AllowancesApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly writeFailure = inject(WriteFailure);
  private readonly requests = new Subject<{ query: HistoryQuery; before?: string }>();

  protected readonly filters = new FormGroup({
    /** Text while the person types, the option once chosen; null when typed text is left unchosen. */
    space: new FormControl<SpaceOption | string | null>(''),
    person: new FormControl('', { nonNullable: true }),
    since: new FormControl<Date | null>(null),
  });
  protected readonly today = new Date();

  protected readonly state = signal<ListState>({ status: 'loading' });
  protected readonly entries = signal<HistoryEntry[]>([]);
  protected readonly more = signal(false);
  protected readonly people = signal<{ id: string; name: string }[]>([]);
  protected readonly loadingOlder = signal(false);
  protected readonly restoring = signal<string | null>(null);
  private readonly now = signal(new Date());
  /** Spaces named anywhere in the history read so far, so deleted ones can be chosen too. */
  private readonly spacesSeen = signal<ReadonlyMap<string, string>>(new Map());
  /** Changes of units seen so far, so older figures read in the units of their time. */
  private readonly conversions = signal<readonly UnitsChange[]>([]);

  private readonly filterValue = toSignal(
    this.filters.valueChanges.pipe(
      startWith(this.filters.getRawValue()),
      map(() => this.filters.getRawValue()),
    ),
    { requireSync: true },
  );
  protected readonly query = computed<HistoryQuery>(
    () => {
      const { space, person, since } = this.filterValue();
      return {
        spaceId: space && typeof space === 'object' ? space.id : undefined,
        userId: person || undefined,
        since: since ? isoDate(since) : undefined,
      };
    },
    { equal: (a, b) => a.spaceId === b.spaceId && a.userId === b.userId && a.since === b.since },
  );
  protected readonly filtered = computed(() => {
    const query = this.query();
    return !!(query.spaceId || query.userId || query.since);
  });

  private readonly editions = toSignal(this.workspaceApi.editions().pipe(catchError(() => of([]))), { initialValue: [] });
  private readonly labels = computed<HistoryLabels>(() => {
    const tables = this.store.tables();
    return {
      spaceTypes: new Map((tables?.spaceTypes ?? []).map((type) => [type.key, type.label])),
      buildingAreaTypes: new Map((tables?.buildingAreaTypes ?? []).map((type) => [type.key, type.label])),
      controlStrategies: new Map((tables?.controlStrategies ?? []).map((strategy) => [strategy.key, strategy.label])),
      exteriorApplications: new Map(
        (tables?.exteriorApplications ?? []).map((application) => [application.key, { label: application.label, unit: application.unit }]),
      ),
      editions: new Map(this.editions().map((edition) => [edition.id, edition.title])),
    };
  });

  protected readonly items = computed<ListedItem[]>(() => {
    const labels = this.labels();
    const current = this.store.units();
    const conversions = this.conversions();
    const now = this.now();
    return historyItems(this.entries()).map((item) => {
      const entries = item.kind === 'entry' ? [item.entry] : item.entries;
      const first = entries[0]!;
      const units = unitsAtEntry(first.id, current, conversions);
      const words = item.kind === 'entry' ? describeEntry(item.entry, labels, units) : describeImport(item.entries, labels, units);
      const restorable = item.kind === 'entry' && item.entry.action === 'delete' && item.entry.restorable ? item.entry : null;
      return {
        key: first.id,
        at: `${relativeTime(first.at, now)} · ${exactTime(first.at)}`,
        words,
        restorable,
        restoreLabel: restorable ? `Restore ${itemWords(restorable, labels)}` : '',
      };
    });
  });

  protected readonly spaceOptions = computed<SpaceOption[]>(() => {
    const current = this.store.spaces();
    const present = new Set(current.map((space) => space.id));
    const options: SpaceOption[] = current.map((space) => ({ id: space.id, name: space.name, deleted: false }));
    for (const [id, name] of this.spacesSeen()) if (!present.has(id)) options.push({ id, name, deleted: true });
    const typed = this.filterValue().space;
    const text = typeof typed === 'string' ? typed.trim().toLocaleLowerCase() : '';
    return options.filter((option) => option.name.toLocaleLowerCase().includes(text)).slice(0, spaceOptionLimit);
  });

  protected readonly spaceName = (option: SpaceOption | string | null): string =>
    typeof option === 'object' && option ? option.name : (option ?? '');

  constructor() {
    this.requests
      .pipe(
        switchMap(({ query, before }) => {
          const projectId = this.store.projectId();
          if (!projectId) return of(null);
          return this.api.history(projectId, { ...query, before, limit: historyPageSize }).pipe(
            map((page) => ({ page, older: before !== undefined })),
            catchError((error: unknown) => {
              this.state.set({ status: 'failed', message: error instanceof ApiError ? error.message : 'The history could not be loaded.' });
              this.loadingOlder.set(false);
              return of(null);
            }),
          );
        }),
        takeUntilDestroyed(),
      )
      .subscribe((answer) => {
        if (answer) this.accept(answer.page, answer.older);
      });
    effect(() => {
      const query = this.query();
      untracked(() => this.load(query));
    });
  }

  protected showOlder(): void {
    const last = this.entries().at(-1);
    if (!last) return;
    this.loadingOlder.set(true);
    this.requests.next({ query: this.query(), before: last.id });
  }

  protected clearSpace(): void {
    this.filters.controls.space.setValue('');
  }

  protected clearFilters(): void {
    this.filters.reset({ space: '', person: '', since: null });
  }

  protected restore(entry: HistoryEntry): void {
    const projectId = this.store.projectId();
    if (!projectId || !entry.entityId) return;
    const id = entry.entityId;
    let request: Observable<unknown>;
    switch (entry.entity) {
      case 'space':
        request = this.workspaceApi.restoreSpace(projectId, id).pipe(tap((space) => this.store.upsertSpace(space)));
        break;
      case 'luminaire-type':
        request = this.workspaceApi.restoreLuminaireType(projectId, id).pipe(tap((type) => this.store.upsertLuminaireType(type)));
        break;
      case 'exterior-application':
        request = this.workspaceApi
          .restoreExteriorApplication(projectId, id)
          .pipe(tap((application) => this.store.upsertExterior(application)));
        break;
      case 'additional-allowance':
        // The claims are read by the Allowances page itself; the results count the claim again.
        request = this.allowancesApi.restore(projectId, id).pipe(tap(() => this.store.refreshResults()));
        break;
      default:
        return;
    }
    this.restoring.set(entry.id);
    request.subscribe({
      next: () => {
        this.restoring.set(null);
        this.snackBar.open(restoredWords(entry, this.labels()), undefined, { duration: 4000 });
        this.load(this.query());
      },
      error: (error: unknown) => {
        this.restoring.set(null);
        this.writeFailure.report(error, () => this.load(this.query()));
      },
    });
  }

  private load(query: HistoryQuery): void {
    this.state.set({ status: 'loading' });
    this.requests.next({ query });
  }

  private accept(page: HistoryPageBody, older: boolean): void {
    this.now.set(new Date());
    this.entries.update((entries) => (older ? [...entries, ...page.entries] : page.entries));
    this.more.set(page.more);
    this.people.set(page.people);
    this.loadingOlder.set(false);
    this.state.set({ status: 'ready' });
    // Newest first: a space's latest name is the first one met, and a fresh first page is newer than anything kept.
    this.spacesSeen.update((seen) => {
      const next = new Map(older ? seen : []);
      for (const entry of page.entries)
        if (entry.entity === 'space' && entry.entityId && entry.name && !next.has(entry.entityId)) next.set(entry.entityId, entry.name);
      if (!older) for (const [id, name] of seen) if (!next.has(id)) next.set(id, name);
      return next;
    });
    const conversions = unitsChanges(page.entries);
    if (conversions.length) {
      this.conversions.update((known) => [
        ...known.filter((change) => !conversions.some((added) => added.id === change.id)),
        ...conversions,
      ]);
    }
  }
}
