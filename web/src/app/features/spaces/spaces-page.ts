import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { ActivatedRoute, Router } from '@angular/router';
import type { SpaceRecord } from '../../core/api/api-types';
import { WriteFailure } from '../../shared/write-failure';
import { ProblemList } from '../../shared/problem-list';
import { UnverifiedCount } from '../../shared/unverified-count';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { SpaceEditor, type SpaceEditorData } from './space-editor';
import { SpaceImportDialog, type SpaceImportData, type SpaceImportOutcome } from './space-import-dialog';
import { spaceInput } from './space-rows';
import { SpaceTable } from './space-table';

@Component({
  selector: 'al-spaces-page',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, ProblemList, SpaceTable, UnverifiedCount],
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
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);

  protected readonly method = computed(() => this.store.project()?.method ?? 'space-by-space');
  protected readonly resultsStatus = computed(() => this.store.results().status);
  protected readonly totalArea = computed(() => this.store.spaces().reduce((sum, space) => sum + Number(space.area), 0));
  private readonly levels = computed(() => [
    ...new Set(
      this.store
        .spaces()
        .map((space) => space.level)
        .filter((level): level is string => !!level),
    ),
  ]);
  /** The unverified types the spaces use under the project's method: each carries a "verify" mark in the table. */
  protected readonly unverifiedTypes = computed(() => {
    const tables = this.store.tables();
    const types: readonly { key: string; verified: boolean }[] =
      (this.method() === 'building-area' ? tables?.buildingAreaTypes : tables?.spaceTypes) ?? [];
    const unverified = new Set(types.filter((type) => !type.verified).map((type) => type.key));
    const used = this.store.spaces().map((space) => (this.method() === 'building-area' ? space.buildingAreaType : space.spaceType));
    return [...new Set(used.filter((key): key is string => key !== undefined && unverified.has(key)))];
  });

  /** A space to open, from `?space=` (links from the Results page and from problems), and the field to start in. */
  readonly space = input<string>();
  readonly field = input<string>();

  constructor() {
    effect(() => {
      const id = this.space();
      const tables = this.store.tables();
      const target = this.store.spaces().find((space) => space.id === id);
      if (!id || !tables || !target || !this.store.canEdit()) return;
      const field = this.field();
      untracked(() => {
        if (this.dialogs.openDialogs.length === 0) this.openEditor(target, field);
        // Opened once: the link's parameters go, so saving the space does not open it again.
        void this.router.navigate([], {
          relativeTo: this.route,
          queryParams: { space: null, field: null },
          queryParamsHandling: 'merge',
          replaceUrl: true,
        });
      });
    });
  }

  hasUnsavedChanges(): boolean {
    return this.dialogs.openDialogs.some(
      (dialog) => (dialog.componentInstance as Partial<HasUnsavedChanges>).hasUnsavedChanges?.() ?? false,
    );
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
    this.writeFailure.save(this.api.createSpace(projectId, { ...spaceInput(space), name: `${space.name} (copy)` }), {
      saved: (copy) => {
        this.store.upsertSpace(copy);
        this.snackBar.open(`“${copy.name}” added`, undefined, { duration: 3000 });
      },
      reload: () => this.reloadSpaces(),
    });
  }

  protected remove(space: SpaceRecord): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.writeFailure.save(this.api.deleteSpace(projectId, space.id, space.version), {
      saved: () => {
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
      reload: () => this.reloadSpaces(),
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
        this.store.upsertSpaces(created);
        if (luminaireTypes > 0) this.api.luminaireTypes(projectId).subscribe((types) => this.store.replaceLuminaireTypes(types));
        const types = luminaireTypes > 0 ? ` with ${luminaireTypes} luminaire type${luminaireTypes === 1 ? '' : 's'}` : '';
        this.snackBar.open(`${created.length} space${created.length === 1 ? '' : 's'} imported${types}`, undefined, { duration: 4000 });
      });
  }

  private openEditor(space: SpaceRecord | null, field?: string): void {
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
      .open<SpaceEditor, SpaceEditorData, SpaceRecord>(SpaceEditor, {
        data,
        width: '720px',
        maxWidth: '96vw',
        // A link from a problem starts in the field to fix; a field the form does not show leaves focus on the first one.
        autoFocus: field && /^[a-zA-Z]+$/.test(field) ? `[formcontrolname="${field}"]` : 'first-tabbable',
      })
      .afterClosed()
      .subscribe((saved) => {
        if (saved) this.store.upsertSpace(saved);
      });
  }

  private reloadSpaces(): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.spaces(projectId).subscribe((spaces) => {
      this.store.replaceSpaces(spaces);
    });
  }
}
