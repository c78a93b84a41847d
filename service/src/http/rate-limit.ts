import type { NextFunction, Request, Response } from 'express';
import { rateLimit, type RateLimitRequestHandler } from 'express-rate-limit';
import type { Logger } from 'pino';
import { AppError } from './app-error.js';

export interface LimitSettings {
  /** Names the limiter's own count, so two limiters never share one. */
  name: string;
  limit: number;
  windowMinutes: number;
  /** The sentence the refused person reads. */
  message: string;
  /** Where the limiter reports a misconfiguration (such as a proxy it was not told to trust). */
  logger: Logger;
  /** Counts per this key (an account) instead of per client address; null leaves the request uncounted. */
  keyedBy?: (req: Request) => string | null;
  /** Hands successful requests back, so only failures use up the allowance. */
  countFailuresOnly?: boolean;
}

/** A request limiter whose refusal is a 429 `rate_limited` in the one error shape (the error handler answers it). */
export function requestLimiter({
  name,
  limit,
  windowMinutes,
  message,
  logger,
  keyedBy,
  countFailuresOnly = false,
}: LimitSettings): RateLimitRequestHandler {
  return rateLimit({
    identifier: name,
    windowMs: windowMinutes * 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: countFailuresOnly,
    logger,
    ...(keyedBy ? { keyGenerator: (req: Request) => keyedBy(req) ?? '', skip: (req: Request) => keyedBy(req) === null } : {}),
    handler: (_req: Request, _res: Response, next: NextFunction) => {
      next(new AppError(429, 'rate_limited', message));
    },
  });
}

/** The e-mail address a request's body names, lower-cased, or null when it names none (it then fails validation). */
export function emailInBody(req: Request): string | null {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' && email.trim().length > 0 ? email.trim().toLowerCase() : null;
}
