import { z } from 'zod';
import { documentLimits, listLimit, textField, textLimits, versionField } from '../compliance/bounds.js';
import { exteriorApplicationEntrySchema, luminaireTypeSchema, spaceSchema } from '../compliance/document.js';

/** Writes carry the version the writer read; a stale one gets 409. */
const version = versionField;

/** A stored space is a document space without its id (the service assigns it). */
export const spaceInputSchema = spaceSchema.omit({ id: true });
export const spaceWriteSchema = spaceInputSchema.extend({ version });
export const spacePatchSchema = spaceInputSchema.partial().extend({ version });
export const bulkSpacesSchema = z.object({
  spaces: z.array(spaceInputSchema).min(1, 'Send at least one space.').max(documentLimits.spaces, listLimit(documentLimits.spaces, 'spaces in one project')),
});

export const luminaireTypeInputSchema = luminaireTypeSchema.extend({ wattageSource: textField(textLimits.description).optional() });
export const luminaireTypeWriteSchema = luminaireTypeInputSchema.extend({ version });

export const exteriorApplicationInputSchema = exteriorApplicationEntrySchema.extend({ description: textField(textLimits.description).default('') });
export const exteriorApplicationWriteSchema = exteriorApplicationInputSchema.extend({ version });

export const versionQuerySchema = z.object({
  version: z.coerce.number({ message: 'Send the version you read, a whole number.' }).pipe(versionField),
});

export type SpaceInput = z.output<typeof spaceInputSchema>;
export type LuminaireTypeInput = z.output<typeof luminaireTypeInputSchema>;
export type ExteriorApplicationInput = z.output<typeof exteriorApplicationInputSchema>;
