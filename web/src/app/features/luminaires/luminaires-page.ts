import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  Injector,
  input,
  linkedSignal,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource, takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import { MatTabsModule } from '@angular/material/tabs';
import { MatTooltipModule } from '@angular/material/tooltip';
import { ActivatedRoute, Router } from '@angular/router';
import { catchError, concatMap, EMPTY, groupBy, mergeMap, Subject, tap } from 'rxjs';
import type { LuminaireGroup, LuminaireTypeRecord, SpaceRecord } from '../../core/api/api-types';
import { WriteFailure } from '../../shared/write-failure';
import { formatLength, formatWatts, ratedWattsFigure } from '../../shared/format';
import { phoneScreen, screenMatches } from '../../shared/media-queries';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { CountGrid, type CountEdit } from './count-grid';
import { CutSheetApi } from './cut-sheet-api';
import { groupsOf, withCount } from './luminaire-counts';
import { LuminaireTypeEditor, type LuminaireTypeEditorData } from './luminaire-type-editor';
import { basisLabels, useLabels } from './luminaire-type-form';
import { SpaceCounts } from './space-counts';
import { CardRows } from '../../shared/card-rows';

interface CountWrite {
  spaceId: string;
  groups: (space: SpaceRecord) => LuminaireGroup[];
}

