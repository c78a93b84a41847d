import { z } from 'zod';

export const editionParams = z.object({ editionId: z.string().min(1).max(64) });
export const editionQuery = z.object({
  dataVersion: z
    .string()
    .regex(/^[0-9a-f]{16}$/)
    .optional(),
});
