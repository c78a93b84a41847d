import { FormControl, FormGroup, Validators, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { ComplianceMethod, EditionId, ProjectDetail, ProjectSetup, UnitSystem } from '../../core/api/api-types';
import type { ApiErrorDetail } from '../../core/http/api-error';
import { placeServerErrors } from '../../shared/conflict';

/** The same ranges the service checks (projects.schema.ts): a plain decimal between the bounds. */
export function decimalBetween(min: number, max: number, what: string): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const raw = (control.value ?? '').trim();
    if (raw === '') return null;
    const parsed = Number(raw);
    return /^[+-]?\d+(\.\d+)?$/.test(raw) && parsed >= min && parsed <= max ? null : { range: `${what} must be a decimal number from ${min} to ${max}.` };
  };
}

export function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

export const timeZoneValidator: ValidatorFn = (control: AbstractControl<string>) => {
  const zone = (control.value ?? '').trim();
  return zone === '' || isTimeZone(zone) ? null : { timeZone: 'Use an IANA time zone such as America/Los_Angeles.' };
};

export function setupForm() {
  return new FormGroup({
    identity: new FormGroup({
      name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
      address: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(500)] }),
    }),
    site: new FormGroup({
      latitude: new FormControl('', { nonNullable: true, validators: [decimalBetween(-90, 90, 'Latitude')] }),
      longitude: new FormControl('', { nonNullable: true, validators: [decimalBetween(-180, 180, 'Longitude')] }),
      timeZone: new FormControl('', { nonNullable: true, validators: [timeZoneValidator] }),
    }),
    code: new FormGroup({
      jurisdiction: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
      edition: new FormControl<EditionId | ''>('', { nonNullable: true, validators: [Validators.required] }),
      method: new FormControl<ComplianceMethod>('space-by-space', { nonNullable: true, validators: [Validators.required] }),
      units: new FormControl<UnitSystem>('ip', { nonNullable: true, validators: [Validators.required] }),
    }),
    exterior: new FormGroup({
      lightingZone: new FormControl<number | null>(null),
    }),
  });
}

export type SetupForm = ReturnType<typeof setupForm>;

/** Which group of the form each field the service names lives in. */
const fieldGroups: Record<string, keyof SetupForm['controls']> = {
  name: 'identity',
  address: 'identity',
  latitude: 'site',
  longitude: 'site',
  timeZone: 'site',
  jurisdiction: 'code',
  edition: 'code',
  method: 'code',
  units: 'code',
  lightingZone: 'exterior',
};

function blankToNull(value: string): string | null {
  const trimmed = value.trim();
  return trimmed === '' ? null : trimmed;
}

export function setupValue(form: SetupForm): ProjectSetup {
  const { identity, site, code, exterior } = form.getRawValue();
  return {
    name: identity.name.trim(),
    address: blankToNull(identity.address),
    latitude: blankToNull(site.latitude),
    longitude: blankToNull(site.longitude),
    timeZone: blankToNull(site.timeZone),
    jurisdiction: blankToNull(code.jurisdiction),
    edition: code.edition as EditionId,
    method: code.method,
    units: code.units,
    lightingZone: exterior.lightingZone,
  };
}

export function fillSetup(form: SetupForm, project: ProjectDetail): void {
  form.reset({
    identity: { name: project.name, address: project.address ?? '' },
    site: { latitude: project.latitude ?? '', longitude: project.longitude ?? '', timeZone: project.timeZone ?? '' },
    code: { jurisdiction: project.jurisdiction ?? '', edition: project.edition ?? '', method: project.method ?? 'space-by-space', units: project.units },
    exterior: { lightingZone: project.lightingZone },
  });
}

/** Puts the service's 400 messages beside the fields they name; returns those it could not place. */
export function showServerErrors(form: SetupForm, details: readonly ApiErrorDetail[]): ApiErrorDetail[] {
  return placeServerErrors(details, (path) => {
    const group = fieldGroups[path];
    return group ? form.get([group, path]) : null;
  });
}

/** The first message for a control, in the order a person would fix them. */
export function errorMessage(control: AbstractControl, label: string): string {
  const errors = control.errors ?? {};
  if (errors['required']) return `${label} is required.`;
  if (errors['maxlength']) return `${label} is at most ${(errors['maxlength'] as { requiredLength: number }).requiredLength} characters.`;
  const message = Object.values(errors).find((value): value is string => typeof value === 'string');
  return message ?? `Check the ${label.toLocaleLowerCase()}.`;
}
