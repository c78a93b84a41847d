import { createRepositionScrollStrategy, OverlayModule, type ConnectedPosition } from '@angular/cdk/overlay';
import { CdkVirtualScrollViewport, ScrollingModule } from '@angular/cdk/scrolling';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  input,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { LuminaireTypeRecord, SpaceRecord, UnitSystem } from '../../core/api/api-types';
import { formatArea } from '../../shared/format';
import { loadMath, needsReading, readMeasure } from '../../shared/measure';
import { phoneScreen, screenMatches } from '../../shared/media-queries';
import { numberProblem, ranges } from '../../shared/number-range';
import { cellCount, eachWords } from './luminaire-counts';

/** Numbers, + − × / and brackets: what a count cell reads as arithmetic (words and units it refuses as typed). */
const arithmetic = /^[\d\s.+\-*/×()]+$/;

/** A value a cell refused: it stays in the cell, with the reason beside it, until corrected or Esc. */
interface CellProblem {
  spaceId: string;
  tag: string;
  text: string;
  message: string;
  /** What the cell held before: Esc puts it back. */
  stored: string;
}

export interface CountEdit {
  space: SpaceRecord;
  tag: string;
  count: string;
}

/**
 * Heights in px of a space's card on a phone (the virtual scroll needs them fixed): its heading, a
 * row per type (two lines of tag and description, one of watts), its button, its border above and
 * below, the gap to the next card.
 */
export const countCard = { heading: 60, field: 64, actions: 52, border: 2, gap: 12 };

/**
 * Spaces down, luminaire types across: type a count, Enter goes down, Tab goes across. On a phone,
 * where the columns would not fit, each space is a card with one labelled count per type, read in
 * the page's own scroll; Enter goes to the next count.
 */
