import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import {
  Archived,
  DomainError,
  InUse,
  KeyReused,
  Locked,
  NotFound,
  NotRestorable,
  Refused,
  Stale,
  Conflict,
  Unavailable,
} from '../domain-errors.js';
import { AppError, type ErrorDetail } from './app-error.js';

export interface ErrorBody {
  error: { code: string; message: string; details?: ErrorDetail[] };
}

export function zodDetails(error: ZodError, prefix: (string | number)[] = []): ErrorDetail[] {
  return error.issues.map((issue) => ({
    path: [...prefix, ...issue.path].map(String).join('.'),
    message: issue.message,
  }));
}

function body(code: string, message: string, details?: ErrorDetail[]): ErrorBody {
  return { error: details && details.length > 0 ? { code, message, details } : { code, message } };
}

export const notFoundHandler: RequestHandler = (req, res) => {
  res.status(404).json(body('not_found', `No route for ${req.method} ${req.path}.`));
};

/** Seconds a client should wait before trying again while the database is unreachable. */
export const databaseRetryAfterSeconds = 5;

type Failure =
  | { status?: unknown; statusCode?: unknown; type?: unknown; code?: unknown; name?: unknown; message?: unknown; expose?: unknown }
  | null
  | undefined;

/** Connection-level failures of PostgreSQL or of the pool in front of it: the service is up, its database is not. */
function isDatabaseUnavailable(err: Failure): boolean {
  const code = typeof err?.code === 'string' ? err.code : '';
  if (['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'ENOTFOUND', 'EAI_AGAIN', 'EPIPE', '57P01', '57P02', '57P03', '53300'].includes(code))
    return true;
  if (code.startsWith('08')) return true;
  if (err?.name === 'KnexTimeoutError') return true;
  const message = typeof err?.message === 'string' ? err.message : '';
  return /Connection terminated|connection (is )?closed|Client has encountered a connection error/i.test(message);
}

/** How a request the body parser refused is answered: always a 4xx, in words. */
function bodyParserAnswer(err: Failure, status: number): { status: number; code: string; message: string } {
  if (status === 413) return { status, code: 'payload_too_large', message: 'The request body is too large.' };
  if (err?.type === 'charset.unsupported')
    return { status: 415, code: 'unsupported_charset', message: 'Send the request body as JSON in UTF-8.' };
  if (err?.type === 'encoding.unsupported')
    return {
      status: 415,
      code: 'unsupported_encoding',
      message: 'The request body’s Content-Encoding is not supported; send it uncompressed, or as gzip, deflate or br.',
    };
  if (err?.type === 'entity.parse.failed') return { status: 400, code: 'malformed_json', message: 'The request body is not valid JSON.' };
  if (typeof err?.code === 'string' && err.code.startsWith('Z_'))
    return { status: 400, code: 'malformed_body', message: 'The compressed request body could not be read.' };
  if (err?.type === 'request.aborted')
    return { status: 400, code: 'request_aborted', message: 'The request ended before its body arrived.' };
  if (status === 404) return { status, code: 'not_found', message: 'Not found.' };
  return { status, code: 'bad_request', message: 'The request could not be read.' };
}

/** The status and code of each domain error: the one place the data layer's refusals become HTTP. */
function domainAnswer(err: DomainError): { status: number; code: string } {
  if (err instanceof NotFound) return { status: 404, code: 'not_found' };
  if (err instanceof Refused) return { status: 400, code: 'validation_failed' };
  if (err instanceof InUse) return { status: 409, code: 'in_use' };
  if (err instanceof Stale || err instanceof Conflict) return { status: 409, code: 'conflict' };
  if (err instanceof NotRestorable) return { status: 409, code: 'not_restorable' };
  if (err instanceof Archived) return { status: 409, code: 'archived' };
  if (err instanceof Locked) return { status: 409, code: 'locked' };
  if (err instanceof KeyReused) return { status: 422, code: 'idempotency_key_reused' };
  if (err instanceof Unavailable) return { status: 503, code: 'unavailable' };
  return { status: 500, code: 'internal' };
}

/**
 * Every failure leaves the service in one shape; unknown errors never leak a stack trace. A bad
 * request is a 4xx whatever part refused it: the body parser, zod, or PostgreSQL as a last line.
 */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) {
    res.status(err.status).json(body(err.code, err.message, err.details));
    return;
  }
  if (err instanceof DomainError) {
    const { status, code } = domainAnswer(err);
    if (status === 500) {
      req.log?.error({ err }, 'unmapped domain error');
      res.status(500).json(body('internal', 'Something went wrong on our side. The error has been logged.'));
      return;
    }
    res.status(status).json(body(code, err.message, err.details));
    return;
  }
  if (err instanceof ZodError) {
    res.status(400).json(body('validation_failed', 'The request is not valid.', zodDetails(err)));
    return;
  }
  const failure = err as Failure;
  const status = typeof failure?.status === 'number' ? failure.status : typeof failure?.statusCode === 'number' ? failure.statusCode : 500;
  if (status >= 400 && status < 500) {
    const answer = bodyParserAnswer(failure, status);
    res.status(answer.status).json(body(answer.code, answer.message));
    return;
  }
  if (isDatabaseUnavailable(failure)) {
    req.log?.warn({ err }, 'database unavailable');
    res.setHeader('Retry-After', String(databaseRetryAfterSeconds));
    res.status(503).json(body('unavailable', 'The service cannot reach its database right now. Try again in a few seconds.'));
    return;
  }
  const pgCode = typeof failure?.code === 'string' && /^[0-9A-Z]{5}$/.test(failure.code) ? failure.code : '';
  if (pgCode === '23505') {
    // Two writers raced past a check that each made alone; the database kept one. The routes turn the
    // constraints they expect into their own messages, so this is the fallback.
    req.log?.warn({ err }, 'unique constraint');
    res.status(409).json(body('conflict', 'Someone saved the same thing at the same moment. Reload and try again.'));
    return;
  }
  if (pgCode === '40001' || pgCode === '40P01') {
    res.status(409).json(body('conflict', 'Another change was being saved at the same moment. Try again.'));
    return;
  }
  if (pgCode.startsWith('22')) {
    // Data exceptions (out of range, not valid for the column): validation should have caught it first.
    req.log?.warn({ err }, 'value refused by the database');
    res.status(400).json(body('validation_failed', 'A value is out of range or not valid.'));
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on our side. The error has been logged.'));
};
