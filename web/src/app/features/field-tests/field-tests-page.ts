import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { firstValueFrom } from 'rxjs';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { phoneScreen, screenMatches } from '../../shared/media-queries';
import { failureWords } from '../../shared/write-failure';
import { ProjectStore } from '../workspace/project-store';
import { FieldTestPhotos } from './field-test-photos';
import { fieldTestSummaryOf } from '../../../../../contract/field-tests';
import { FieldTestQueue, isOffline, queueLimit } from './field-test-queue';
import {
  FieldTestsApi,
  type FieldTestInput,
  type MeasuredValues,
  type TestKind,
  type TestPlanItem,
  type TestPlanView,
} from './field-tests-api';
import {
  checkMeasured,
  groupWords,
  lightUnit,
  measuredByKind,
  measuredFields,
  measuredWords,
  progressPercent,
  progressWords,
  resultWords,
  searchLimit,
  searchMatches,
  searchTerms,
  filterMatches,
  testFilters,
  type MeasuredField,
  type TestFilter,
} from './field-tests-words';

type PlanState = { status: 'loading' } | { status: 'ready'; plan: TestPlanView } | { status: 'failed'; message: string };

interface Draft {
  itemId: string;
  result: 'pass' | 'fail' | null;
  measured: Record<MeasuredField, string>;
  notes: string;
}

const emptyMeasured = (): Record<MeasuredField, string> => ({ timeoutMinutes: '', lightLevel: '', overrideMinutes: '' });

