import { z } from 'zod';
import { exteriorApplicationEntrySchema, luminaireTypeSchema, spaceSchema } from '../compliance/document.js';

/** Writes carry the version the writer read; a stale one gets 409. */
const version = z.number().int().positive();

/** A stored space is a document space without its id (the service assigns it). */
export const spaceInputSchema = spaceSchema.omit({ id: true });
export const spaceWriteSchema = spaceInputSchema.extend({ version });
export const spacePatchSchema = spaceInputSchema.partial().extend({ version });
export const bulkSpacesSchema = z.object({ spaces: z.array(spaceInputSchema).min(1).max(10_000) });

export const luminaireTypeInputSchema = luminaireTypeSchema.extend({ wattageSource: z.string().trim().max(500).optional() });
export const luminaireTypeWriteSchema = luminaireTypeInputSchema.extend({ version });

export const exteriorApplicationInputSchema = exteriorApplicationEntrySchema.extend({ description: z.string().trim().max(500).default('') });
export const exteriorApplicationWriteSchema = exteriorApplicationInputSchema.extend({ version });

export const versionQuerySchema = z.object({ version: z.coerce.number().int().positive() });

export type SpaceInput = z.output<typeof spaceInputSchema>;
export type LuminaireTypeInput = z.output<typeof luminaireTypeInputSchema>;
export type ExteriorApplicationInput = z.output<typeof exteriorApplicationInputSchema>;
