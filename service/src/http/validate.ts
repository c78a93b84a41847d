import type { z } from 'zod';
import { listed } from '../compliance/document.js';
import { AppError } from './app-error.js';
import { zodDetails } from './error-handler.js';

/** The textual UUID form PostgreSQL parses; checked first so a malformed id is a 404, not a database error. */
export const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Parses input with a zod schema; a failure becomes a 400 listing the path of every problem (the first few hundred). */
export function parse<Schema extends z.ZodType>(schema: Schema, input: unknown, message = 'The request is not valid.'): z.infer<Schema> {
  const result = schema.safeParse(input);
  if (!result.success) {
    throw AppError.badRequest(message, listed(zodDetails(result.error)));
  }
  return result.data;
}

export function isUuid(value: unknown): value is string {
  return typeof value === 'string' && uuidPattern.test(value);
}

/**
 * A row id from the path. Ids are UUIDs, so anything else names no row: 404, before the value
 * reaches PostgreSQL (which would refuse to compare it with a uuid column).
 */
export function idParam(value: string | string[] | undefined, what: string): string {
  if (!isUuid(value)) throw AppError.notFound(`${what} does not exist.`);
  return value;
}
