import { FormControl, FormGroup, Validators, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { ComplianceMethod, SpaceInput, SpaceRecord, SpaceTypeView } from '../../core/api/api-types';

/** The service's decimal rule (compliance/document.ts): a plain or exponent decimal, here also > 0. */
export const decimalPattern = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

export function quantityProblem(raw: string, bound: 'positive' | 'non-negative', integer = false): string | null {
  const text = raw.trim();
  if (!decimalPattern.test(text)) return `"${text}" is not a decimal number.`;
  const value = Number(text);
  if (value < 0) return 'Must not be negative.';
  if (bound === 'positive' && value === 0) return 'Must be greater than zero.';
  if (integer && !Number.isInteger(value)) return 'Must be a whole number.';
  return null;
}

export function quantityValidator(bound: 'positive' | 'non-negative', integer = false): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const raw = control.value ?? '';
    if (raw.trim() === '') return null;
    const problem = quantityProblem(raw, bound, integer);
    return problem ? { quantity: problem } : null;
  };
}

export function spaceForm(method: ComplianceMethod) {
  return new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    level: new FormControl('', { nonNullable: true }),
    spaceType: new FormControl('', { nonNullable: true, validators: method === 'space-by-space' ? [Validators.required] : [] }),
    buildingAreaType: new FormControl('', { nonNullable: true, validators: method === 'building-area' ? [Validators.required] : [] }),
    controlSpaceType: new FormControl('', { nonNullable: true }),
    area: new FormControl('', { nonNullable: true, validators: [Validators.required, quantityValidator('positive')] }),
    ceilingHeight: new FormControl('', { nonNullable: true, validators: [quantityValidator('positive')] }),
    length: new FormControl('', { nonNullable: true, validators: [quantityValidator('positive')] }),
    width: new FormControl('', { nonNullable: true, validators: [quantityValidator('positive')] }),
  });
}

export type SpaceForm = ReturnType<typeof spaceForm>;

/** Daylight geometry needs the room's size, as the service's geometry checks say. */
export function requireGeometry(form: SpaceForm, space: SpaceRecord | null): void {
  const openings = (space?.windows.length ?? 0) + (space?.skylights.length ?? 0) > 0;
  if (openings) {
    form.controls.length.addValidators(Validators.required);
    form.controls.width.addValidators(Validators.required);
  }
  if ((space?.skylights.length ?? 0) > 0) form.controls.ceilingHeight.addValidators(Validators.required);
}

/**
 * Under the space-by-space method a space type whose allowance grows with height (an atrium row of
 * 90.1-2013/2016 or IECC 2018) needs the ceiling height, as the service's document check says.
 */
export function requireHeightForFormula(form: SpaceForm, spaceTypes: readonly SpaceTypeView[]): void {
  const ceiling = form.controls.ceilingHeight;
  ceiling.addValidators((control: AbstractControl<string>): ValidationErrors | null => {
    const type = spaceTypes.find((candidate) => candidate.key === form.controls.spaceType.value);
    return type?.lpdFormula && control.value.trim() === '' ? { heightNeeded: "The atrium's allowance depends on its height: give the ceiling height." } : null;
  });
  form.controls.spaceType.valueChanges.subscribe(() => {
    ceiling.updateValueAndValidity();
    if (ceiling.invalid) ceiling.markAsTouched();
  });
}

export function fillSpace(form: SpaceForm, space: SpaceRecord): void {
  form.reset({
    name: space.name,
    level: space.level ?? '',
    spaceType: space.spaceType ?? '',
    buildingAreaType: space.buildingAreaType ?? '',
    controlSpaceType: space.controlSpaceType ?? '',
    area: space.area,
    ceilingHeight: space.ceilingHeight ?? '',
    length: space.length ?? '',
    width: space.width ?? '',
  });
}

function optional(value: string): string | undefined {
  const trimmed = value.trim();
  return trimmed === '' ? undefined : trimmed;
}

/** The form over a base space (the stored one, or an empty one): children stay as they are. */
export function spaceFromForm(form: SpaceForm, method: ComplianceMethod, base: SpaceInput): SpaceInput {
  const value = form.getRawValue();
  const byMethod =
    method === 'building-area'
      ? { spaceType: undefined, buildingAreaType: optional(value.buildingAreaType), controlSpaceType: optional(value.controlSpaceType) }
      : { spaceType: optional(value.spaceType), buildingAreaType: undefined, controlSpaceType: undefined };
  return {
    ...base,
    name: value.name.trim(),
    level: optional(value.level),
    ...byMethod,
    area: value.area.trim(),
    ceilingHeight: optional(value.ceilingHeight),
    length: optional(value.length),
    width: optional(value.width),
  };
}

export function emptySpace(): SpaceInput {
  return { name: '', area: '', luminaires: [], controls: [], windows: [], skylights: [] };
}

export function fieldMessage(control: AbstractControl, label: string): string {
  const errors = control.errors ?? {};
  if (errors['required']) return `${label} is required.`;
  const message = Object.values(errors).find((value): value is string => typeof value === 'string');
  return message ?? `Check the ${label.toLocaleLowerCase()}.`;
}
