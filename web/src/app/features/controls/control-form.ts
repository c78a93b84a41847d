import { FormControl, FormGroup, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { ControlExceptionReason, ProvidedControl } from '../../core/api/api-types';
import { ranges } from '../../shared/number-range';
import { quantityValidator } from '../spaces/space-form';

export type ProvisionMode = 'provided' | 'exception' | 'none';
export type AutoOn = '' | 'manual' | 'partial' | 'full';

export type ControlForm = FormGroup<{
  mode: FormControl<ProvisionMode>;
  device: FormControl<string>;
  timeoutMinutes: FormControl<string>;
  autoOn: FormControl<AutoOn>;
  zoneSize: FormControl<string>;
  reductionPercent: FormControl<string>;
  exceptionReason: FormControl<ControlExceptionReason | ''>;
  exceptionNote: FormControl<string>;
}>;

/** The service's decimal syntax (document.ts), without a sign: these values must not be negative. */
const decimalPattern = /^(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

export const nonNegativeDecimal: ValidatorFn = (control: AbstractControl<string>): ValidationErrors | null => {
  const value = control.value.trim();
  if (value === '') return null;
  if (value.startsWith('-')) return { negative: true };
  return decimalPattern.test(value) ? null : { decimal: true };
};

function whenMode(mode: ProvisionMode, check: (control: AbstractControl) => ValidationErrors | null): ValidatorFn {
  return (control) => ((control.parent?.value as { mode?: ProvisionMode } | undefined)?.mode === mode ? check(control) : null);
}

/** The notes the service requires, by reason, in its words (compliance/document.ts exceptionProblems). */
export const notesRequired: Partial<Record<ControlExceptionReason, string>> = {
  other: 'Say which exception is claimed.',
  'verified-not-required': 'Say where in the adopted code it was checked.',
};

/** As the service says: an "other" exception says which it is, and a check against the adopted code says where it was made. */
const noteRequired = whenMode('exception', (control) => {
  const reason = (control.parent?.value as { exceptionReason?: ControlExceptionReason | '' } | undefined)?.exceptionReason;
  const message = reason ? notesRequired[reason] : undefined;
  return message !== undefined && String(control.value).trim() === '' ? { note: message } : null;
});

/** The strategies whose check reads how far the lighting is reduced (automatic partial OFF, light reduction). */
export const reducingStrategies: ReadonlySet<string> = new Set(['automatic-partial-off', 'light-reduction']);

export function reducesLighting(strategy: string): boolean {
  return reducingStrategies.has(strategy);
}

/**
 * The form for one strategy's entry. `strategy` says which strategy it is for at the moment (the
 * panel for many spaces lets the engineer change it), so fields that strategy does not read are
 * neither checked nor sent.
 */
export function controlForm(current: ProvidedControl | undefined, strategy: () => string): ControlForm {
  const percent = quantityValidator(ranges.percent);
  const reductionRule = whenMode('provided', (control) => (reducesLighting(strategy()) ? percent(control) : null));
  const reasonRule = whenMode('exception', (control) => {
    if (control.value === '') return { required: true };
    return control.value === 'continuous-operation' && strategy() !== 'time-switch'
      ? { timeSwitchOnly: 'Continuous operation frees lighting from the time switch only.' }
      : null;
  });
  const mode: ProvisionMode = current?.provided ? 'provided' : current?.exceptionReason ? 'exception' : 'none';
  const form: ControlForm = new FormGroup({
    mode: new FormControl<ProvisionMode>(mode, { nonNullable: true }),
    device: new FormControl(current?.device ?? '', { nonNullable: true }),
    timeoutMinutes: new FormControl(current?.timeoutMinutes ?? '', { nonNullable: true, validators: [nonNegativeDecimal] }),
    autoOn: new FormControl<AutoOn>(current?.autoOn ?? '', { nonNullable: true }),
    zoneSize: new FormControl(current?.zoneSize ?? '', { nonNullable: true, validators: [nonNegativeDecimal] }),
    reductionPercent: new FormControl(current?.reductionPercent ?? '', { nonNullable: true, validators: [reductionRule] }),
    exceptionReason: new FormControl<ControlExceptionReason | ''>(current?.exceptionReason ?? '', {
      nonNullable: true,
      validators: [reasonRule],
    }),
    exceptionNote: new FormControl(current?.exceptionNote ?? '', { nonNullable: true, validators: [noteRequired] }),
  });
  const revalidate = () => {
    form.controls.reductionPercent.updateValueAndValidity({ emitEvent: false });
    form.controls.exceptionReason.updateValueAndValidity({ emitEvent: false });
    form.controls.exceptionNote.updateValueAndValidity({ emitEvent: false });
  };
  // The group's own valueChanges fires after its value holds the new mode and reason, which the rules read.
  form.valueChanges.subscribe(revalidate);
  revalidate();
  return form;
}

/** What to send for one strategy; `null` removes the strategy's entry (nothing provided, nothing claimed). */
export function providedControl(strategy: string, value: ReturnType<ControlForm['getRawValue']>): ProvidedControl | null {
  const text = (field: string) => (field.trim() === '' ? undefined : field.trim());
  if (value.mode === 'none') return null;
  if (value.mode === 'exception') {
    const control: ProvidedControl = { strategy, provided: false, exceptionReason: value.exceptionReason as ControlExceptionReason };
    const note = text(value.exceptionNote);
    return note === undefined ? control : { ...control, exceptionNote: note };
  }
  const control: ProvidedControl = { strategy, provided: true };
  const device = text(value.device);
  const timeout = text(value.timeoutMinutes);
  const zoneSize = text(value.zoneSize);
  const reduction = reducesLighting(strategy) ? text(value.reductionPercent) : undefined;
  if (device !== undefined) control.device = device;
  if (timeout !== undefined) control.timeoutMinutes = timeout;
  if (value.autoOn !== '') control.autoOn = value.autoOn;
  if (zoneSize !== undefined) control.zoneSize = zoneSize;
  if (reduction !== undefined) control.reductionPercent = reduction;
  return control;
}

/** The space's controls with one strategy's entry replaced (or removed), the others kept as they were. */
export function replaceControl(controls: readonly ProvidedControl[], strategy: string, next: ProvidedControl | null): ProvidedControl[] {
  const others = controls.filter((control) => control.strategy !== strategy);
  return next === null ? others : [...others, next];
}
