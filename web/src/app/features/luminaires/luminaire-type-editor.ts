import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import type { Observable } from 'rxjs';
import type { LuminaireTypeRecord, UnitSystem } from '../../core/api/api-types';
import { placeServerErrors, WriteFailure } from '../../shared/write-failure';
import { unitLabels } from '../../shared/format';
import { fieldMessage } from '../../shared/field-message';
import { WorkspaceApi } from '../workspace/workspace-api';
import { basisLabels, fillLuminaireType, luminaireTypeForm, luminaireTypeFromForm, useLabels } from './luminaire-type-form';
import { askToDiscard } from '../../shared/confirm-dialog';
import { CutSheetPanel } from './cut-sheet-panel';

type CatalogueField = 'manufacturer' | 'catalogNumber' | 'lightSource' | 'driver' | 'voltage';

/** The schedule's product columns: printed in the package, not used by the calculation. */
const catalogueFields: readonly { name: CatalogueField; label: string; hint?: string; double?: boolean }[] = [
  { name: 'manufacturer', label: 'Manufacturer' },
  { name: 'catalogNumber', label: 'Catalogue number', double: true },
  { name: 'lightSource', label: 'Light source', hint: 'e.g. LED, 4000 K' },
  { name: 'driver', label: 'Driver', hint: 'e.g. 0–10 V dimming' },
  { name: 'voltage', label: 'Voltage', hint: 'e.g. 120–277 V' },
];

export interface LuminaireTypeEditorData {
  projectId: string;
  type: LuminaireTypeRecord | null;
  units: UnitSystem;
  reload: () => void;
}

@Component({
  selector: 'al-luminaire-type-editor',
  imports: [
    CutSheetPanel,
    ReactiveFormsModule,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
  ],
  templateUrl: './luminaire-type-editor.html',
  // A hint or message that wraps pushes the next row down instead of running over its label.
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  styles: `
    .fields {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(180px, 1fr));
      align-items: start;
      gap: 12px 16px;
      padding-top: 8px !important;
    }
    .wide {
      grid-column: 1 / -1;
    }
    .double {
      grid-column: span 2;
    }
    .group-heading {
      margin: 8px 0 0;
      font: var(--mat-sys-title-small);
      color: var(--mat-sys-on-surface-variant);
    }
    @media (max-width: 599px) {
      .double {
        grid-column: 1 / -1;
      }
    }
    .failure {
      display: flex;
      align-items: center;
      gap: 8px;
      color: var(--mat-sys-error);
    }
    .note {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LuminaireTypeEditor {
  protected readonly data = inject<LuminaireTypeEditorData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<LuminaireTypeEditor, LuminaireTypeRecord>>(MatDialogRef);
  private readonly dialogs = inject(MatDialog);
  private readonly api = inject(WorkspaceApi);
  private readonly writeFailure = inject(WriteFailure);
  protected readonly form = luminaireTypeForm();
  protected readonly labels = unitLabels(this.data.units);
  protected readonly useLabels = useLabels;
  protected readonly basisLabels = basisLabels;
  protected readonly uses = Object.keys(useLabels) as (keyof typeof useLabels)[];
  protected readonly bases = Object.keys(basisLabels) as (keyof typeof basisLabels)[];
  protected readonly fieldMessage = fieldMessage;
  protected readonly catalogueFields = catalogueFields;
  protected readonly saving = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly use = toSignal(this.form.controls.use.valueChanges, { initialValue: this.form.controls.use.value });
  protected readonly basis = toSignal(this.form.controls.basis.valueChanges, { initialValue: this.form.controls.basis.value });

  constructor() {
    if (this.data.type) fillLuminaireType(this.form, this.data.type);
    this.dialog.disableClose = true;
    this.dialog.backdropClick().subscribe(() => this.cancel());
    this.dialog.keydownEvents().subscribe((event) => {
      if (event.key === 'Escape') this.cancel();
    });
  }

  hasUnsavedChanges(): boolean {
    return this.form.dirty;
  }

  protected cancel(): void {
    if (!this.form.dirty) this.dialog.close();
    else
      askToDiscard(this.dialogs, 'The changes to this luminaire type are not saved.').subscribe(
        (discard) => discard && this.dialog.close(),
      );
  }

  protected save(): void {
    this.form.updateValueAndValidity();
    const invalid = Object.values(this.form.controls).some((control) => control.invalid);
    if (invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const { projectId, type } = this.data;
    const body = luminaireTypeFromForm(this.form);
    const request: Observable<LuminaireTypeRecord> = type
      ? this.api.replaceLuminaireType(projectId, type.id, type.version, body)
      : this.api.createLuminaireType(projectId, body);
    this.failure.set(null);
    this.writeFailure.save(request, {
      saving: this.saving,
      form: this.form,
      saved: (saved) => this.dialog.close(saved),
      invalid: (error) => {
        const unplaced = placeServerErrors(error.details, (path) => this.form.get(path));
        this.failure.set(unplaced.length ? unplaced.map((detail) => detail.message).join(' ') : null);
      },
      // A duplicate tag is a 409 with the tag path: that belongs beside the field, not in a reload offer.
      refused: (error) => {
        if (error.status !== 409 || !error.details.some((detail) => detail.path === 'tag')) return false;
        this.form.controls.tag.setErrors({ server: error.message });
        this.form.controls.tag.markAsTouched();
        return true;
      },
      reload: () => {
        this.dialog.close();
        this.data.reload();
      },
    });
  }
}
