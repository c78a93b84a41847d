import express, { type RequestHandler } from 'express';
import { parse } from 'lossless-json';

/**
 * JSON request bodies read exactly. JSON.parse turns every number into a binary float, so
 * 1.0000000000000001 would arrive as 1 and 9007199254740993 as …992; here a number arrives as the
 * text it was written in (whole numbers a float holds exactly stay numbers), and the shared bounds
 * read it as a decimal.
 */
export function exactJsonBody(limit: string): RequestHandler[] {
  const text = express.text({ type: ['application/json', 'application/*+json'], limit, defaultCharset: 'utf-8' });
  return [utf8Only, text, parseText];
}

function failure(status: number, type: string, message: string): Error {
  return Object.assign(new Error(message), { status, statusCode: status, type, expose: true });
}

/** JSON is UTF-8 (RFC 8259 §8.1): another declared charset is refused rather than decoded. */
const utf8Only: RequestHandler = (req, _res, next) => {
  const charset = /charset\s*=\s*"?([^";\s]+)/i.exec(req.get('content-type') ?? '')?.[1]?.toLowerCase();
  if (charset !== undefined && charset !== 'utf-8' && charset !== 'utf8')
    throw failure(415, 'charset.unsupported', `unsupported charset "${charset}"`);
  next();
};

function numberValue(written: string): number | string {
  return /^-?\d+$/.test(written) && Number.isSafeInteger(Number(written)) ? Number(written) : written;
}

const parseText: RequestHandler = (req, _res, next) => {
  if (typeof req.body !== 'string') return next();
  if (req.body.trim() === '') {
    req.body = undefined;
    return next();
  }
  try {
    req.body = parse(req.body, undefined, numberValue);
  } catch {
    throw failure(400, 'entity.parse.failed', 'the body is not valid JSON');
  }
  next();
};
