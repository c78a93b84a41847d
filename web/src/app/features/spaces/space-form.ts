import { FormControl, FormGroup, Validators, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { ComplianceMethod, SpaceInput, SpaceRecord, SpaceTypeView } from '../../core/api/api-types';
import { numberProblem, ranges, type NumberRange } from '../../shared/number-range';

export function quantityValidator(range: NumberRange): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const raw = control.value ?? '';
    if (raw.trim() === '') return null;
    const problem = numberProblem(raw, range);
    return problem ? { quantity: problem } : null;
  };
}

export function spaceForm(method: ComplianceMethod) {
  return new FormGroup({
    name: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
    level: new FormControl('', { nonNullable: true }),
    // Both types stay on the record whatever the method; each method requires its own.
    spaceType: new FormControl('', { nonNullable: true, validators: method === 'space-by-space' ? [Validators.required] : [] }),
    buildingAreaType: new FormControl('', { nonNullable: true, validators: method === 'building-area' ? [Validators.required] : [] }),
    controlSpaceType: new FormControl('', { nonNullable: true }),
    area: new FormControl('', { nonNullable: true, validators: [Validators.required, quantityValidator(ranges.area)] }),
    ceilingHeight: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.height)] }),
    length: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.length)] }),
    width: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.length)] }),
    rooms: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.rooms)] }),
    unlit: new FormControl(false, { nonNullable: true }),
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
    return type?.lpdFormula && control.value.trim() === ''
      ? { heightNeeded: "The atrium's allowance depends on its height: give the ceiling height." }
      : null;
  });
  form.controls.spaceType.valueChanges.subscribe(() => {
    ceiling.updateValueAndValidity();
    if (ceiling.invalid) ceiling.markAsTouched();
  });
}

/** Only a space without luminaires can be confirmed unlit; one with luminaires is lit whatever its flag says. */
export function canConfirmUnlit(space: SpaceRecord | null): boolean {
  return (space?.luminaires.length ?? 0) === 0;
}

/**
 * Under the building area method the space type sets the controls unless a separate control space
 * type is stored. A control type alone (or the same as the space type) is the space type, so the
 * form shows one picker; only a control type that differs from a stored space type stays apart.
 */
export function fillSpace(form: SpaceForm, space: SpaceRecord): void {
  const spaceType = space.spaceType ?? '';
  const control = space.controlSpaceType ?? '';
  const separateControl = control !== '' && spaceType !== '' && control !== spaceType;
  form.reset({
    name: space.name,
    level: space.level ?? '',
    spaceType: spaceType || control,
    buildingAreaType: space.buildingAreaType ?? '',
    controlSpaceType: separateControl ? control : '',
    area: space.area,
    ceilingHeight: space.ceilingHeight ?? '',
    length: space.length ?? '',
    width: space.width ?? '',
    rooms: space.rooms ?? '',
    unlit: space.unlit ?? false,
  });
}

function optional(value: string): string | undefined {
  const trimmed = value.trim();
  return trimmed === '' ? undefined : trimmed;
}

/** The form over a base space (the stored one, or an empty one): children stay as they are, and so do both types. */
export function spaceFromForm(form: SpaceForm, base: SpaceInput): SpaceInput {
  const value = form.getRawValue();
  return {
    ...base,
    name: value.name.trim(),
    level: optional(value.level),
    spaceType: optional(value.spaceType),
    buildingAreaType: optional(value.buildingAreaType),
    controlSpaceType: optional(value.controlSpaceType),
    area: value.area.trim(),
    ceilingHeight: optional(value.ceilingHeight),
    length: optional(value.length),
    width: optional(value.width),
    // One room is what an entry stands for without the field, so 1 is not stored.
    rooms: optional(value.rooms) === undefined || Number(value.rooms) === 1 ? undefined : value.rooms.trim(),
    unlit: base.luminaires.length === 0 ? value.unlit || undefined : base.unlit,
  };
}

export function emptySpace(): SpaceInput {
  return { name: '', area: '', luminaires: [], controls: [], windows: [], skylights: [] };
}
