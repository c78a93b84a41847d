import { ScrollingModule } from '@angular/cdk/scrolling';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { of, switchMap, type Observable } from 'rxjs';
import type { ImportAlias, SpaceRecord, UnitSystem } from '../../core/api/api-types';
import { ApiError } from '../../core/http/api-error';
import { unitLabels } from '../../shared/format';
import { WorkspaceApi } from '../workspace/workspace-api';
import {
  aliasesToRemember,
  attachServerProblems,
  attachServerTypeProblems,
  buildRows,
  buildTypeRows,
  countField,
  fieldLabel,
  guessMapping,
  guessTypeMapping,
  importFields,
  isTypeSheet,
  parseSpreadsheet,
  templateCsv,
  templateXlsx,
  typeFields,
  unknownNames,
  type ColumnMapping,
  type ImportContext,
  type ImportField,
  type ImportRow,
  type ImportSheet,
  type ImportTypeRow,
  type TypeField,
  type TypeKind,
  type TypeMapping,
} from './space-import';
import { foldTypeName, type TypeOption } from './space-import-match';
import { SpaceImportNamePicker } from './space-import-name-picker';
import { askToConfirm } from '../../shared/confirm-dialog';

export interface SpaceImportData extends ImportContext {
  projectId: string;
  units: UnitSystem;
  /** The tags of the project's luminaire types: count columns may name them, and imported types may not reuse them. */
  luminaireTags: readonly string[];
}

/** What an import created: the page adds the spaces and reloads the types. */
export interface SpaceImportOutcome {
  spaces: SpaceRecord[];
  luminaireTypes: number;
}

type Stage = 'choose' | 'map' | 'preview';

interface MatchedName {
  kind: TypeKind;
  name: string;
  key: string;
}

const kindLabels: Record<TypeKind, string> = { spaceType: 'Space type', buildingAreaType: 'Building area type' };