@Component({
  selector: 'al-luminaires-page',
  imports: [CardRows, MatButtonModule, MatIconModule, MatTableModule, MatTabsModule, MatTooltipModule, CountGrid, SpaceCounts],
  templateUrl: './luminaires-page.html',
  styleUrl: './luminaires-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LuminairesPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly dialogs = inject(MatDialog);
  private readonly writeFailure = inject(WriteFailure);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly injector = inject(Injector);
  private readonly writes = new Subject<CountWrite>();
  private readonly cutSheetApi = inject(CutSheetApi);

  /** The tab to show, from `?tab=counts`: links from other pages open the counts, and a reload keeps the tab. */
  readonly tab = input<string>();
  /** The space whose counts panel to open, from `?space=`. */
  readonly space = input<string>();

  protected readonly columns = computed(() => [
    'tag',
    'description',
    'product',
    'source',
    'inputWatts',
    'use',
    'basis',
    'cutSheet',
    ...(this.store.canEdit() ? ['actions'] : []),
  ]);
  /** The cut sheets on file, read for every member: each row links its type's file. */
  protected readonly cutSheets = rxResource({
    params: () => this.store.projectId() ?? undefined,
    stream: ({ params }) => this.cutSheetApi.list(params),
  });
  protected readonly cutSheetOf = computed(
    () => new Map((this.cutSheets.hasValue() ? this.cutSheets.value() : []).map((sheet) => [sheet.luminaireTypeId, sheet])),
  );
  protected readonly useLabels = useLabels;
  protected readonly basisLabels = basisLabels;
  protected readonly ratedWatts = ratedWattsFigure;
  protected readonly saving = signal<ReadonlySet<string>>(new Set());
  protected readonly tabIndex = linkedSignal<number>(() => (this.tab() === 'counts' ? 1 : 0));
  protected readonly selectedId = linkedSignal<string | undefined, string | null>({
    source: this.space,
    computation: (space, previous) => space ?? previous?.value ?? null,
  });
  protected readonly selected = computed(() => this.store.spaces().find((space) => space.id === this.selectedId()) ?? null);
  private readonly openPanel = viewChild(SpaceCounts);
  private readonly countGrid = viewChild(CountGrid);
  /** On a phone a space's counts panel takes the place of the list of spaces until it closes. */
  protected readonly phone = screenMatches(phoneScreen);

  constructor() {
    // Writes to one space go one after another, each with the version the previous one returned.
    this.writes
      .pipe(
        groupBy((write) => write.spaceId),
        mergeMap((perSpace) => perSpace.pipe(concatMap((write) => this.write(write)))),
        takeUntilDestroyed(),
      )
      .subscribe();
  }

  hasUnsavedChanges(): boolean {
    return (
      this.dialogs.openDialogs.some((dialog) => (dialog.componentInstance as Partial<HasUnsavedChanges>).hasUnsavedChanges?.() ?? false) ||
      (this.openPanel()?.hasUnsavedChanges() ?? false)
    );
  }

  protected showTab(index: number): void {
    this.tabIndex.set(index);
    this.keepInUrl({ tab: index === 1 ? 'counts' : null });
  }

  protected openSpace(space: SpaceRecord): void {
    this.selectedId.set(space.id);
    if (this.phone()) afterNextRender(() => this.openPanel()?.focusHeading(), { injector: this.injector });
  }

  protected closePanel(): void {
    const closed = this.selectedId();
    this.selectedId.set(null);
    this.keepInUrl({ space: null });
    // Back to the space's card, where the panel was opened.
    if (this.phone() && closed) afterNextRender(() => this.countGrid()?.reveal(closed), { injector: this.injector });
  }

  /** The URL follows the page's state without a new history entry, so a reload shows the same view. */
  private keepInUrl(queryParams: Record<string, string | null>): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams, queryParamsHandling: 'merge', replaceUrl: true });
  }

  protected basisText(type: LuminaireTypeRecord): string {
    const parts: string[] = [basisLabels[type.basis].replace(/ \(.*\)$/, '')];
    if (type.length) parts.push(formatLength(type.length, this.store.units()));
    if (type.limitWatts) parts.push(`limit ${formatWatts(type.limitWatts)}`);
    return parts.join(' · ');
  }

  protected driverText(type: LuminaireTypeRecord): string {
    return [type.driver, type.voltage].filter(Boolean).join(' · ');
  }

  protected useText(type: LuminaireTypeRecord): string {
    return useLabels[type.use];
  }

  protected editType(type: LuminaireTypeRecord | null): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    const data: LuminaireTypeEditorData = { projectId, type, units: this.store.units(), reload: () => this.reloadTypes() };
    this.dialogs
      .open<LuminaireTypeEditor, LuminaireTypeEditorData, LuminaireTypeRecord>(LuminaireTypeEditor, {
        data,
        width: '680px',
        maxWidth: '96vw',
      })
      .afterClosed()
      .subscribe((saved) => {
        // The editor attaches and removes cut sheets by itself, saved or not.
        this.cutSheets.reload();
        if (!saved) return;
        this.store.upsertLuminaireType(saved);
        if (type && type.tag !== saved.tag) this.reloadSpaces();
      });
  }

  /**
   * No question first: the snackbar's Undo brings the type back with its id. Its cut sheet leaves
   * the file store with it, so the words say so and Undo says to upload it again.
   */
  protected deleteType(type: LuminaireTypeRecord): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    const hadCutSheet = this.cutSheetOf().has(type.id);
    this.writeFailure.save(this.api.deleteLuminaireType(projectId, type.id, type.version), {
      saved: () => {
        this.store.removeLuminaireType(type.id);
        this.snackBar
          .open(`Luminaire type “${type.tag}” deleted${hadCutSheet ? ', with its cut sheet' : ''}`, 'Undo', { duration: 8000 })
          .onAction()
          .subscribe(() =>
            this.api.restoreLuminaireType(projectId, type.id).subscribe({
              next: (restored) => {
                this.store.upsertLuminaireType(restored);
                if (!hadCutSheet) return;
                this.cutSheets.reload();
                this.snackBar.open(`Type “${type.tag}” is back without its cut sheet: upload the cut sheet again.`, 'OK', {
                  duration: 10000,
                });
              },
              error: (error: unknown) => this.writeFailure.report(error, () => this.reloadTypes()),
            }),
          );
      },
      reload: () => this.reloadTypes(),
    });
  }

  protected changeCount(edit: CountEdit): void {
    this.writes.next({ spaceId: edit.space.id, groups: (space) => withCount(groupsOf(space), edit.tag, edit.count) });
  }

  protected saveGroups(space: SpaceRecord, groups: LuminaireGroup[]): void {
    this.writes.next({ spaceId: space.id, groups: () => groups });
  }

  private write(write: CountWrite) {
    const projectId = this.store.projectId();
    const space = this.store.spaces().find((candidate) => candidate.id === write.spaceId);
    if (!projectId || !space) return EMPTY;
    this.saving.update((ids) => new Set(ids).add(space.id));
    const done = () =>
      this.saving.update((ids) => {
        const next = new Set(ids);
        next.delete(space.id);
        return next;
      });
    return this.api.patchSpace(projectId, space.id, space.version, { luminaires: write.groups(space) }).pipe(
      tap((saved) => {
        done();
        this.store.upsertSpace(saved);
      }),
      catchError((error: unknown) => {
        done();
        this.writeFailure.report(error, () => this.reloadSpaces());
        return EMPTY;
      }),
    );
  }

  private reloadTypes(): void {
    const projectId = this.store.projectId();
    if (projectId) this.api.luminaireTypes(projectId).subscribe((types) => this.store.replaceLuminaireTypes(types));
  }

  private reloadSpaces(): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.spaces(projectId).subscribe((spaces) => {
      this.store.replaceSpaces(spaces);
    });
  }
}
