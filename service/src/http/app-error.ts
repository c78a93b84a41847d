import type { ErrorDetail } from '../domain-errors.js';

export type { ErrorDetail };

/** An error the API reports in its single error shape, with a status and a stable code. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: ErrorDetail[] = [],
  ) {
    super(message);
    this.name = 'AppError';
  }

  static badRequest(message: string, details: ErrorDetail[] = []): AppError {
    return new AppError(400, 'validation_failed', message, details);
  }

  static unauthorized(message = 'Sign in to continue.'): AppError {
    return new AppError(401, 'unauthorized', message);
  }

  static forbidden(message = 'You do not have access to this.'): AppError {
    return new AppError(403, 'forbidden', message);
  }

  static notFound(message = 'Not found.'): AppError {
    return new AppError(404, 'not_found', message);
  }

  static conflict(message: string, details: ErrorDetail[] = []): AppError {
    return new AppError(409, 'conflict', message, details);
  }
}
