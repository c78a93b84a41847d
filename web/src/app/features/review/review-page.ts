import { DatePipe } from '@angular/common';
import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  type ElementRef,
  inject,
  Injector,
  linkedSignal,
  signal,
  viewChild,
} from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { Observable } from 'rxjs';
import {
  reviewItemKindLabels,
  reviewVerdictLabels,
  type ReviewItem,
  type ReviewItemKind,
  type ReviewVerdict,
} from '../../../../../contract/review';
import { AuthStore } from '../../core/auth/auth-store';
import { ApiError } from '../../core/http/api-error';
import { formatArea, formatWatts } from '../../shared/format';
import { SpacePicker } from '../../shared/space-picker';
import { ControlLineCard } from '../controls/control-line-card';
import { DaylightPlan } from '../daylight/daylight-plan';
import { ProjectStore } from '../workspace/project-store';
import { ReviewApi } from './review-api';
import { groupItems, outcomeLabels, stepItem, type ItemGrouping } from './review-items';

/** A verdict that needs words: the reviewer says what needs revision, or why the check does not apply. */
type WordedVerdict = Exclude<ReviewVerdict, 'confirmed'>;

/** The service's limit on a comment or a reply, as on a transition's comment (from the service's text fields). */
export const reviewTextLimit = 2000;

/** Where the engineer fixes what an item checks. */
const fixedOn: Record<ReviewItemKind, { path: string; label: string }> = {
  'power-allowance': { path: '../luminaires', label: 'Luminaires' },
  'occupancy-sensing': { path: '../controls', label: 'Controls' },
  'automatic-shutoff': { path: '../controls', label: 'Controls' },
  'light-reduction': { path: '../controls', label: 'Controls' },
  'daylight-response': { path: '../daylight', label: 'Daylight' },
  'other-controls': { path: '../controls', label: 'Controls' },
  'exterior-power': { path: '../exterior', label: 'Exterior' },
  'exterior-controls': { path: '../exterior', label: 'Exterior' },
};

