import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { merge, type Observable } from 'rxjs';
import type { BuildingAreaTypeView, ComplianceMethod, SpaceRecord, SpaceTypeView, UnitSystem } from '../../core/api/api-types';
import { placeServerErrors, WriteFailure } from '../../shared/write-failure';
import { formatDensity, unitLabels } from '../../shared/format';
import { InUnits } from '../../shared/in-units';
import { VerifyBadge } from '../../shared/verify-badge';
import { WorkspaceApi } from '../workspace/workspace-api';
import { densityInUnits, spaceInput } from './space-rows';
import { fieldMessage } from '../../shared/field-message';
import { canConfirmUnlit, emptySpace, fillSpace, requireGeometry, requireHeightForFormula, spaceForm, spaceFromForm } from './space-form';
import { SpaceTypePicker } from './space-type-picker';
import { askToDiscard } from '../../shared/confirm-dialog';
import { MeasureInput } from '../../shared/measure-input';

export interface SpaceEditorData {
  projectId: string;
  space: SpaceRecord | null;
  method: ComplianceMethod;
  units: UnitSystem;
  spaceTypes: readonly SpaceTypeView[];
  buildingAreaTypes: readonly BuildingAreaTypeView[];
  levels: readonly string[];
  /** Called when a 409 asks for a fresh copy. */
  reload: () => void;
}

/** Adds or edits one space; saves through the service and closes with the stored record. */
@Component({
  selector: 'al-space-editor',
  imports: [
    ReactiveFormsModule,
    MatAutocompleteModule,
    MatButtonModule,
    MatCheckboxModule,
    MatDialogModule,
    MatExpansionModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    SpaceTypePicker,
    InUnits,
    VerifyBadge,
    MeasureInput,
  ],
  templateUrl: './space-editor.html',
  // A hint or message that wraps pushes the next row down instead of running over its label.
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  styleUrl: './space-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpaceEditor {
  protected readonly data = inject<SpaceEditorData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<SpaceEditor, SpaceRecord>>(MatDialogRef);
  private readonly dialogs = inject(MatDialog);
  private readonly api = inject(WorkspaceApi);
  private readonly writeFailure = inject(WriteFailure);
  protected readonly form = this.filledForm();
  protected readonly labels = unitLabels(this.data.units);
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly fieldMessage = fieldMessage;
  private readonly levelText = toSignal(this.form.controls.level.valueChanges, { initialValue: this.form.controls.level.value });
  /** The project's levels that start like what is typed, so a new space joins an existing group. */
  protected readonly levels = computed(() => {
    const typed = this.levelText().trim().toLocaleLowerCase();
    return this.data.levels.filter((level) => level.toLocaleLowerCase().startsWith(typed) && level.toLocaleLowerCase() !== typed);
  });
  protected readonly offerUnlit = canConfirmUnlit(this.data.space);
  /** Under the building area method, a control space type stored apart from the space type keeps its own picker. */
  protected readonly separateControlType =
    this.data.method === 'building-area' && this.data.space !== null && this.form.controls.controlSpaceType.value !== '';
  /** The other method's type is folded away; opened when the service has something to say about it. */
  protected readonly otherMethodOpen = signal(false);
  private readonly otherType = toSignal(this.otherControl().valueChanges, { initialValue: this.otherControl().value });
  protected readonly otherTypeLabel = computed(() => {
    const key = this.otherType();
    if (!key) return 'not chosen';
    const types: readonly { key: string; label: string }[] =
      this.data.method === 'building-area' ? this.data.spaceTypes : this.data.buildingAreaTypes;
    return types.find((type) => type.key === key)?.label ?? key;
  });

  constructor() {
    requireGeometry(this.form, this.data.space);
    // The service checks the size a type's name carries against the area, the like rooms and the height: a refusal it
    // put beside the type goes once any of them changes, so the next save asks the service again.
    const { area, rooms, ceilingHeight, spaceType } = this.form.controls;
    merge(area.valueChanges, rooms.valueChanges, ceilingHeight.valueChanges).subscribe(() => {
      if (spaceType.hasError('server')) spaceType.updateValueAndValidity();
    });
    if (this.data.method === 'space-by-space') requireHeightForFormula(this.form, this.data.spaceTypes);
    this.dialog.disableClose = true;
    this.dialog.backdropClick().subscribe(() => this.cancel());
    this.dialog.keydownEvents().subscribe((event) => {
      if (event.key === 'Escape') this.cancel();
    });
  }

  private filledForm() {
    const form = spaceForm(this.data.method);
    if (this.data.space) fillSpace(form, this.data.space);
    return form;
  }

  /** The field the other method reads: the building area type here, or the space type under the building area method. */
  private otherControl() {
    return this.data.method === 'building-area' ? this.form.controls.spaceType : this.form.controls.buildingAreaType;
  }

  hasUnsavedChanges(): boolean {
    return this.form.dirty;
  }

  protected density(type: BuildingAreaTypeView): string {
    return formatDensity(densityInUnits(type.lpdWPerFt2, this.data.units), this.data.units);
  }

  protected cancel(): void {
    if (!this.form.dirty) this.dialog.close();
    else askToDiscard(this.dialogs, 'The changes to this space are not saved.').subscribe((discard) => discard && this.dialog.close());
  }

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { projectId, space } = this.data;
    const body = spaceFromForm(this.form, space ? spaceInput(space) : emptySpace());
    const request: Observable<SpaceRecord> = space
      ? this.api.replaceSpace(projectId, space.id, space.version, body)
      : this.api.createSpace(projectId, body);
    this.failure.set(null);
    this.writeFailure.save(request, {
      saving: this.saving,
      form: this.form,
      saved: (saved) => this.dialog.close(saved),
      invalid: (error) => {
        const unplaced = placeServerErrors(error.details, (path) => this.form.get(path));
        if (this.otherControl().invalid) this.otherMethodOpen.set(true);
        this.failure.set(unplaced.length ? unplaced.map((detail) => detail.message).join(' ') : null);
      },
      reload: () => {
        this.dialog.close();
        this.data.reload();
      },
    });
  }
}
