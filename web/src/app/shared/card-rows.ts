import { afterNextRender, DestroyRef, Directive, ElementRef, inject } from '@angular/core';

/**
 * On a phone a table too wide to read becomes a list of cards (styles.scss, `.al-card-rows`): each
 * row a card, its first cell the title, every other cell beside its column's header. The headers are
 * copied onto the cells as `data-label`, and again whenever rows or header texts change.
 */
@Directive({
  selector: 'table[alCardRows]',
  host: { class: 'al-card-rows' },
})
export class CardRows {
  constructor() {
    const table = inject<ElementRef<HTMLTableElement>>(ElementRef).nativeElement;
    const label = () => labelCells(table);
    const observer = new MutationObserver(label);
    afterNextRender(() => {
      label();
      // Only rows and texts: the labels this writes are attributes, so they do not call it again.
      observer.observe(table, { childList: true, subtree: true, characterData: true });
    });
    inject(DestroyRef).onDestroy(() => observer.disconnect());
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