/** The check items of the round beside the chosen one's detail: verdicts for the reviewer, a thread for both sides. */
@Component({
  selector: 'al-review-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatListModule,
    MatProgressBarModule,
    SpacePicker,
    ControlLineCard,
    DaylightPlan,
  ],
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  host: { '(document:keydown)': 'key($event)' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(ReviewApi);
  private readonly auth = inject(AuthStore);
  private readonly injector = inject(Injector);
  protected readonly kindLabels = reviewItemKindLabels;
  protected readonly verdictLabels = reviewVerdictLabels;
  protected readonly outcomeLabels = outcomeLabels;
  protected readonly textLimit = reviewTextLimit;
  protected readonly formatArea = formatArea;
  protected readonly formatWatts = formatWatts;

  protected readonly grouping = signal<ItemGrouping>('kind');
  protected readonly items = computed(() => {
    const state = this.store.reviewItems();
    return state.status === 'ready' ? state.items : [];
  });
  protected readonly groups = computed(() => groupItems(this.items(), this.grouping(), this.store.spaces()));
  /** The items in the order shown: what j and k step through. */
  private readonly order = computed(() => this.groups().flatMap((group) => group.items));
  private readonly chosenId = signal<string | null>(null);
  private readonly spaceNames = computed(() => new Map(this.store.spaces().map((space) => [space.id, space.name])));
  protected readonly selected = computed(() => {
    const order = this.order();
    return order.find((item) => item.id === this.chosenId()) ?? order[0] ?? null;
  });
  private readonly selectedId = computed(() => this.selected()?.id ?? null);
  protected readonly space = computed(() => {
    const id = this.selected()?.spaceId;
    return id ? (this.store.spaces().find((space) => space.id === id) ?? null) : null;
  });
  protected readonly spaceResult = computed(() => {
    const id = this.selected()?.spaceId;
    return id ? (this.store.resultBySpace().get(id) ?? null) : null;
  });
  protected readonly spaceTypeLabel = computed(() => {
    const key = this.space()?.spaceType;
    return key ? (this.store.spaceTypeByKey().get(key)?.label ?? 'Space type not in this edition') : '';
  });
  protected readonly controlLines = computed(() => (this.spaceResult()?.controls ?? []).filter((line) => line.status !== 'not-required'));
  protected readonly strategyByKey = computed(
    () => new Map((this.store.tables()?.controlStrategies ?? []).map((each) => [each.key, each])),
  );
  protected readonly room = computed(() => {
    const space = this.space();
    const length = space?.length ? Number(space.length) : NaN;
    const width = space?.width ? Number(space.width) : NaN;
    return length > 0 && width > 0 ? { length, width } : null;
  });
  protected readonly fixLink = computed(() => {
    const item = this.selected();
    return item ? fixedOn[item.kind] : null;
  });

  /** Verdicts are the reviewer's (or an administrator's), and only while the design is in review. */
  protected readonly judging = computed(() => {
    const project = this.store.project();
    if (!project || project.archivedAt || project.state !== 'in-review') return false;
    return project.role === 'reviewer' || (this.auth.user()?.isAdmin ?? false);
  });
  /** The engineer and the reviewer write in the thread; a contractor reads it. */
  protected readonly replying = computed(() => {
    const project = this.store.project();
    if (!project || project.archivedAt) return false;
    return project.role === 'engineer' || project.role === 'reviewer' || (this.auth.user()?.isAdmin ?? false);
  });
  protected readonly unchangedOpen = computed(() => this.items().filter((item) => !item.changed && item.verdict === null).length);
  protected readonly kindOpen = computed(() => {
    const kind = this.selected()?.kind;
    return kind ? this.items().filter((item) => item.kind === kind && item.verdict === null).length : 0;
  });

  protected readonly comment = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(reviewTextLimit)] });
  protected readonly reply = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(reviewTextLimit)] });
  protected readonly verdictForm = new FormGroup({ comment: this.comment });
  protected readonly replyForm = new FormGroup({ reply: this.reply });
  /** A verdict asked for (its button or its key) that waits for the comment it needs. */
  protected readonly pending = linkedSignal<string | null, WordedVerdict | null>({ source: this.selectedId, computation: () => null });
  protected readonly commentMissing = signal(false);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  private readonly commentField = viewChild<ElementRef<HTMLTextAreaElement>>('commentField');
  private readonly list = viewChild<ElementRef<HTMLElement>>('itemList');

  /** In a group of one check, each item is named by its space (the site's by the site); in a space's group, by its check. */
  protected itemName(item: ReviewItem): string {
    if (this.grouping() === 'space') return reviewItemKindLabels[item.kind];
    if (!item.spaceId) return 'Site';
    return this.spaceNames().get(item.spaceId) ?? item.title;
  }

  protected choose(id: string): void {
    if (id === this.selected()?.id) return;
    this.chosenId.set(id);
    this.comment.reset();
    this.reply.reset();
    this.commentMissing.set(false);
    this.failure.set(null);
  }

  protected step(by: 1 | -1): void {
    const next = stepItem(this.order(), this.selected()?.id ?? null, by);
    if (!next) return;
    this.choose(next);
    afterNextRender(() => this.list()?.nativeElement.querySelector('[aria-current="true"]')?.scrollIntoView({ block: 'nearest' }), {
      injector: this.injector,
    });
  }

  /** j / k and the arrows move; c, r and n give a verdict. Never while typing in a field, and never with a modifier held. */
  protected key(event: KeyboardEvent): void {
    if (event.ctrlKey || event.metaKey || event.altKey || event.defaultPrevented) return;
    const target = event.target as HTMLElement | null;
    if (target?.closest('input, textarea, select, [contenteditable=""], [contenteditable="true"], mat-select, .cdk-overlay-container'))
      return;
    const act = (run: () => void) => {
      event.preventDefault();
      run();
    };
    switch (event.key) {
      case 'j':
      case 'ArrowDown':
        return act(() => this.step(1));
      case 'k':
      case 'ArrowUp':
        return act(() => this.step(-1));
      case 'c':
        if (this.judging()) act(() => this.give('confirmed'));
        return;
      case 'r':
        if (this.judging()) act(() => this.give('needs-revision'));
        return;
      case 'n':
        if (this.judging()) act(() => this.give('not-applicable'));
        return;
    }
  }

  /** Confirmed is recorded at once (with the comment if one is written); the others wait for their comment. */
  protected give(verdict: ReviewVerdict): void {
    const item = this.selected();
    const project = this.store.project();
    if (!item || !project || this.busy()) return;
    const text = this.comment.value.trim();
    if (verdict !== 'confirmed' && text === '') {
      this.pending.set(verdict);
      this.commentMissing.set(true);
      afterNextRender(() => this.commentField()?.nativeElement.focus(), { injector: this.injector });
      return;
    }
    if (this.comment.invalid) return;
    this.write(this.api.verdict(project.id, item.id, { verdict, ...(text ? { comment: text } : {}) }), () => {
      this.comment.reset();
      this.pending.set(null);
      this.commentMissing.set(false);
      this.notice.set(`${item.title}: ${reviewVerdictLabels[verdict].toLowerCase()}.`);
      this.step(1);
    });
  }

  /** Ctrl+Enter in the comment records the verdict it waits for. */
  protected commentKey(event: KeyboardEvent): void {
    if (event.key === 'Enter' && (event.ctrlKey || event.metaKey)) {
      event.preventDefault();
      this.give(this.pending() ?? 'confirmed');
    }
  }

  protected sendReply(): void {
    const item = this.selected();
    const project = this.store.project();
    const text = this.reply.value.trim();
    if (!item || !project || text === '' || this.reply.invalid) return;
    this.write(this.api.reply(project.id, item.id, text), () => {
      this.reply.reset();
      this.notice.set('Reply added to the thread.');
    });
  }

  protected confirmKind(): void {
    const item = this.selected();
    const project = this.store.project();
    if (!item || !project) return;
    const kind = item.kind;
    const count = this.kindOpen();
    this.write(this.api.bulk(project.id, { confirm: { kind } }), () =>
      this.notice.set(`${count} ${count === 1 ? 'item' : 'items'} of ${reviewItemKindLabels[kind].toLowerCase()} confirmed.`),
    );
  }

  protected confirmUnchanged(): void {
    const project = this.store.project();
    if (!project) return;
    const count = this.unchangedOpen();
    this.write(this.api.bulk(project.id, { confirm: { unchanged: true } }), () =>
      this.notice.set(`${count} unchanged ${count === 1 ? 'item' : 'items'} confirmed.`),
    );
  }

  /** One write at a time; the items are read again either way, so what shows is what the service holds. */
  private write(request: Observable<unknown>, done: () => void): void {
    this.busy.set(true);
    this.failure.set(null);
    this.notice.set(null);
    request.subscribe({
      next: () => {
        this.busy.set(false);
        done();
        this.store.reloadReviewItems();
      },
      error: (error: unknown) => {
        this.busy.set(false);
        this.failure.set(error instanceof ApiError ? error.message : 'The review could not be saved. Try again.');
        this.store.reloadReviewItems();
      },
    });
  }
}
