import { FormControl, FormGroup, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import type { LuminaireTypeInput, LuminaireTypeRecord, LuminaireUse, WattageBasis } from '../../core/api/api-types';
import { ranges } from '../../shared/number-range';
import { quantityValidator } from '../spaces/space-form';

export const useLabels: Record<LuminaireUse, string> = {
  general: 'General lighting',
  decorative: 'Decorative',
  display: 'Display',
  exempt: 'Exempt',
};

export const basisLabels: Record<WattageBasis, string> = {
  rated: 'Rated input watts',
  'line-voltage-track': 'Line-voltage track (by length or limiter)',
  'low-voltage-track': 'Low-voltage track (transformer rating)',
  'current-limited': 'Current-limited circuit (limiter rating)',
};

/** The cross-field rules of the service's document check (exempt reason, track inputs). */
function luminaireRules(group: AbstractControl): ValidationErrors | null {
  const form = group as LuminaireTypeForm;
  const { use, exemptReason, basis, length, limitWatts } = form.controls;
  const set = (control: AbstractControl, key: string, message: string | null) => {
    const errors = { ...(control.errors ?? {}) };
    if (message) errors[key] = message;
    else delete errors[key];
    control.setErrors(Object.keys(errors).length ? errors : null, { emitEvent: false });
  };
  set(
    exemptReason,
    'rule',
    use.value === 'exempt' && exemptReason.value.trim() === '' ? 'Exempt lighting needs the reason it is exempt.' : null,
  );
  set(
    length,
    'rule',
    basis.value === 'line-voltage-track' && length.value.trim() === '' && limitWatts.value.trim() === ''
      ? 'Line-voltage track needs its length (or the current limiter rating).'
      : null,
  );
  const needsLimit = basis.value === 'low-voltage-track' || basis.value === 'current-limited';
  set(
    limitWatts,
    'rule',
    needsLimit && limitWatts.value.trim() === ''
      ? basis.value === 'low-voltage-track'
        ? 'Low-voltage track counts at its transformer rating: give it here.'
        : 'A current-limited circuit counts at the limiter rating: give it here.'
      : null,
  );
  return null;
}

export function luminaireTypeForm() {
  return new FormGroup(
    {
      tag: new FormControl('', { nonNullable: true, validators: [Validators.required] }),
      description: new FormControl('', { nonNullable: true }),
      inputWatts: new FormControl('', { nonNullable: true, validators: [Validators.required, quantityValidator(ranges.luminaireWatts)] }),
      use: new FormControl<LuminaireUse>('general', { nonNullable: true }),
      exemptReason: new FormControl('', { nonNullable: true }),
      basis: new FormControl<WattageBasis>('rated', { nonNullable: true }),
      length: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.length)] }),
      limitWatts: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.limitWatts)] }),
      wattageSource: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(500)] }),
      manufacturer: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
      catalogNumber: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
      lightSource: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
      driver: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
      voltage: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(100)] }),
    },
    { validators: luminaireRules },
  );
}

export type LuminaireTypeForm = ReturnType<typeof luminaireTypeForm>;

export function fillLuminaireType(form: LuminaireTypeForm, type: LuminaireTypeRecord): void {
  form.reset({
    tag: type.tag,
    description: type.description,
    inputWatts: type.inputWatts,
    use: type.use,
    exemptReason: type.exemptReason ?? '',
    basis: type.basis,
    length: type.length ?? '',
    limitWatts: type.limitWatts ?? '',
    wattageSource: type.wattageSource ?? '',
    manufacturer: type.manufacturer ?? '',
    catalogNumber: type.catalogNumber ?? '',
    lightSource: type.lightSource ?? '',
    driver: type.driver ?? '',
    voltage: type.voltage ?? '',
  });
}

function optional(value: string): string | undefined {
  const trimmed = value.trim();
  return trimmed === '' ? undefined : trimmed;
}

export function luminaireTypeFromForm(form: LuminaireTypeForm): LuminaireTypeInput {
  const value = form.getRawValue();
  return {
    tag: value.tag.trim(),
    description: value.description.trim(),
    inputWatts: value.inputWatts.trim(),
    use: value.use,
    exemptReason: value.use === 'exempt' ? optional(value.exemptReason) : undefined,
    basis: value.basis,
    length: value.basis === 'line-voltage-track' ? optional(value.length) : undefined,
    limitWatts: value.basis === 'rated' ? undefined : optional(value.limitWatts),
    wattageSource: optional(value.wattageSource),
    manufacturer: optional(value.manufacturer),
    catalogNumber: optional(value.catalogNumber),
    lightSource: optional(value.lightSource),
    driver: optional(value.driver),
    voltage: optional(value.voltage),
  };
}
