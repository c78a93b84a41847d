import { z } from 'zod';
import {
  decimalField,
  distinctKeys,
  maxAmendments,
  maxNumberLength,
  ranges,
  textField,
  textLimits,
  versionField,
} from '../compliance/bounds.js';

function boundedDecimal(min: number, max: number, what: string) {
  return z.union([z.string(), z.number()]).transform((value, ctx) => {
    const raw = String(value).trim();
    const parsed = Number(raw);
    if (raw === '' || raw.length > maxNumberLength || !/^[+-]?\d+(\.\d+)?$/.test(raw) || parsed < min || parsed > max) {
      ctx.addIssue({ code: 'custom', message: `${what} must be a decimal number from ${min} to ${max}.` });
      return z.NEVER;
    }
    return raw;
  });
}

function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en-US', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

export const projectMethods = ['building-area', 'space-by-space'] as const;
export const unitSystems = ['ip', 'si'] as const;
/** The kind of work the permit covers; each edition's alteration rules depend on it. */
export const projectScopes = ['new-building', 'addition', 'alteration', 'tenant-improvement'] as const;

const optionalText = (max: number) => textField(max).nullable().optional();

const setupFields = {
  name: textField(textLimits.name).pipe(z.string().min(1, 'Give the project a name.')),
  address: textField(textLimits.address, { multiline: true }).nullable().optional(),
  latitude: boundedDecimal(-90, 90, 'Latitude').nullable().optional(),
  longitude: boundedDecimal(-180, 180, 'Longitude').nullable().optional(),
  timeZone: textField(textLimits.key).refine(isTimeZone, 'Use an IANA time zone such as America/Los_Angeles.').nullable().optional(),
  jurisdiction: textField(textLimits.name).nullable().optional(),
  edition: textField(textLimits.key).pipe(z.string().min(1, 'Choose a code edition.')),
  method: z.enum(projectMethods),
  units: z.enum(unitSystems),
  lightingZone: z.number().int().min(0).max(4).nullable().optional(),
  /** Jurisdiction amendments of the edition the project follows (keys of the edition's amendments). */
  amendments: distinctKeys(textField(textLimits.key, { required: true }), maxAmendments, 'amendments').optional(),
  permitNumber: optionalText(100),
  owner: optionalText(textLimits.name),
  occupancy: optionalText(textLimits.name),
  scope: z.enum(projectScopes).nullable().optional(),
  /** Gross floor area of the building, ft² or m² as the project's units say. */
  grossFloorArea: decimalField(ranges.area).nullable().optional(),
  designerName: optionalText(textLimits.name),
  designerFirm: optionalText(textLimits.name),
  designerLicence: optionalText(100),
  contractorName: optionalText(textLimits.name),
  contractorFirm: optionalText(textLimits.name),
  contractorLicence: optionalText(100),
  contractorContact: optionalText(textLimits.name),
};

/** The permit fields, by their names in the API and their columns. */
export const permitColumns = {
  permitNumber: 'permit_number',
  owner: 'owner_name',
  occupancy: 'occupancy',
  scope: 'scope',
  grossFloorArea: 'gross_floor_area',
  designerName: 'designer_name',
  designerFirm: 'designer_firm',
  designerLicence: 'designer_licence',
  contractorName: 'contractor_name',
  contractorFirm: 'contractor_firm',
  contractorLicence: 'contractor_licence',
  contractorContact: 'contractor_contact',
} as const;

export const projectCreateSchema = z.object(setupFields);
export const projectSetupPatchSchema = z.object(setupFields).partial().extend({ version: versionField });

export type ProjectCreate = z.output<typeof projectCreateSchema>;
export type ProjectSetupPatch = z.output<typeof projectSetupPatchSchema>;