@Component({
  selector: 'al-count-grid',
  imports: [OverlayModule, ScrollingModule, MatButtonModule, MatIconModule, MatTooltipModule],
  templateUrl: './count-grid.html',
  styleUrl: './count-grid.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CountGrid {
  protected readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  readonly spaces = input.required<readonly SpaceRecord[]>();
  readonly types = input.required<readonly LuminaireTypeRecord[]>();
  readonly canEdit = input(false);
  readonly units = input<UnitSystem>('ip');
  /** Spaces with a write in flight. */
  readonly saving = input<ReadonlySet<string>>(new Set());
  readonly changeCount = output<CountEdit>();
  readonly openSpace = output<SpaceRecord>();

  private readonly viewport = viewChild(CdkVirtualScrollViewport);
  protected readonly phone = screenMatches(phoneScreen);
  protected readonly cardSize = computed(
    () => countCard.heading + this.types().length * countCard.field + countCard.actions + countCard.border + countCard.gap,
  );
  protected readonly cardRows = computed(
    () => `${countCard.heading}px repeat(${this.types().length}, ${countCard.field}px) ${countCard.actions}px`,
  );
  protected readonly cardGap = countCard.gap;
  protected readonly eachWords = eachWords;
  protected readonly columns = computed(() => `minmax(160px, 1.5fr) repeat(${this.types().length}, 76px) 72px`);
  protected readonly sortedSpaces = computed(() => [...this.spaces()].sort((a, b) => a.position - b.position));
  protected readonly trackSpace = (_index: number, space: SpaceRecord) => space.id;
  protected readonly problem = signal<CellProblem | null>(null);
  /** The cell the reason is shown beside; the virtual scroll may recreate it, so focusing the cell again re-attaches it. */
  protected readonly problemCell = signal<HTMLInputElement | null>(null);
  /** Follows the cell as the grid scrolls, and closes once the cell scrolls out of sight. */
  protected readonly problemScroll = createRepositionScrollStrategy(inject(Injector), { autoClose: true });
  protected readonly problemPositions: ConnectedPosition[] = [
    { originX: 'end', originY: 'center', overlayX: 'start', overlayY: 'center', offsetX: 8 },
    { originX: 'end', originY: 'bottom', overlayX: 'end', overlayY: 'top', offsetY: 4 },
    { originX: 'end', originY: 'top', overlayX: 'end', overlayY: 'bottom', offsetY: -4 },
  ];

  protected hasProblem(space: SpaceRecord, tag: string): boolean {
    const problem = this.problem();
    return problem !== null && problem.spaceId === space.id && problem.tag === tag;
  }

  /** What the cell shows: the refused text while it is being corrected, else the stored count. */
  protected cellText(space: SpaceRecord, tag: string): string {
    return this.hasProblem(space, tag) ? this.problem()!.text : cellCount(space, tag).count;
  }

  protected focused(event: FocusEvent, space: SpaceRecord, tag: string): void {
    const input = event.target as HTMLInputElement;
    input.select();
    if (this.hasProblem(space, tag)) this.problemCell.set(input);
    // Fetched while the count is typed, so arithmetic is read at once on leaving the cell.
    void loadMath();
  }

  /** Esc gives up on a refused value and puts the stored count back. */
  protected revert(space: SpaceRecord, tag: string): void {
    if (this.hasProblem(space, tag)) this.clearProblem();
  }

  protected clearProblem(): void {
    this.problem.set(null);
    this.problemCell.set(null);
  }

  protected cell(space: SpaceRecord, tag: string) {
    return cellCount(space, tag);
  }

  protected commit(event: Event, space: SpaceRecord, tag: string): void {
    const input = event.target as HTMLInputElement;
    const typed = input.value.trim();
    if (!needsReading(typed) || !arithmetic.test(typed)) {
      this.commitCount(input, space, tag, typed);
      return;
    }
    // Arithmetic as on a takeoff sheet ("4*3", "2*6 + 1"): the count it comes to is checked as if typed.
    void readMeasure(typed, 'number', this.units()).then((reading) => {
      if (input.value.trim() !== typed) return;
      // Text that is no arithmetic is refused in the grid's own words; a refused result keeps what was typed.
      const value = reading.kind === 'value' ? reading.value : typed;
      if (this.commitCount(input, space, tag, value)) input.value = value;
    });
  }

  /** False when the count is refused (the reason shown beside the cell). */
  private commitCount(input: HTMLInputElement, space: SpaceRecord, tag: string, value: string): boolean {
    const current = cellCount(space, tag).count;
    const message = value === '' ? null : numberProblem(value, ranges.count);
    if (message) {
      this.problem.set({ spaceId: space.id, tag, text: input.value, message, stored: current });
      this.problemCell.set(input);
      return false;
    }
    if (this.hasProblem(space, tag)) this.clearProblem();
    if (value === current || (value === '' && current === '') || (value === '0' && current === '')) return true;
    this.changeCount.emit({ space, tag, count: value });
    return true;
  }

  /** Enter moves to the same type in the next space (Shift+Enter goes up), as a spreadsheet does. */
  protected move(event: Event, row: number, column: number): void {
    const back = (event as KeyboardEvent).shiftKey;
    this.leaveCell(event, row + (back ? -1 : 1), column);
  }

  /** On a phone's card Enter moves to the next count to type, on to the next space's (Shift+Enter goes back); a split count is typed in the space. */
  protected moveOn(event: Event, row: number, column: number): void {
    const step = (event as KeyboardEvent).shiftKey ? -1 : 1;
    const types = this.types();
    const spaces = this.sortedSpaces();
    let [nextRow, nextColumn] = [row, column];
    do {
      nextColumn += step;
      if (nextColumn >= types.length) [nextRow, nextColumn] = [nextRow + 1, 0];
      else if (nextColumn < 0) [nextRow, nextColumn] = [nextRow - 1, types.length - 1];
    } while (nextRow >= 0 && nextRow < spaces.length && cellCount(spaces[nextRow]!, types[nextColumn]!.tag).split);
    this.leaveCell(event, nextRow, nextColumn);
  }

  private leaveCell(event: Event, row: number, column: number): void {
    event.preventDefault();
    const cell = event.target as HTMLInputElement;
    cell.blur();
    // A refused value keeps the cell, as a spreadsheet keeps the cursor on a bad entry.
    if (this.problemCell() === cell) {
      cell.focus();
      return;
    }
    if (row < 0 || row >= this.sortedSpaces().length) return;
    const focus = () => this.host.nativeElement.querySelector<HTMLInputElement>(`input[data-row="${row}"][data-column="${column}"]`);
    const target = focus();
    if (target) {
      target.focus();
      target.select();
      return;
    }
    this.scrollToSpace(row);
    setTimeout(() => {
      focus()?.focus();
      focus()?.select();
    }, 50);
  }

  /** Brings a space's card back into view with the focus on its daylight-zone button, as when its counts panel closes on a phone. */
  reveal(spaceId: string): void {
    const index = this.sortedSpaces().findIndex((space) => space.id === spaceId);
    if (index === -1) return;
    // A list just shown takes a few frames to measure its length and to render the cards scrolled to.
    let frames = 30;
    const attempt = () => {
      const card = this.host.nativeElement.querySelector<HTMLElement>(`[data-space-id="${spaceId}"]`);
      if (card) {
        card.scrollIntoView({ block: 'start' });
        // The button the panel was opened from, back in view where the person left it.
        card.querySelector<HTMLButtonElement>('.zones')?.focus();
        return;
      }
      if (frames-- === 0) return;
      this.scrollToSpace(index);
      requestAnimationFrame(attempt);
    };
    attempt();
  }

  private scrollToSpace(index: number): void {
    const viewport = this.viewport();
    if (!viewport) return;
    // The cards scroll with the page, and the viewport's own scrollToIndex leaves out where it sits on the page.
    if (this.phone()) viewport.scrollToOffset(viewport.measureViewportOffset() + index * this.cardSize());
    else viewport.scrollToIndex(index);
  }

  /** Under a card's name: its level, and how many luminaires it counts in all. */
  protected cardDetail(space: SpaceRecord): string {
    const total = this.total(space);
    return [space.level, `${total} ${total === 1 ? 'luminaire' : 'luminaires'}`].filter(Boolean).join(' · ');
  }

  protected area(space: SpaceRecord): string {
    return formatArea(space.area, this.units());
  }

  protected total(space: SpaceRecord): number {
    return space.luminaires.reduce((sum, group) => sum + Number(group.count), 0);
  }
}