/** Spreadsheet → column mapping → checked preview, with unknown type names matched → one all-or-nothing write. */
@Component({
  selector: 'al-space-import-dialog',
  imports: [
    ScrollingModule,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatProgressBarModule,
    MatSelectModule,
    SpaceImportNamePicker,
  ],
  templateUrl: './space-import-dialog.html',
  styleUrl: './space-import-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceImportDialog {
  protected readonly data = inject<SpaceImportData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<SpaceImportDialog, SpaceImportOutcome>>(MatDialogRef);
  private readonly dialogs = inject(MatDialog);
  private readonly api = inject(WorkspaceApi);

  protected readonly typeFields = typeFields;
  protected readonly kindLabels = kindLabels;
  protected readonly fieldLabel = fieldLabel;
  protected readonly areaUnit = unitLabels(this.data.units).area;
  protected readonly stage = signal<Stage>('choose');
  protected readonly fileName = signal('');
  protected readonly sheets = signal<ImportSheet[]>([]);
  protected readonly mapping = signal<ColumnMapping>([]);
  /** Which sheet holds the luminaire types (an index into the sheets), if any. */
  protected readonly typesSheet = signal<number | null>(null);
  protected readonly typeMapping = signal<TypeMapping>([]);
  protected readonly aliases = signal<ImportAlias[]>([]);
  protected readonly matchedNames = signal<MatchedName[]>([]);
  protected readonly serverRows = signal<ImportRow[] | null>(null);
  protected readonly serverTypeRows = signal<ImportTypeRow[] | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected readonly table = computed(() => this.sheets()[0]?.table ?? []);
  protected readonly headers = computed(() => this.table()[0] ?? []);
  protected readonly sample = computed(() => this.table()[1] ?? []);
  protected readonly typeTable = computed(() => {
    const index = this.typesSheet();
    return index === null ? [] : (this.sheets()[index]?.table ?? []);
  });
  protected readonly typeHeaders = computed(() => this.typeTable()[0] ?? []);
  protected readonly typeSample = computed(() => this.typeTable()[1] ?? []);
  private readonly projectTags = new Set(this.data.luminaireTags);
  protected readonly typeRows = computed(
    () =>
      this.serverTypeRows() ?? (this.typesSheet() === null ? [] : buildTypeRows(this.typeTable(), this.typeMapping(), this.projectTags)),
  );
  /** ", 3 luminaire types" after the space count, when the workbook brings types. */
  protected readonly typeCountWords = computed(() => {
    const count = this.typeRows().length;
    return count === 0 ? '' : `, ${count} luminaire type${count === 1 ? '' : 's'}`;
  });
  /** Tags a count column may name: the project's and the imported ones. */
  protected readonly tags = computed(() => [
    ...this.data.luminaireTags,
    ...this.typeRows()
      .map((row) => row.type.tag)
      .filter((tag) => tag !== '' && !this.projectTags.has(tag)),
  ]);
  protected readonly fields = computed<ImportField[]>(() => [...importFields.map((entry) => entry.field), ...this.tags().map(countField)]);
  private readonly chosen = computed(() => {
    const byKind: Record<TypeKind, Map<string, string>> = { spaceType: new Map(), buildingAreaType: new Map() };
    for (const match of this.matchedNames()) byKind[match.kind].set(foldTypeName(match.name), match.key);
    return byKind;
  });
  protected readonly rows = computed(
    () =>
      this.serverRows() ??
      buildRows(this.table(), this.mapping(), { ...this.data, aliases: this.aliases(), chosen: this.chosen(), tags: new Set(this.tags()) }),
  );
  /** Names still unknown, and those matched in this dialog (so a chosen match can be changed again). */
  protected readonly namesToMatch = computed(() => {
    const open = unknownNames(this.rows());
    const matched = this.matchedNames().map((match) => ({
      kind: match.kind,
      name: match.name,
      rows: this.rows().filter((row) => foldTypeName(row.values[match.kind] ?? '') === foldTypeName(match.name)).length,
    }));
    return [...matched, ...open];
  });
  /** Rows with problems first, so they are what the preview opens on. */
  protected readonly orderedRows = computed(() =>
    [...this.rows()].sort((a, b) => Number(b.problems.length > 0) - Number(a.problems.length > 0) || a.line - b.line),
  );
  protected readonly problemCount = computed(
    () => this.rows().filter((row) => row.problems.length > 0).length + this.typeRows().filter((row) => row.problems.length > 0).length,
  );
  protected readonly missingName = computed(() => !this.mapping().includes('name') || !this.mapping().includes('area'));
  protected readonly otherSheets = computed(() =>
    this.sheets()
      .slice(1)
      .map((sheet, index) => ({ index: index + 1, name: sheet.name })),
  );
  protected readonly typeSheetIncomplete = computed(() => this.typesSheet() !== null && !isTypeSheet(this.typeMapping()));
  protected readonly trackRow = (_index: number, row: ImportRow) => row.line;
  /** The key of an import whose outcome is unknown (no answer, or a server failure), with the rows it sent. */
  private unanswered: { key: string; rows: readonly ImportRow[] } | null = null;

  constructor() {
    this.dialog.disableClose = true;
    // Without the remembered names the import still works; the engineer then matches them again.
    this.api
      .importAliases(this.data.projectId)
      .subscribe({ next: (aliases) => this.aliases.set(aliases), error: () => this.aliases.set([]) });
  }

  protected async choose(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    this.failure.set(null);
    this.busy.set(true);
    try {
      const sheets = await parseSpreadsheet(file);
      if ((sheets[0]?.table.length ?? 0) < 2) throw new Error('The first sheet needs a header row and at least one row of spaces.');
      this.fileName.set(file.name);
      this.sheets.set(sheets);
      const typesAt = sheets.findIndex((sheet, index) => index > 0 && isTypeSheet(guessTypeMapping(sheet.table[0] ?? [])));
      this.typesSheet.set(typesAt === -1 ? null : typesAt);
      this.typeMapping.set(typesAt === -1 ? [] : guessTypeMapping(sheets[typesAt]!.table[0]!));
      this.serverRows.set(null);
      this.serverTypeRows.set(null);
      this.matchedNames.set([]);
      this.mapping.set(guessMapping(sheets[0]!.table[0]!, this.data.method, this.tags()));
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

  protected chooseTypesSheet(index: number | null): void {
    this.typesSheet.set(index);
    this.typeMapping.set(index === null ? [] : guessTypeMapping(this.sheets()[index]?.table[0] ?? []));
    this.serverTypeRows.set(null);
  }

  protected mapTypeColumn(column: number, field: TypeField | null): void {
    this.typeMapping.update((mapping) => {
      const next = mapping.map((current) => (field !== null && current === field ? null : current));
      next[column] = field;
      return next;
    });
    this.serverTypeRows.set(null);
  }

  protected typesFor(kind: TypeKind): readonly TypeOption[] {
    return kind === 'spaceType' ? this.data.spaceTypes : this.data.buildingAreaTypes;
  }

  protected chosenKey(kind: TypeKind, name: string): string | null {
    return this.chosen()[kind].get(foldTypeName(name)) ?? null;
  }

  protected matchName(kind: TypeKind, name: string, key: string): void {
    const folded = foldTypeName(name);
    this.matchedNames.update((matched) => [
      ...matched.filter((match) => match.kind !== kind || foldTypeName(match.name) !== folded),
      { kind, name, key },
    ]);
    this.serverRows.set(null);
  }

  protected problemText(row: { problems: readonly { message: string }[] }): string {
    return row.problems.map((problem) => problem.message).join(' ');
  }

  protected typeText(row: ImportRow): { label: string; from: string | null } {
    const kind: TypeKind = this.data.method === 'building-area' ? 'buildingAreaType' : 'spaceType';
    const match = row.matches[kind];
    const text = row.values[kind] ?? '';
    if (!match) return { label: text, from: null };
    return { label: match.label, from: match.kind === 'exact' ? null : text };
  }

  protected countsText(row: ImportRow): string {
    return row.space.luminaires.map((group) => `${group.tag} × ${group.count}`).join(', ');
  }

  protected commit(): void {
    if (this.problemCount() > 0) return;
    this.busy.set(true);
    this.failure.set(null);
    const rows = this.rows();
    const typeRows = this.typeRows();
    // Pressing Import again after the answer was lost sends the same key: the service then returns
    // the spaces that import may already have added instead of adding them a second time.
    const key = this.unanswered?.rows === rows ? this.unanswered.key : crypto.randomUUID();
    this.unanswered = null;
    const remember = aliasesToRemember(this.matchedNames(), this.aliases());
    const { projectId } = this.data;
    const remembered: Observable<unknown> = remember.length > 0 ? this.api.saveImportAliases(projectId, remember) : of(null);
    remembered
      .pipe(
        switchMap(() =>
          this.api.createSpaces(
            projectId,
            rows.map((row) => row.space),
            key,
            typeRows.map((row) => row.type),
          ),
        ),
      )
      .subscribe({
        next: (created) => this.dialog.close({ spaces: created, luminaireTypes: typeRows.length }),
        error: (error: unknown) => {
          this.busy.set(false);
          if (error instanceof ApiError && (error.status === 0 || error.status >= 500)) this.unanswered = { key, rows };
          if (
            error instanceof ApiError &&
            (error.status === 400 || (error.status === 409 && error.details.some((detail) => detail.path.startsWith('luminaireTypes.'))))
          ) {
            this.serverRows.set(attachServerProblems(rows, error.details));
            this.serverTypeRows.set(attachServerTypeProblems(typeRows, error.details));
            this.failure.set(`${error.message} Nothing was imported.`);
          } else {
            this.failure.set(error instanceof ApiError ? error.message : 'The spaces could not be imported.');
          }
        },
      });
  }

  protected close(): void {
    if (this.stage() === 'choose') this.dialog.close();
    else
      askToConfirm(this.dialogs, {
        title: 'Stop importing?',
        message: 'Nothing has been saved yet.',
        confirm: 'Stop importing',
        cancel: 'Keep importing',
      }).subscribe((stop) => stop && this.dialog.close());
  }

  protected downloadCsv(): void {
    this.download(new Blob([templateCsv()], { type: 'text/csv' }), 'allowlight-spaces-template.csv');
  }

  protected async downloadXlsx(): Promise<void> {
    const buffer = await templateXlsx();
    this.download(
      new Blob([buffer], { type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' }),
      'allowlight-spaces-template.xlsx',
    );
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
