import { labelCells } from './card-rows';

describe('the labels of a table read as cards', () => {
  it('puts each column header beside its cells, the first cell as the title, spans counted', () => {
    const table = document.createElement('table');
    // Invented rows; the headers as a results table writes them.
    table.innerHTML = `
      <thead><tr><th>Level</th><th>Area (ft²)</th><th>Allowance (W)</th><th><span class="visually-hidden">Actions</span></th></tr></thead>
      <tbody>
        <tr><th scope="row">Level 1</th><td>11,570</td><td>9,991</td><td><button>Edit</button></td></tr>
        <tr><td colspan="4">No level yet.</td></tr>
      </tbody>
      <tfoot><tr><th scope="row">Total</th><td colspan="2">21,591</td><td></td></tr></tfoot>`;
    labelCells(table);
    const cells = (row: number) =>
      Array.from(table.querySelectorAll('tbody tr, tfoot tr')[row]!.children).map(
        (cell) => `${(cell as HTMLElement).dataset['card']}:${(cell as HTMLElement).dataset['label']}`,
      );
    expect(cells(0)).toEqual(['title:', 'value:Area (ft²)', 'value:Allowance (W)', 'value:']);
    expect(cells(1)).toEqual(['whole:']);
    expect(cells(2)).toEqual(['title:', 'value:Area (ft²)', 'value:']);
  });
});
