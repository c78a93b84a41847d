import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
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

/** Every failure leaves the service in one shape; unknown errors never leak a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (err instanceof AppError) {
    res.status(err.status).json(body(err.code, err.message, err.details));
    return;
  }
  if (err instanceof ZodError) {
    res.status(400).json(body('validation_failed', 'The request is not valid.', zodDetails(err)));
    return;
  }
  const status = typeof err?.status === 'number' ? err.status : typeof err?.statusCode === 'number' ? err.statusCode : 500;
  if (status === 413) {
    res.status(413).json(body('payload_too_large', 'The request body is too large.'));
    return;
  }
  if (status === 400 && err?.type === 'entity.parse.failed') {
    res.status(400).json(body('malformed_json', 'The request body is not valid JSON.'));
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on our side. The error has been logged.'));
};
