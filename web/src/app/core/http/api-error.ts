import { HttpErrorResponse } from '@angular/common/http';

export interface ApiErrorDetail {
  path: string;
  message: string;
}

/** The service's single error shape, as the client sees it. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details: readonly ApiErrorDetail[] = [],
  ) {
    super(message);
    this.name = 'ApiError';
  }

  static from(response: HttpErrorResponse): ApiError {
    const body: unknown = response.error;
    if (isErrorBody(body)) {
      return new ApiError(response.status, body.error.code, body.error.message, body.error.details ?? []);
    }
    if (response.status === 0) {
      return new ApiError(0, 'offline', 'The service cannot be reached. Check your connection and try again.');
    }
    return new ApiError(response.status, 'unexpected', `The service answered ${response.status} ${response.statusText}.`);
  }
}

interface ErrorBody {
  error: { code: string; message: string; details?: ApiErrorDetail[] };
}

function isErrorBody(body: unknown): body is ErrorBody {
  if (typeof body !== 'object' || body === null || !('error' in body)) return false;
  const error = (body as { error: unknown }).error;
  return typeof error === 'object' && error !== null && 'code' in error && 'message' in error;
}
