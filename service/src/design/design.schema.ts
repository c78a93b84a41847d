import { z } from 'zod';
import { decimalField, documentLimits, listLimit, ranges, textField, textLimits, versionField } from '../compliance/bounds.js';
import { controlSchema, exteriorApplicationEntrySchema, luminaireTypeSchema, spaceSchema } from '../compliance/document.js';

/** Writes carry the version the writer read; a stale one gets 409. */
const version = versionField;

/** A stored space is a document space without its id (the service assigns it). */
export const spaceInputSchema = spaceSchema.omit({ id: true });
export const spaceWriteSchema = spaceInputSchema.extend({ version });
export const spacePatchSchema = spaceInputSchema.partial().extend({ version });
/** The schedule's catalogue fields: kept with the type and printed in the package, not used by the calculation. */
export const luminaireCatalogueFields = {
  wattageSource: textField(textLimits.description).optional(),
  manufacturer: textField(textLimits.name).optional(),
  catalogNumber: textField(textLimits.name).optional(),
  lightSource: textField(textLimits.name).optional(),
  driver: textField(textLimits.name).optional(),
  voltage: textField(100).optional(),
};

export const luminaireTypeInputSchema = luminaireTypeSchema.extend(luminaireCatalogueFields);
export const luminaireTypeWriteSchema = luminaireTypeInputSchema.extend({ version });

/** An import: its spaces, and the luminaire types their counts name that the project does not have yet (created with them). */
export const bulkSpacesSchema = z.object({
  spaces: z
    .array(spaceInputSchema)
    .min(1, 'Send at least one space.')
    .max(documentLimits.spaces, listLimit(documentLimits.spaces, 'spaces in one project')),
  luminaireTypes: z
    .array(luminaireTypeInputSchema)
    .max(documentLimits.luminaireTypes, listLimit(documentLimits.luminaireTypes, 'luminaire types in one project'))
    .default([])
    .superRefine((types, ctx) => {
      const seen = new Set<string>();
      types.forEach((type, index) => {
        if (seen.has(type.tag))
          ctx.addIssue({
            code: 'custom',
            path: [index, 'tag'],
            message: `The tag "${type.tag}" is on an earlier type of this import too.`,
          });
        seen.add(type.tag);
      });
    }),
});

export const exteriorApplicationInputSchema = exteriorApplicationEntrySchema.extend({
  description: textField(textLimits.description).default(''),
});
export const exteriorApplicationWriteSchema = exteriorApplicationInputSchema.extend({ version });

/** The same control recorded on many spaces: each with the version its writer read. */
export const spaceControlsSchema = z.object({
  spaces: z
    .array(z.object({ id: z.string().uuid('Not a space.'), version }))
    .min(1, 'Choose at least one space.')
    .max(documentLimits.spaces, listLimit(documentLimits.spaces, 'spaces in one step')),
  control: controlSchema,
});

const typeKey = textField(textLimits.key, { required: true });
export const importAliasesSchema = z.object({
  aliases: z
    .array(
      z.object({
        name: textField(textLimits.name, { required: true }),
        spaceType: typeKey.nullable().default(null),
        buildingAreaType: typeKey.nullable().default(null),
      }),
    )
    .max(1000, listLimit(1000, 'names in one step')),
});

export const allowanceClaimInputSchema = z.object({
  spaceId: z.string().uuid('Choose a space of the project.'),
  allowance: textField(textLimits.key, { required: true }),
  /** Qualifying sales floor area, ft² or m² as the project's units say. */
  area: decimalField(ranges.area),
});
export const allowanceClaimWriteSchema = allowanceClaimInputSchema.extend({ version });

export const versionQuerySchema = z.object({
  version: z.coerce.number({ message: 'Send the version you read, a whole number.' }).pipe(versionField),
});

export type SpaceInput = z.output<typeof spaceInputSchema>;
export type LuminaireTypeInput = z.output<typeof luminaireTypeInputSchema>;
export type ExteriorApplicationInput = z.output<typeof exteriorApplicationInputSchema>;
