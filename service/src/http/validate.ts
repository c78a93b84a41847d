import type { z } from 'zod';
import { AppError } from './app-error.js';
import { zodDetails } from './error-handler.js';

/** The textual UUID form PostgreSQL parses; checked first so a malformed id is a 404, not a database error. */
export const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Parses input with a zod schema; a failure becomes a 400 listing the path of every problem. */
export function parse<Schema extends z.ZodType>(schema: Schema, input: unknown, message = 'The request is not valid.'): z.infer<Schema> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw AppError.badRequest(message, zodDetails(result.error));
  }
  return result.data;
}
