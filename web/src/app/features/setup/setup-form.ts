import { FormControl, FormGroup, Validators, type AbstractControl, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { ComplianceMethod, EditionId, ProjectDetail, ProjectScope, ProjectSetupWrite, UnitSystem } from '../../core/api/api-types';
import type { ApiErrorDetail } from '../../core/http/api-error';
import { placeServerErrors } from '../../shared/write-failure';
import { ranges } from '../../shared/number-range';
import { quantityValidator } from '../spaces/space-form';
import { parseCoordinate, type Axis } from './coordinates';
import { isTimeZone } from './time-zones';

/** A latitude or longitude in any of the ways parseCoordinate reads, within its range. */
export function coordinateValidator(axis: Axis): ValidatorFn {
  return (control: AbstractControl<string>): ValidationErrors | null => {
    const parsed = parseCoordinate(control.value ?? '', axis);
    return parsed.kind === 'invalid' ? { coordinate: parsed.message } : null;
  };
}

export const timeZoneValidator: ValidatorFn = (control: AbstractControl<string>) => {
  const zone = (control.value ?? '').trim();
  return zone === '' || isTimeZone(zone)
    ? null
    : { timeZone: 'Choose a time zone from the list: type a city, a region or a name such as Pacific.' };
};

/** As the service says: at most 10 amendments (compliance/bounds.ts maxAmendments); the choice cannot repeat one. */
export const maxAmendments = 10;
const amendmentLimit: ValidatorFn = (control: AbstractControl<string[]>) =>
  control.value.length > maxAmendments ? { amendments: `Choose at most ${maxAmendments} amendments.` } : null;

const text = (max: number) => new FormControl('', { nonNullable: true, validators: [Validators.maxLength(max)] });

export function setupForm() {
  return new FormGroup({
    identity: new FormGroup({
      name: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(200)] }),
      address: text(500),
      permitNumber: text(100),
      owner: text(200),
    }),
    site: new FormGroup({
      latitude: new FormControl('', { nonNullable: true, validators: [coordinateValidator('latitude')] }),
      longitude: new FormControl('', { nonNullable: true, validators: [coordinateValidator('longitude')] }),
      timeZone: new FormControl('', { nonNullable: true, validators: [timeZoneValidator] }),
    }),
    code: new FormGroup({
      jurisdiction: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(200)] }),
      edition: new FormControl<EditionId | ''>('', { nonNullable: true, validators: [Validators.required] }),
      method: new FormControl<ComplianceMethod>('space-by-space', { nonNullable: true, validators: [Validators.required] }),
      units: new FormControl<UnitSystem>('ip', { nonNullable: true, validators: [Validators.required] }),
      /** The edition's jurisdiction amendments chosen (their keys); none: the model code only. */
      amendments: new FormControl<string[]>([], { nonNullable: true, validators: [amendmentLimit] }),
    }),
    building: new FormGroup({
      occupancy: text(200),
      scope: new FormControl<ProjectScope | null>(null),
      grossFloorArea: new FormControl('', { nonNullable: true, validators: [quantityValidator(ranges.area)] }),
    }),
    exterior: new FormGroup({
      lightingZone: new FormControl<number | null>(null),
    }),
    people: new FormGroup({
      designerName: text(200),
      designerFirm: text(200),
      designerLicence: text(100),
      contractorName: text(200),
      contractorFirm: text(200),
      contractorLicence: text(100),
      contractorContact: text(200),
    }),
  });
}

export type SetupForm = ReturnType<typeof setupForm>;

/** Which group of the form each field the service names lives in. */
const fieldGroups: Record<string, keyof SetupForm['controls']> = {
  name: 'identity',
  address: 'identity',
  permitNumber: 'identity',
  owner: 'identity',
  latitude: 'site',
  longitude: 'site',
  timeZone: 'site',
  jurisdiction: 'code',
  edition: 'code',
  method: 'code',
  units: 'code',
  amendments: 'code',
  lightingZone: 'exterior',
  occupancy: 'building',
  scope: 'building',
  grossFloorArea: 'building',
  designerName: 'people',
  designerFirm: 'people',
  designerLicence: 'people',
  contractorName: 'people',
  contractorFirm: 'people',
  contractorLicence: 'people',
  contractorContact: 'people',
};

function blankToNull(value: string): string | null {
  const trimmed = value.trim();
  return trimmed === '' ? null : trimmed;
}

/** A coordinate as the service stores it: decimal degrees, converted from degrees and minutes where typed so. */
function coordinate(raw: string, axis: Axis): string | null {
  const parsed = parseCoordinate(raw, axis);
  return parsed.kind === 'ok' ? parsed.decimal : blankToNull(raw);
}

export function setupValue(form: SetupForm): ProjectSetupWrite {
  const { identity, site, code, building, exterior, people } = form.getRawValue();
  return {
    name: identity.name.trim(),
    address: blankToNull(identity.address),
    permitNumber: blankToNull(identity.permitNumber),
    owner: blankToNull(identity.owner),
    latitude: coordinate(site.latitude, 'latitude'),
    longitude: coordinate(site.longitude, 'longitude'),
    timeZone: blankToNull(site.timeZone),
    jurisdiction: blankToNull(code.jurisdiction),
    edition: code.edition as EditionId,
    method: code.method,
    units: code.units,
    amendments: code.amendments,
    occupancy: blankToNull(building.occupancy),
    scope: building.scope,
    grossFloorArea: blankToNull(building.grossFloorArea),
    lightingZone: exterior.lightingZone,
    designerName: blankToNull(people.designerName),
    designerFirm: blankToNull(people.designerFirm),
    designerLicence: blankToNull(people.designerLicence),
    contractorName: blankToNull(people.contractorName),
    contractorFirm: blankToNull(people.contractorFirm),
    contractorLicence: blankToNull(people.contractorLicence),
    contractorContact: blankToNull(people.contractorContact),
  };
}

export function fillSetup(form: SetupForm, project: ProjectDetail): void {
  form.reset({
    identity: { name: project.name, address: project.address ?? '', permitNumber: project.permitNumber ?? '', owner: project.owner ?? '' },
    site: { latitude: project.latitude ?? '', longitude: project.longitude ?? '', timeZone: project.timeZone ?? '' },
    code: {
      jurisdiction: project.jurisdiction ?? '',
      edition: project.edition ?? '',
      method: project.method ?? 'space-by-space',
      units: project.units,
      amendments: project.amendments ?? [],
    },
    building: { occupancy: project.occupancy ?? '', scope: project.scope, grossFloorArea: project.grossFloorArea ?? '' },
    exterior: { lightingZone: project.lightingZone },
    people: {
      designerName: project.designerName ?? '',
      designerFirm: project.designerFirm ?? '',
      designerLicence: project.designerLicence ?? '',
      contractorName: project.contractorName ?? '',
      contractorFirm: project.contractorFirm ?? '',
      contractorLicence: project.contractorLicence ?? '',
      contractorContact: project.contractorContact ?? '',
    },
  });
}

/** Puts the service's 400 messages beside the fields they name; returns those it could not place. */
export function showServerErrors(form: SetupForm, details: readonly ApiErrorDetail[]): ApiErrorDetail[] {
  return placeServerErrors(details, (path) => {
    // A refused amendment is named by its place in the list (`amendments.1`): the message goes beside the one field.
    const field = path.startsWith('amendments.') ? 'amendments' : path;
    const group = fieldGroups[field];
    return group ? form.get([group, field]) : null;
  });
}
