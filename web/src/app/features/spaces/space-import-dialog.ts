import { ScrollingModule } from '@angular/cdk/scrolling';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { SpaceRecord, UnitSystem } from '../../core/api/api-types';
import { unitLabels } from '../../shared/format';
import { ApiError } from '../../core/http/api-error';
import { WorkspaceApi } from '../workspace/workspace-api';
import {
  attachServerProblems,
  buildRows,
  guessMapping,
  importFields,
  parseSpreadsheet,
  templateCsv,
  templateXlsx,
  type ColumnMapping,
  type ImportContext,
  type ImportField,
  type ImportRow,
  type ImportTable,
} from './space-import';

export interface SpaceImportData extends ImportContext {
  projectId: string;
  units: UnitSystem;
}

type Stage = 'choose' | 'map' | 'preview';

/** Spreadsheet → column mapping → checked preview → one all-or-nothing write. */
@Component({
  selector: 'al-space-import-dialog',
  imports: [ScrollingModule, MatButtonModule, MatDialogModule, MatFormFieldModule, MatIconModule, MatProgressBarModule, MatSelectModule],
  templateUrl: './space-import-dialog.html',
  styleUrl: './space-import-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceImportDialog {
  protected readonly data = inject<SpaceImportData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<SpaceImportDialog, SpaceRecord[]>>(MatDialogRef);
  private readonly api = inject(WorkspaceApi);

  protected readonly fields = importFields.filter(({ field }) => (this.data.method === 'building-area' ? true : field !== 'buildingAreaType'));
  protected readonly areaUnit = unitLabels(this.data.units).area;
  protected readonly stage = signal<Stage>('choose');
  protected readonly fileName = signal('');
  protected readonly table = signal<ImportTable>([]);
  protected readonly mapping = signal<ColumnMapping>([]);
  protected readonly serverRows = signal<ImportRow[] | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected readonly headers = computed(() => this.table()[0] ?? []);
  protected readonly sample = computed(() => this.table()[1] ?? []);
  protected readonly rows = computed(() => this.serverRows() ?? buildRows(this.table(), this.mapping(), this.data));
  /** Rows with problems first, so they are what the preview opens on. */
  protected readonly orderedRows = computed(() => [...this.rows()].sort((a, b) => Number(b.problems.length > 0) - Number(a.problems.length > 0) || a.line - b.line));
  protected readonly problemCount = computed(() => this.rows().filter((row) => row.problems.length > 0).length);
  protected readonly missingName = computed(() => !this.mapping().includes('name') || !this.mapping().includes('area'));
  protected readonly trackRow = (_index: number, row: ImportRow) => row.line;
  /** The key of an import whose outcome is unknown (no answer, or a server failure), with the rows it sent. */
  private unanswered: { key: string; rows: readonly ImportRow[] } | null = null;

  constructor() {
    this.dialog.disableClose = true;
  }

  protected async choose(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.failure.set(null);
    this.busy.set(true);
    try {
      const table = await parseSpreadsheet(file);
      if (table.length < 2) throw new Error('The sheet needs a header row and at least one row of spaces.');
      this.fileName.set(file.name);
      this.table.set(table);
      this.mapping.set(guessMapping(table[0]!, this.data.method));
      this.serverRows.set(null);
      this.stage.set('map');
    } catch (error) {
      this.failure.set(error instanceof Error ? error.message : 'The file could not be read.');
    } finally {
      this.busy.set(false);
    }
  }

  protected mapColumn(column: number, field: ImportField | null): void {
    this.mapping.update((mapping) => {
      const next = mapping.map((current) => (field !== null && current === field ? null : current));
      next[column] = field;
      return next;
    });
    this.serverRows.set(null);
  }

  protected problemText(row: ImportRow): string {
    return row.problems.map((problem) => problem.message).join(' ');
  }

  protected commit(): void {
    if (this.problemCount() > 0) return;
    this.busy.set(true);
    this.failure.set(null);
    const rows = this.rows();
    // Pressing Import again after the answer was lost sends the same key: the service then returns
    // the spaces that import may already have added instead of adding them a second time.
    const key = this.unanswered?.rows === rows ? this.unanswered.key : crypto.randomUUID();
    this.unanswered = null;
    this.api.createSpaces(this.data.projectId, rows.map((row) => row.space), key).subscribe({
      next: (created) => this.dialog.close(created),
      error: (error: unknown) => {
        this.busy.set(false);
        if (error instanceof ApiError && (error.status === 0 || error.status >= 500)) this.unanswered = { key, rows };
        if (error instanceof ApiError && error.status === 400) {
          this.serverRows.set(attachServerProblems(rows, error.details));
          this.failure.set(`${error.message} Nothing was imported.`);
        } else {
          this.failure.set(error instanceof ApiError ? error.message : 'The spaces could not be imported.');
        }
      },
    });
  }

  protected close(): void {
    if (this.stage() === 'choose' || window.confirm('Stop importing? Nothing has been saved.')) this.dialog.close();
  }

  protected downloadCsv(): void {
    this.download(new Blob([templateCsv()], { type: 'text/csv' }), 'allowlight-spaces-template.csv');
  }

  protected async downloadXlsx(): Promise<void> {
    const buffer = await templateXlsx();
    this.download(new Blob([buffer], { type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' }), 'allowlight-spaces-template.xlsx');
  }

  private download(blob: Blob, name: string): void {
    const url = URL.createObjectURL(blob);
    const link = document.createElement('a');
    link.href = url;
    link.download = name;
    link.click();
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }
}
