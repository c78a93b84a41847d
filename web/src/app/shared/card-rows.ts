import { ViewportRuler } from '@angular/cdk/scrolling';
import { afterNextRender, DestroyRef, Directive, ElementRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';

/**
 * A table that does not fit its place (a phone, a small tablet) becomes a list of cards
 * (styles.scss, `.al-cards`): each row a card, its first cell the title, every other cell beside its
 * column's header. The headers are copied onto the cells as `data-label` whenever rows or header
 * texts change. Whether the table fits is measured while it is a table: the width it needs then is
 * what the cards wait for before turning back into a table. The place changes width with the window
 * (the workspace's navigation takes a fixed width beside it, or none).
 */
@Directive({
  selector: 'table[alCardRows]',
  host: { class: 'al-card-rows', '[class.al-cards]': 'cards()' },
})
export class CardRows {
  protected readonly cards = signal(false);

  constructor() {
    const table = inject<ElementRef<HTMLTableElement>>(ElementRef).nativeElement;
    let needed = 0;
    const fit = () => {
      const place = table.parentElement;
      if (!place) return;
      const available = place.clientWidth;
      if (!this.cards()) needed = table.scrollWidth;
      this.cards.set(needed > available + 1);
    };
    const changed = () => {
      labelCells(table);
      fit();
    };
    const mutations = new MutationObserver(changed);
    afterNextRender(() => {
      changed();
      // Only rows and texts: the labels this writes are attributes, so they do not call it again.
      mutations.observe(table, { childList: true, subtree: true, characterData: true });
    });
    inject(ViewportRuler).change(100).pipe(takeUntilDestroyed()).subscribe(fit);
    inject(DestroyRef).onDestroy(() => mutations.disconnect());
  }
}

/** A header's words as a label: the visible text, without what is there for screen readers only. */
function headerWords(cell: Element): string {
  const copy = cell.cloneNode(true) as Element;
  copy.querySelectorAll('.visually-hidden, .cdk-visually-hidden, mat-icon').forEach((hidden) => hidden.remove());
  return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
}

export function labelCells(table: HTMLTableElement): void {
  const headerRow = table.tHead?.rows[table.tHead.rows.length - 1];
  if (!headerRow) return;
  const headers: string[] = [];
  for (const cell of Array.from(headerRow.cells)) {
    for (let span = 0; span < cell.colSpan; span++) headers.push(headerWords(cell));
  }
  const bodies = [...Array.from(table.tBodies), ...(table.tFoot ? [table.tFoot] : [])];
  for (const body of bodies) {
    for (const row of Array.from(body.rows)) {
      let column = 0;
      for (const cell of Array.from(row.cells)) {
        const whole = cell.colSpan >= headers.length;
        const wanted = whole ? 'whole' : column === 0 ? 'title' : 'value';
        if (cell.dataset['card'] !== wanted) cell.dataset['card'] = wanted;
        const words = wanted === 'value' ? (headers[column] ?? '') : '';
        if (cell.dataset['label'] !== words) cell.dataset['label'] = words;
        column += cell.colSpan;
      }
    }
  }
}
