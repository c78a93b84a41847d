import type { RequestHandler } from 'express';
import { strictTransportSecurity } from 'helmet';

/**
 * Browser features the app never uses, switched off for it and anything it might embed, so an
 * injected script cannot ask for them either.
 */
const deniedFeatures = [
  'accelerometer',
  'camera',
  'display-capture',
  'geolocation',
  'gyroscope',
  'hid',
  'magnetometer',
  'microphone',
  'midi',
  'payment',
  'serial',
  'usb',
];

export const permissionsPolicy: RequestHandler = (_req, res, next) => {
  res.setHeader('Permissions-Policy', deniedFeatures.map((feature) => `${feature}=()`).join(', '));
  next();
};

const hsts = strictTransportSecurity();

/**
 * HSTS only on a response to an HTTPS request: sent over plain http it is ignored at best, and on a
 * development host that later serves something else over http it would pin the browser to https.
 */
export const hstsWhenSecure: RequestHandler = (req, res, next) => {
  if (req.secure) {
    hsts(req, res, next);
    return;
  }
  next();
};

/** API answers carry sessions' data and CSRF tokens: no browser or proxy cache may keep them. */
export const noStore: RequestHandler = (_req, res, next) => {
  res.setHeader('Cache-Control', 'no-store');
  next();
};