/** The functional test plan of the built design: every member reads it; the contractor records each test on site. */
@Component({
  selector: 'al-field-tests-page',
  imports: [
    DatePipe,
    FieldTestPhotos,
    FormsModule,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
  ],
  templateUrl: './field-tests-page.html',
  styleUrl: './field-tests-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldTestsPage {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(FieldTestsApi);
  private readonly destroyRef = inject(DestroyRef);
  protected readonly queue = inject(FieldTestQueue);

  protected readonly measuredFields = measuredFields;
  protected readonly measuredWords = measuredWords;
  protected readonly resultWords = resultWords;
  protected readonly groupWords = groupWords;
  protected readonly progressWords = progressWords;
  protected readonly progressPercent = progressPercent;
  protected readonly completedAt = (plan: TestPlanView) => fieldTestSummaryOf(plan).completedAt;

  protected readonly state = signal<PlanState>({ status: 'loading' });
  protected readonly plan = computed(() => {
    const state = this.state();
    return state.status === 'ready' ? state.plan : null;
  });
  /** The one test being recorded, if any. */
  protected readonly draft = signal<Draft | null>(null);
  protected readonly saving = signal(false);
  /** Why the last record was not taken, beside its item. */
  protected readonly refusal = signal<{ itemId: string; message: string } | null>(null);

  protected readonly canRecord = computed(() => {
    const project = this.store.project();
    return !!project && project.role === 'contractor' && !project.archivedAt;
  });
  protected readonly isContractor = computed(() => this.store.project()?.role === 'contractor');
  protected readonly lightUnit = computed(() => lightUnit(this.store.units()));

  protected readonly testFilters = testFilters;
  protected readonly searchLimit = searchLimit;
  /** Which tests are shown, and the search typed. */
  protected readonly filter = signal<TestFilter>('all');
  protected readonly search = signal('');
  private readonly terms = computed(() => searchTerms(this.search()));
  /** On a phone each kind starts folded to its heading and progress, so the page is a list of kinds to open; filtered, open. */
  private readonly phone = screenMatches(phoneScreen);
  /** The kinds the person opened or folded, over the default of the screen. */
  private readonly foldedByPerson = signal<ReadonlyMap<TestKind, boolean>>(new Map());

  /** How many items each filter shows, for its label. */
  protected readonly filterCounts = computed(() => {
    const items = this.plan()?.items ?? [];
    return new Map(testFilters.map(({ value }) => [value, items.filter((item) => filterMatches(item, value)).length]));
  });

  private readonly shownItems = computed(() => {
    const plan = this.plan();
    if (!plan) return [];
    const filter = this.filter();
    const terms = this.terms();
    return plan.items.filter(
      (item) =>
        filterMatches(item, filter) &&
        searchMatches(
          item,
          item.spaceIds.map((id) => this.spaceNames().get(id) ?? ''),
          terms,
        ),
    );
  });

  /** Whether the filter or the search hides some items. */
  protected readonly narrowed = computed(() => this.filter() !== 'all' || this.terms() !== '');
  protected readonly shownWords = computed(() => {
    const total = this.plan()?.items.length ?? 0;
    const shown = this.shownItems().length;
    if (!this.narrowed()) return '';
    if (shown === 0)
      return this.terms() ? `No test matches “${this.search().trim()}” among those shown.` : 'No test is shown by this choice.';
    return `${shown.toLocaleString('en-US')} of ${total.toLocaleString('en-US')} ${total === 1 ? 'test' : 'tests'} shown.`;
  });

  /**
   * The shown items by kind, in the order of the progress (the service's order of kinds); a kind
   * with none shown is left out. A search opens the kinds it finds something in; a filter opens
   * those the person has not folded.
   */
  protected readonly sections = computed(() => {
    const plan = this.plan();
    if (!plan) return [];
    const shown = this.shownItems();
    const searching = this.terms() !== '';
    const narrowed = this.narrowed();
    return plan.progress.kinds
      .map((kind) => {
        const items = shown.filter((item) => item.kind === kind.kind);
        const folded = !searching && (this.foldedByPerson().get(kind.kind) ?? (narrowed ? false : this.phone()));
        return {
          ...kind,
          folded,
          shown: items.length,
          total: plan.items.filter((item) => item.kind === kind.kind).length,
          // Narrowed, only the samples of the items shown.
          groups: plan.groups.filter(
            (group) => group.kind === kind.kind && (!narrowed || items.some((item) => group.itemIds.includes(item.id))),
          ),
          items: folded ? [] : items,
        };
      })
      .filter((section) => section.shown > 0);
  });

  /** This project's results waiting for a connection, and what sending the others met. */
  protected readonly waiting = computed(() => this.queue.waiting().filter((entry) => entry.projectId === this.store.projectId()));
  protected readonly conflicts = computed(() => this.queue.conflicts().filter((entry) => entry.projectId === this.store.projectId()));
  private readonly waitingByItem = computed(() => new Map(this.waiting().map((entry) => [entry.itemId, entry])));
  protected readonly waitingWords = computed(() => {
    const count = this.waiting().length;
    if (count === 0) return '';
    const words = count === 1 ? '1 result waits for a connection.' : `${count.toLocaleString('en-US')} results wait for a connection.`;
    return this.queue.lasting ? words : `${words} This browser keeps them only while the page stays open.`;
  });
  /** How many the last sending took, in words, until the next result is taken. */
  protected readonly sentWords = signal('');

  private readonly spaceNames = computed(() => new Map(this.store.spaces().map((space) => [space.id, space.name])));

  constructor() {
    effect(() => {
      const projectId = this.store.projectId();
      if (projectId)
        untracked(() => {
          this.load(projectId);
          void this.sendWaiting(projectId);
        });
    });
    const online = () => {
      const projectId = this.store.projectId();
      if (projectId) void this.sendWaiting(projectId);
    };
    window.addEventListener('online', online);
    this.destroyRef.onDestroy(() => window.removeEventListener('online', online));
  }

  protected toggle(kind: TestKind, folded: boolean): void {
    this.foldedByPerson.update((map) => new Map(map).set(kind, !folded));
  }

  protected setFilter(filter: TestFilter): void {
    this.filter.set(filter);
  }

  protected setSearch(text: string): void {
    this.search.set(text.slice(0, searchLimit));
  }

  protected showAll(): void {
    this.filter.set('all');
    this.search.set('');
  }

  /** The queued result of an item, while it waits to be sent. */
  protected waitingOf(itemId: string): FieldTestInput | null {
    return this.waitingByItem().get(itemId)?.input ?? null;
  }

  /** Sends the results kept while offline, in order; the plan is read again when any was taken. */
  protected async sendWaiting(projectId: string): Promise<void> {
    const conflictsBefore = this.conflicts().length;
    const sent = await this.queue.flush(projectId, (entry) => firstValueFrom(this.api.record(entry.projectId, entry.itemId, entry.input)));
    if (sent > 0)
      this.sentWords.set(sent === 1 ? '1 waiting result was sent.' : `${sent.toLocaleString('en-US')} waiting results were sent.`);
    if (sent > 0 || this.conflicts().length !== conflictsBefore) this.load(projectId);
  }

  protected dismiss(id: string): void {
    void this.queue.dismiss(id);
  }

  /** Keeps the result in the browser until the connection returns. */
  private async keep(projectId: string, item: TestPlanItem, input: FieldTestInput): Promise<void> {
    const kept = await this.queue.add({ projectId, itemId: item.id, itemTitle: item.title, input, takenAt: new Date().toISOString() });
    this.saving.set(false);
    if (!kept) {
      this.refusal.set({
        itemId: item.id,
        message: `This browser already keeps ${queueLimit} results waiting for a connection: send those before taking more.`,
      });
      return;
    }
    this.draft.set(null);
  }

  private load(projectId: string): void {
    this.api
      .plan(projectId)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (plan) => {
          this.state.set({ status: 'ready', plan });
          // As the service keeps it on the project: nothing to say before any test is recorded.
          if (plan.items.some((item) => item.history.length > 0)) this.store.setFieldTests(fieldTestSummaryOf(plan));
        },
        error: (error: unknown) => this.state.set({ status: 'failed', message: failureWords(error) }),
      });
  }

  protected spacesWords(item: TestPlanItem): string {
    if (item.spaceIds.length === 0) return '';
    const names = item.spaceIds.map((id) => this.spaceNames().get(id) ?? 'a space no longer in the design');
    return names.join(', ');
  }

  protected fieldsOf(kind: TestKind): MeasuredField[] {
    return measuredByKind[kind];
  }

  protected unitOf(field: MeasuredField): string {
    return field === 'lightLevel' ? this.lightUnit() : 'minutes';
  }

  /** The draft being recorded, when it is this item's. */
  protected openDraft(itemId: string): Draft | null {
    const draft = this.draft();
    return draft?.itemId === itemId ? draft : null;
  }

  protected open(item: TestPlanItem): void {
    this.refusal.set(null);
    this.draft.set({ itemId: item.id, result: null, measured: emptyMeasured(), notes: '' });
  }

  protected cancel(): void {
    this.draft.set(null);
    this.refusal.set(null);
  }

  protected setResult(result: 'pass' | 'fail'): void {
    this.draft.update((draft) => (draft ? { ...draft, result } : draft));
  }

  protected setMeasured(field: MeasuredField, value: unknown): void {
    const text = value === null || value === undefined ? '' : String(value);
    this.draft.update((draft) => (draft ? { ...draft, measured: { ...draft.measured, [field]: text } } : draft));
  }

  protected setNotes(notes: string): void {
    this.draft.update((draft) => (draft ? { ...draft, notes } : draft));
  }

  protected save(item: TestPlanItem): void {
    const projectId = this.store.projectId();
    const draft = this.draft();
    if (!projectId || !draft || draft.itemId !== item.id || this.saving()) return;
    if (!draft.result) {
      this.refusal.set({ itemId: item.id, message: 'Choose pass or fail.' });
      return;
    }
    const measured: MeasuredValues = {};
    for (const field of this.fieldsOf(item.kind)) {
      const checked = checkMeasured(field, draft.measured[field]);
      if (!checked.ok) {
        this.refusal.set({ itemId: item.id, message: checked.message });
        return;
      }
      if (checked.value !== undefined) measured[field] = checked.value;
    }
    const notes = draft.notes.trim();
    if (notes.length > 2000) {
      this.refusal.set({ itemId: item.id, message: 'Notes: at most 2,000 characters.' });
      return;
    }
    this.saving.set(true);
    this.refusal.set(null);
    this.sentWords.set('');
    const input: FieldTestInput = {
      result: draft.result,
      ...(Object.keys(measured).length > 0 ? { measured } : {}),
      ...(notes ? { notes } : {}),
    };
    // Offline, or earlier results still waiting: this one waits behind them, so they are sent in the order taken.
    if (navigator.onLine === false || this.waiting().length > 0) {
      void this.keep(projectId, item, input).then(() => {
        if (navigator.onLine !== false) void this.sendWaiting(projectId);
      });
      return;
    }
    this.api
      .record(projectId, item.id, input)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: () => {
          this.saving.set(false);
          this.draft.set(null);
          // The whole plan again: a failed sample may have widened its combination.
          this.load(projectId);
        },
        error: (error: unknown) => {
          if (isOffline(error)) {
            void this.keep(projectId, item, input);
            return;
          }
          this.saving.set(false);
          this.refusal.set({ itemId: item.id, message: failureWords(error) });
        },
      });
  }
}
