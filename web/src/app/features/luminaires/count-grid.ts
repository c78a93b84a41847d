import { createRepositionScrollStrategy, OverlayModule, type ConnectedPosition } from '@angular/cdk/overlay';
import { CdkVirtualScrollViewport, ScrollingModule } from '@angular/cdk/scrolling';
import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, Injector, input, output, signal, viewChild } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { LuminaireTypeRecord, SpaceRecord } from '../../core/api/api-types';
import { numberProblem, ranges } from '../../shared/number-range';
import { cellCount } from './luminaire-counts';

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

/** Spaces down, luminaire types across: type a count, Enter goes down, Tab goes across. */
@Component({
  selector: 'al-count-grid',
  imports: [OverlayModule, ScrollingModule, MatIconModule, MatTooltipModule],
  templateUrl: './count-grid.html',
  styleUrl: './count-grid.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CountGrid {
  protected readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  readonly spaces = input.required<readonly SpaceRecord[]>();
  readonly types = input.required<readonly LuminaireTypeRecord[]>();
  readonly canEdit = input(false);
  /** Spaces with a write in flight. */
  readonly saving = input<ReadonlySet<string>>(new Set());
  readonly changeCount = output<CountEdit>();
  readonly openSpace = output<SpaceRecord>();

  private readonly viewport = viewChild(CdkVirtualScrollViewport);
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
    const value = input.value.trim();
    const current = cellCount(space, tag).count;
    const message = value === '' ? null : numberProblem(value, ranges.count);
    if (message) {
      this.problem.set({ spaceId: space.id, tag, text: input.value, message, stored: current });
      this.problemCell.set(input);
      return;
    }
    if (this.hasProblem(space, tag)) this.clearProblem();
    if (value === current || (value === '' && current === '') || (value === '0' && current === '')) return;
    this.changeCount.emit({ space, tag, count: value });
  }

  /** Enter moves to the same type in the next space (Shift+Enter goes up), as a spreadsheet does. */
  protected move(event: Event, row: number, column: number): void {
    const keyboard = event as KeyboardEvent;
    keyboard.preventDefault();
    const cell = keyboard.target as HTMLInputElement;
    cell.blur();
    // A refused value keeps the cell, as a spreadsheet keeps the cursor on a bad entry.
    if (this.problemCell() === cell) {
      cell.focus();
      return;
    }
    const next = row + (keyboard.shiftKey ? -1 : 1);
    if (next < 0 || next >= this.sortedSpaces().length) return;
    const focus = () => this.host.nativeElement.querySelector<HTMLInputElement>(`input[data-row="${next}"][data-column="${column}"]`);
    const target = focus();
    if (target) {
      target.focus();
      target.select();
      return;
    }
    this.viewport()?.scrollToIndex(next);
    setTimeout(() => {
      focus()?.focus();
      focus()?.select();
    }, 50);
  }

  protected total(space: SpaceRecord): number {
    return space.luminaires.reduce((sum, group) => sum + Number(group.count), 0);
  }
}
