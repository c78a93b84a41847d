import { ChangeDetectionStrategy, Component, computed, effect, inject, input, linkedSignal, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatListModule } from '@angular/material/list';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTooltipModule } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import type { DaylightResult, DaylightZoneKind, Skylight, SpaceRecord, WindowOpening } from '../../core/api/api-types';
import { WriteFailure, fieldErrors } from '../../shared/write-failure';
import { areaFigure, formatArea, formatLength, unitLabels, wattsFigure } from '../../shared/format';
import type { HasUnsavedChanges } from '../../shared/unsaved-changes';
import { ProjectStore } from '../workspace/project-store';
import { WorkspaceApi } from '../workspace/workspace-api';
import { DaylightPlan, zoneNames } from './daylight-plan';
import { fieldMessage } from '../../shared/field-message';
import { fillOpenings, openingsForm, openingsValue, skylightForm, windowForm, type OpeningsForm, type Room } from './openings-form';
import { askToDiscard } from '../../shared/confirm-dialog';
import { MeasureInput } from '../../shared/measure-input';
import { SpacePicker } from '../../shared/space-picker';
import { RevisionMarker } from '../../shared/revision-marker';

/** Windows and skylights per space, the daylight zones they make, and whether daylight-responsive control is required. */
@Component({
  selector: 'al-daylight-page',
  imports: [
    RevisionMarker,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatListModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSlideToggleModule,
    MatTooltipModule,
    RouterLink,
    DaylightPlan,
    MeasureInput,
    SpacePicker,
  ],
  templateUrl: './daylight-page.html',
  styleUrl: './daylight-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DaylightPage implements HasUnsavedChanges {
  protected readonly store = inject(ProjectStore);
  private readonly api = inject(WorkspaceApi);
  private readonly dialogs = inject(MatDialog);
  private readonly failure = inject(WriteFailure);

  /** The space to open, from `?space=`. */
  readonly space = input<string>();

  protected readonly withOpeningsOnly = signal(false);
  protected readonly saving = signal(false);
  protected readonly serverErrors = signal<Record<string, string>>({});
  protected readonly updating = computed(() => this.store.results().status !== 'ready');
  protected readonly labels = computed(() => unitLabels(this.store.units()));
  protected readonly figures = { watts: wattsFigure, area: areaFigure };
  protected readonly format = { area: formatArea, length: formatLength };

  /** ", 2 skylights" after the window count; nothing without skylights. */
  protected skylightWords(count: number): string {
    return count === 0 ? '' : `, ${count} skylight${count === 1 ? '' : 's'}`;
  }
  protected readonly fieldMessage = fieldMessage;
  protected readonly walls = ['north', 'east', 'south', 'west'] as const;

  protected zoneCards(
    daylight: DaylightResult,
  ): { kind: DaylightZoneKind; name: string; area: string; watts: string; required: boolean; what: string }[] {
    return [
      {
        kind: 'primary-sidelit',
        name: zoneNames['primary-sidelit'],
        area: daylight.primarySidelitArea,
        watts: daylight.primarySidelitW,
        required: daylight.sidelightingControlRequired,
        what: 'Sidelighting control',
      },
      {
        kind: 'secondary-sidelit',
        name: zoneNames['secondary-sidelit'],
        area: daylight.secondarySidelitArea,
        watts: daylight.secondarySidelitW,
        required: daylight.secondarySidelightingControlRequired,
        what: 'Separate secondary control',
      },
      {
        kind: 'toplit',
        name: zoneNames.toplit,
        area: daylight.toplitArea,
        watts: daylight.toplitW,
        required: daylight.toplightingControlRequired,
        what: 'Toplighting control',
      },
    ];
  }

  protected readonly rows = computed(() =>
    this.store.spaces().map((space) => ({
      space,
      openings: space.windows.length + space.skylights.length,
      result: this.store.resultBySpace().get(space.id),
    })),
  );
  protected readonly visibleRows = computed(() => (this.withOpeningsOnly() ? this.rows().filter((row) => row.openings > 0) : this.rows()));
  /** The engineer's choice; follows `?space=` when the link changes, and survives results arriving. */
  private readonly chosenId = linkedSignal<string | undefined, string | null>({
    source: this.space,
    computation: (space, previous) => space ?? previous?.value ?? null,
  });
  protected readonly selectedId = computed(
    () => this.chosenId() ?? (this.rows().find((row) => row.openings > 0) ?? this.rows()[0])?.space.id ?? null,
  );
  protected readonly selected = computed(() => this.rows().find((row) => row.space.id === this.selectedId()) ?? null);
  /** The stored record only: changes when another space is chosen or this one is saved, not when results arrive. */
  protected readonly selectedSpace = computed(() => this.store.spaces().find((space) => space.id === this.selectedId()) ?? null);
  protected readonly room = computed<Room>(() => {
    const space = this.selectedSpace();
    const dimension = (text: string | undefined) => (text === undefined || text === '' ? null : Number(text));
    return { length: dimension(space?.length), width: dimension(space?.width) };
  });

  /** One form for the page, filled again for each space (`resetForm`). */
  protected readonly form: OpeningsForm = openingsForm(() => this.room(), [], []);
  /** The stored record the form started from: its version goes with the save. */
  private formBase: SpaceRecord | null = null;
  /** The form's last change (a value, its validity, dirty or pristine): the plan and the buttons follow it. */
  private readonly formEvent = toSignal(this.form.events);

  /** What the plan draws: the openings being edited where they are valid, else the saved ones. */
  protected readonly drawn = computed(() => {
    this.formEvent();
    const space = this.selectedSpace();
    if (!space) return { windows: [] as WindowOpening[], skylights: [] as Skylight[] };
    if (!this.form.dirty) return { windows: space.windows, skylights: space.skylights };
    const value = openingsValue(this.form);
    return {
      windows: value.windows.filter((_, index) => this.form.controls.windows.at(index).valid),
      skylights: value.skylights.filter((_, index) => this.form.controls.skylights.at(index).valid),
    };
  });
  protected readonly dirty = computed(() => {
    this.formEvent();
    return this.form.dirty;
  });

  constructor() {
    // A different space, or a fresh copy of this one from the service, starts the form again;
    // unsaved edits of the same space are kept, and saving them against the copy they started
    // from reports someone else's change rather than overwriting it.
    effect(() => {
      const space = this.selectedSpace();
      untracked(() => {
        if (space && this.formBase?.id === space.id && this.form.dirty) return;
        this.resetForm(space);
      });
    });
    // The design locked (submitted for review) or unlocked (returned) while the page is open.
    effect(() => {
      const canEdit = this.store.canEdit();
      untracked(() => (canEdit ? this.form.enable() : this.form.disable()));
    });
  }

  hasUnsavedChanges(): boolean {
    return this.store.canEdit() && this.form.dirty;
  }

  protected select(spaceId: string): void {
    if (!this.form.dirty) this.chosenId.set(spaceId);
    else
      askToDiscard(this.dialogs, 'The changes to the windows and skylights of this space are not saved.').subscribe(
        (discard) => discard && this.chosenId.set(spaceId),
      );
  }

  protected addWindow(): void {
    this.form.controls.windows.push(windowForm(() => this.room()));
    this.form.markAsDirty();
  }

  protected addSkylight(): void {
    this.form.controls.skylights.push(skylightForm(() => this.room()));
    this.form.markAsDirty();
  }

  protected removeWindow(index: number): void {
    this.form.controls.windows.removeAt(index);
    this.form.markAsDirty();
  }

  protected removeSkylight(index: number): void {
    this.form.controls.skylights.removeAt(index);
    this.form.markAsDirty();
  }

  protected discard(): void {
    this.resetForm(this.selectedSpace());
  }

  protected save(space: SpaceRecord): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.serverErrors.set({});
    const version = this.formBase?.id === space.id ? this.formBase.version : space.version;
    this.failure.save(this.api.patchSpace(projectId, space.id, version, openingsValue(this.form)), {
      saving: this.saving,
      form: this.form,
      saved: (saved) => this.store.upsertSpace(saved),
      // The fields take what they can, and the message still names every problem.
      refused: (error) => {
        this.serverErrors.set(fieldErrors(error));
        return false;
      },
      reload: () => this.reload(space.id),
    });
  }

  private reload(spaceId: string): void {
    const projectId = this.store.projectId();
    if (!projectId) return;
    this.api.spaces(projectId).subscribe((spaces) => {
      const fresh = spaces.find((space) => space.id === spaceId);
      if (fresh) {
        this.form.markAsPristine();
        this.store.upsertSpace(fresh);
      }
    });
  }

  private resetForm(space: SpaceRecord | null): void {
    this.formBase = space;
    fillOpenings(this.form, () => this.room(), space?.windows ?? [], space?.skylights ?? []);
    if (this.store.canEdit()) this.form.enable();
    else this.form.disable();
    this.serverErrors.set({});
  }
}
