import { ChangeDetectionStrategy, Component, computed, input, output, type OnInit } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { startWith } from 'rxjs';
import type {
  EditionId,
  ExteriorApplicationInput,
  ExteriorApplicationRecord,
  ExteriorApplicationView,
  ExteriorExemptionReason,
  ProvidedControl,
  UnitSystem,
} from '../../core/api/api-types';
import { editionFamilyOf, exteriorExemptions } from '../../../../../contract/editions';
import { InUnits } from '../../shared/in-units';
import type { MeasureKind } from '../../shared/measure';
import { MeasureInput } from '../../shared/measure-input';
import { inProjectUnits } from '../../shared/unit-words';
import { quantityUnit } from './exterior-groups';

export const exteriorControls = [
  { strategy: 'exterior-daylight-off', label: 'Off in daylight', hint: 'Photosensor or astronomical time switch' },
  { strategy: 'exterior-setback', label: 'Night setback', hint: 'Reduced late at night or after no activity' },
  { strategy: 'exterior-facade-landscape-off', label: 'Facade and landscape off', hint: 'Off through the late-night hours' },
] as const;

const decimalPattern = /^(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

function nonNegative(control: AbstractControl<string>): ValidationErrors | null {
  const text = control.value.trim();
  if (text === '') return { required: true };
  if (text.startsWith('-')) return { negative: true };
  return decimalPattern.test(text) ? null : { decimal: true };
}

function controlGroup(current: ProvidedControl | undefined) {
  return new FormGroup({
    provided: new FormControl(current?.provided ?? false, { nonNullable: true }),
    device: new FormControl(current?.device ?? '', { nonNullable: true }),
  });
}

/** Exempt watts: a number above zero, and at most the installed watts (they are part of them). */
function exemptWattsValidator(control: AbstractControl<string>): ValidationErrors | null {
  const problem = nonNegative(control);
  if (problem) return problem;
  if (Number(control.value) === 0) return { zero: true };
  const installed = (control.parent?.get('installedWatts')?.value as string | undefined)?.trim() ?? '';
  return decimalPattern.test(installed) && Number(control.value) > Number(installed) ? { moreThanInstalled: true } : null;
}

/** Add or change one lighted exterior application: which one (from the edition's catalogue), how much of it, its installed watts, any exempt part, and controls. */
@Component({
  selector: 'al-exterior-application-form',
  imports: [
    ReactiveFormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    InUnits,
    MeasureInput,
  ],
  templateUrl: './exterior-application-form.html',
  styleUrl: './exterior-application-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ExteriorApplicationForm implements OnInit {
  readonly catalogue = input.required<readonly ExteriorApplicationView[]>();
  readonly record = input<ExteriorApplicationRecord | null>(null);
  /** Keys already used by other applications of the project (each is listed once). */
  readonly usedKeys = input<readonly string[]>([]);
  readonly units = input<UnitSystem>('ip');
  readonly lightingZone = input<number | null>(null);
  /** The project's edition: its family's list of exterior exemptions is offered. */
  readonly edition = input<EditionId | null>(null);
  readonly saving = input(false);
  readonly save = output<ExteriorApplicationInput>();
  readonly cancelled = output<void>();

  protected readonly form = new FormGroup({
    key: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    description: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(500)] }),
    quantity: new FormControl('', { nonNullable: true, validators: [nonNegative] }),
    installedWatts: new FormControl('', { nonNullable: true, validators: [nonNegative] }),
    exempt: new FormControl(false, { nonNullable: true }),
    exemptWatts: new FormControl({ value: '', disabled: true }, { nonNullable: true, validators: [exemptWattsValidator] }),
    exemptReason: new FormControl<ExteriorExemptionReason | ''>(
      { value: '', disabled: true },
      { nonNullable: true, validators: [Validators.required] },
    ),
    exemptNote: new FormControl({ value: '', disabled: true }, { nonNullable: true, validators: [Validators.maxLength(1000)] }),
    controls: new FormGroup({
      'exterior-daylight-off': controlGroup(undefined),
      'exterior-setback': controlGroup(undefined),
      'exterior-facade-landscape-off': controlGroup(undefined),
    }),
  });
  protected readonly exteriorControls = exteriorControls;
  /** Edits typed but not yet saved. */
  hasUnsavedChanges(): boolean {
    return this.form.dirty;
  }

  /** Exempt lighting is recorded: its watts, reason and note are asked for. */
  protected readonly exempt = toSignal(this.form.controls.exempt.valueChanges, { initialValue: false });
  /** The edition family's exemptions (from memory: the page says so). */
  protected readonly exemptions = computed(() => {
    const edition = this.edition();
    return edition ? exteriorExemptions[editionFamilyOf(edition)] : [];
  });

  private readonly key = toSignal(this.form.controls.key.valueChanges.pipe(startWith('')), { initialValue: '' });

  protected readonly choices = computed(() => {
    const used = new Set(this.usedKeys());
    const own = this.record()?.key;
    return this.catalogue().filter((entry) => !entry.isBaseSiteAllowance && (!used.has(entry.key) || entry.key === own));
  });
  protected readonly chosen = computed(() => this.catalogue().find((entry) => entry.key === (this.key() || this.record()?.key)) ?? null);
  protected readonly unit = computed(() => {
    const chosen = this.chosen();
    return chosen ? quantityUnit(chosen.unit, this.units()) : 'quantity';
  });
  /** An area or a length may be typed on site notation ("120 ft * 40 ft", "250 m"); locations, doors and the like as plain arithmetic ("4 * 3"). */
  protected readonly measureKind = computed<MeasureKind>(() => {
    const unit = this.chosen()?.unit;
    return unit === 'W/ft2' || unit === 'W/ft²' ? 'area' : unit === 'W/ft' ? 'length' : 'number';
  });
  protected readonly rate = computed(() => {
    const chosen = this.chosen();
    const zone = this.lightingZone();
    // The tables hold IP rates; an SI project reads them in its own units.
    return chosen && zone !== null
      ? `${inProjectUnits(`${chosen.allowanceByZone[String(zone)] ?? '—'} ${chosen.unit.replace('ft2', 'ft²')}`, this.units())} in zone ${zone}`
      : null;
  });

  ngOnInit(): void {
    const record = this.record();
    if (!record) return;
    this.form.patchValue({
      key: record.key,
      description: record.description,
      quantity: record.quantity,
      installedWatts: record.installedWatts,
    });
    if (record.exemptReason !== undefined) {
      this.form.patchValue({
        exempt: true,
        exemptWatts: record.exemptWatts ?? '',
        exemptReason: record.exemptReason,
        exemptNote: record.exemptNote ?? '',
      });
    }
    for (const { strategy } of exteriorControls) {
      const current = record.controls.find((control) => control.strategy === strategy);
      this.form.controls.controls.controls[strategy].setValue({ provided: current?.provided ?? false, device: current?.device ?? '' });
    }
  }

  constructor() {
    // The exempt fields count only while exempt lighting is recorded.
    this.form.controls.exempt.valueChanges.subscribe((exempt) => {
      for (const control of [this.form.controls.exemptWatts, this.form.controls.exemptReason, this.form.controls.exemptNote]) {
        if (exempt) control.enable({ emitEvent: false });
        else control.disable({ emitEvent: false });
      }
    });
    this.form.controls.installedWatts.valueChanges.subscribe(() =>
      this.form.controls.exemptWatts.updateValueAndValidity({ emitEvent: false }),
    );
  }

  protected submit(): void {
    this.form.markAllAsTouched();
    if (this.form.invalid) return;
    const value = this.form.getRawValue();
    const kept = (this.record()?.controls ?? []).filter(
      (control) => !exteriorControls.some((known) => known.strategy === control.strategy),
    );
    const controls: ProvidedControl[] = [
      ...kept,
      ...exteriorControls
        .map(({ strategy }) => ({ strategy, ...value.controls[strategy] }))
        .filter((control) => control.provided)
        .map((control) =>
          control.device.trim()
            ? { strategy: control.strategy, provided: true, device: control.device.trim() }
            : { strategy: control.strategy, provided: true },
        ),
    ];
    const exempt =
      value.exempt && value.exemptReason !== ''
        ? {
            exemptWatts: value.exemptWatts.trim(),
            exemptReason: value.exemptReason,
            ...(value.exemptNote.trim() ? { exemptNote: value.exemptNote.trim() } : {}),
          }
        : {};
    this.save.emit({
      key: value.key,
      description: value.description.trim(),
      quantity: value.quantity.trim(),
      installedWatts: value.installedWatts.trim(),
      ...exempt,
      controls,
    });
  }

  protected message(control: AbstractControl): string {
    if (control.hasError('required')) return 'Required.';
    const measure: unknown = control.getError('measure');
    if (typeof measure === 'string') return measure;
    if (control.hasError('negative')) return 'Must not be negative.';
    if (control.hasError('decimal')) return 'Enter a number.';
    if (control.hasError('zero')) return 'Enter the watts of the exempt lighting, more than 0.';
    if (control.hasError('moreThanInstalled')) return 'The exempt watts are part of the installed watts, so they cannot be more.';
    return '';
  }
}
