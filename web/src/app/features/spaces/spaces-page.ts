import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import type { SpaceRecord } from '../../core/api/api-types';
import { WriteFailure } from '../../shared/conflict';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { SpaceEditor, type SpaceEditorData } from './space-editor';
import { SpaceImportDialog, type SpaceImportData, type SpaceImportOutcome } from './space-import-dialog';
import { spaceInput } from './space-rows';
import { SpaceTable } from './space-table';

@Component({
  selector: 'al-spaces-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, SpaceTable],
  templateUrl: './spaces-page.html',
  styleUrl: './spaces-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpacesPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly dialogs = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly writeFailure = inject(WriteFailure);

  protected readonly method = computed(() => this.store.project()?.method ?? 'space-by-space');
  protected readonly resultsStatus = computed(() => this.store.results().status);
  protected readonly totalArea = computed(() => this.store.spaces().reduce((sum, space) => sum + Number(space.area), 0));
  private readonly levels = computed(() => [...new Set(this.store.spaces().map((space) => space.level).filter((level): level is string => !!level))]);

  hasUnsavedChanges(): boolean {
    return this.dialogs.openDialogs.some((dialog) => (dialog.componentInstance as Partial<HasUnsavedChanges>).hasUnsavedChanges?.() ?? false);
  }

  protected add(): void {
    this.openEditor(null);
  }

  protected edit(space: SpaceRecord): void {
    this.openEditor(space);
  }

  protected duplicate(space: SpaceRecord): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.createSpace(projectId, { ...spaceInput(space), name: `${space.name} (copy)` }).subscribe({
      next: (copy) => {
        this.store.upsertSpace(copy);
        this.snackBar.open(`“${copy.name}” added`, undefined, { duration: 3000 });
      },
      error: (error: unknown) => this.writeFailure.report(error, () => this.reloadSpaces()),
    });
  }

  protected remove(space: SpaceRecord): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.deleteSpace(projectId, space.id, space.version).subscribe({
      next: () => {
        this.store.removeSpace(space.id);
        this.snackBar
          .open(`Space “${space.name}” deleted`, 'Undo', { duration: 8000 })
          .onAction()
          .subscribe(() =>
            // Brought back with its id, so its history and the counts that name it carry on.
            this.api.restoreSpace(projectId, space.id).subscribe({
              next: (restored) => this.store.upsertSpace(restored),
              error: (error: unknown) => this.writeFailure.report(error, () => this.reloadSpaces()),
            }),
          );
      },
      error: (error: unknown) => this.writeFailure.report(error, () => this.reloadSpaces()),
    });
  }

  protected import(): void {
    const projectId = this.store.projectId();
    const tables = this.store.tables();
    if (!projectId || !tables) return;
    const data: SpaceImportData = {
      projectId,
      units: this.store.units(),
      method: this.method(),
      spaceTypes: tables.spaceTypes,
      buildingAreaTypes: tables.buildingAreaTypes,
      luminaireTags: this.store.luminaireTypes().map((type) => type.tag),
    };
    this.dialogs
      .open<SpaceImportDialog, SpaceImportData, SpaceImportOutcome>(SpaceImportDialog, { data, width: '960px', maxWidth: '96vw' })
      .afterClosed()
      .subscribe((outcome) => {
        if (!outcome?.spaces.length) return;
        const { spaces: created, luminaireTypes } = outcome;
        this.store.spaces.update((spaces) => [...spaces, ...created]);
        if (luminaireTypes > 0) this.api.luminaireTypes(projectId).subscribe((types) => this.store.luminaireTypes.set(types));
        this.store.refreshResults();
        const types = luminaireTypes > 0 ? ` with ${luminaireTypes} luminaire type${luminaireTypes === 1 ? '' : 's'}` : '';
        this.snackBar.open(`${created.length} space${created.length === 1 ? '' : 's'} imported${types}`, undefined, { duration: 4000 });
      });
  }

  private openEditor(space: SpaceRecord | null): void {
    const projectId = this.store.projectId();
    const tables = this.store.tables();
    if (!projectId || !tables) return;
    const data: SpaceEditorData = {
      projectId,
      space,
      method: this.method(),
      units: this.store.units(),
      spaceTypes: tables.spaceTypes,
      buildingAreaTypes: tables.buildingAreaTypes,
      levels: this.levels(),
      reload: () => this.reloadSpaces(),
    };
    this.dialogs
      .open<SpaceEditor, SpaceEditorData, SpaceRecord>(SpaceEditor, { data, width: '720px', maxWidth: '96vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.store.upsertSpace(saved);
      });
  }

  private reloadSpaces(): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.spaces(projectId).subscribe((spaces) => {
      this.store.spaces.set(spaces);
      this.store.refreshResults();
    });
  }
}
