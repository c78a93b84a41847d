import { CdkVirtualScrollViewport, ScrollingModule } from '@angular/cdk/scrolling';
import { ChangeDetectionStrategy, Component, computed, ElementRef, inject, input, output, viewChild } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { LuminaireTypeRecord, SpaceRecord } from '../../core/api/api-types';
import { quantityProblem } from '../spaces/space-form';
import { cellCount } from './luminaire-counts';

export interface CountEdit {
  space: SpaceRecord;
  tag: string;
  count: string;
}

/** Spaces down, luminaire types across: type a count, Enter goes down, Tab goes across. */
@Component({
  selector: 'al-count-grid',
  imports: [ScrollingModule, MatIconModule, MatTooltipModule],
  templateUrl: './count-grid.html',
  styleUrl: './count-grid.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CountGrid {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
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

  protected cell(space: SpaceRecord, tag: string) {
    return cellCount(space, tag);
  }

  protected commit(event: Event, space: SpaceRecord, tag: string): void {
    const input = event.target as HTMLInputElement;
    const value = input.value.trim();
    const current = cellCount(space, tag).count;
    if (value === current || (value === '' && current === '') || (value === '0' && current === '')) return;
    const problem = value === '' ? null : quantityProblem(value, 'non-negative', true);
    if (problem) {
      input.setCustomValidity(problem);
      input.reportValidity();
      input.value = current;
      input.setCustomValidity('');
      return;
    }
    this.changeCount.emit({ space, tag, count: value });
  }

  /** Enter moves to the same type in the next space (Shift+Enter goes up), as a spreadsheet does. */
  protected move(event: Event, row: number, column: number): void {
    const keyboard = event as KeyboardEvent;
    keyboard.preventDefault();
    (keyboard.target as HTMLInputElement).blur();
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
