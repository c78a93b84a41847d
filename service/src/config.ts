import { isIP } from 'node:net';
import { z } from 'zod';

const booleanFromString = z.enum(['true', 'false', '1', '0']).transform((value) => value === 'true' || value === '1');

/** Express's own names for address ranges (see its `trust proxy` setting). */
const namedRanges = new Set(['loopback', 'linklocal', 'uniquelocal']);

function isAddressOrSubnet(entry: string): boolean {
  if (namedRanges.has(entry)) return true;
  const [address = '', prefix, ...rest] = entry.split('/');
  const family = isIP(address);
  if (family === 0 || rest.length > 0) return false;
  if (prefix === undefined) return true;
  return /^\d{1,3}$/.test(prefix) && Number(prefix) <= (family === 4 ? 32 : 128);
}

/**
 * Which proxies may tell us the client's address through `X-Forwarded-For` (and the scheme through
 * `X-Forwarded-Proto`): nobody (the default), a number of hops, or a comma-separated list of
 * addresses, subnets and Express's named ranges. `true` is refused: believing every hop lets any
 * client choose its own address and slip past the sign-in limits.
 */
const trustProxy = z
  .string()
  .trim()
  .optional()
  .transform((value, context): false | number | string[] => {
    if (value === undefined || value === '' || value === 'false' || value === '0') return false;
    if (/^\d+$/.test(value)) return Number(value);
    const entries = value.split(',').map((entry) => entry.trim());
    const bad = entries.filter((entry) => !isAddressOrSubnet(entry));
    if (bad.length > 0) {
      context.addIssue({
        code: 'custom',
        message: `expected false, a number of proxy hops, or addresses, subnets and loopback/linklocal/uniquelocal separated by commas; not ${bad.join(', ')}`,
      });
      return z.NEVER;
    }
    return entries;
  });

function knownTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const configSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(4300),
    DATABASE_URL: z.string().url(),
    JWT_SECRET: z.string().min(32, 'JWT_SECRET must be at least 32 characters'),
    SESSION_HOURS: z.coerce
      .number()
      .positive()
      .max(24 * 30)
      .default(8),
    /** Unset: Secure everywhere but development, where a LAN address over plain http would lose the cookie. */
    COOKIE_SECURE: booleanFromString.optional(),
    TRUST_PROXY: trustProxy,
    LOGIN_RATE_LIMIT: z.coerce.number().int().positive().default(10),
    LOGIN_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
    LOGIN_ACCOUNT_RATE_LIMIT: z.coerce.number().int().positive().default(5),
    LOGIN_ACCOUNT_RATE_WINDOW_MINUTES: z.coerce.number().positive().default(15),
    // A 10,000-space project (the ceiling) with its luminaires, controls and windows is about 5 MB of JSON.
    JSON_BODY_LIMIT: z.string().default('10mb'),
    LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
    WEB_DIST: z.string().optional(),
    /** The address people reach the app at: the links in its mail. Unset: http://127.0.0.1:PORT. */
    APP_URL: z.string().url().optional(),
    /** The SMTP relay. `npm start` and the tests run a local one on loopback that keeps every message. */
    SMTP_HOST: z.string().min(1).default('127.0.0.1'),
    SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
    /** TLS from the first byte (usually port 465); unset, STARTTLS is used where the relay offers it. */
    SMTP_SECURE: booleanFromString.default(false),
    SMTP_USER: z.string().optional(),
    SMTP_PASSWORD: z.string().optional(),
    MAIL_FROM: z.string().min(3).default('Allowlight <no-reply@allowlight.localhost>'),
    MAIL_RETRY_SECONDS: z.coerce.number().positive().max(3600).default(60),
    MAIL_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(50).default(8),
    MAIL_POLL_SECONDS: z.coerce.number().positive().max(3600).default(5),
    /** The local hour from which each day's review digest goes out, in REVIEW_DIGEST_TIME_ZONE. */
    REVIEW_DIGEST_HOUR: z.coerce.number().int().min(0).max(23).default(7),
    /** Unset: the server's own time zone. */
    REVIEW_DIGEST_TIME_ZONE: z
      .string()
      .trim()
      .max(100)
      .optional()
      .refine((zone) => zone === undefined || zone === '' || knownTimeZone(zone), 'expected a time zone name such as America/Chicago'),
    REVIEW_DIGEST_CHECK_MINUTES: z.coerce.number().positive().max(1440).default(15),
    /** Packages of projects with at least this many spaces are made by a background job (pg-boss); smaller ones at once. */
    PACKAGE_JOB_MIN_SPACES: z.coerce.number().int().min(1).max(1_000_000).default(500),
    /**
     * Where submittal package files are kept: an S3 bucket. Unset endpoint: AWS's own for the region.
     * `npm start` and the tests run a local S3-compatible server on loopback and point these at it.
     */
    S3_ENDPOINT: z.string().url().optional(),
    S3_REGION: z.string().min(1).max(64).default('us-east-1'),
    S3_BUCKET: z
      .string()
      .regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'an S3 bucket name: 3 to 63 lower-case letters, digits, dots and dashes')
      .default('allowlight-packages'),
    /** Unset: the SDK's usual chain (environment, instance role …). */
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    /** Bucket in the path rather than the host name: what local and most self-hosted servers need. */
    S3_FORCE_PATH_STYLE: booleanFromString.default(false),
    PASSWORD_RESET_MINUTES: z.coerce
      .number()
      .int()
      .min(5)
      .max(24 * 60)
      .default(60),
    /** How long an invitation to a project's team works. */
    INVITATION_DAYS: z.coerce.number().int().min(1).max(30).default(7),
  })
  .refine((config) => (config.S3_ACCESS_KEY_ID === undefined) === (config.S3_SECRET_ACCESS_KEY === undefined), {
    message: 'S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY go together: set both or neither',
    path: ['S3_SECRET_ACCESS_KEY'],
  })
  .transform((config) => ({
    ...config,
    COOKIE_SECURE: config.COOKIE_SECURE ?? config.NODE_ENV !== 'development',
    REVIEW_DIGEST_TIME_ZONE: config.REVIEW_DIGEST_TIME_ZONE || Intl.DateTimeFormat().resolvedOptions().timeZone,
    APP_URL: (config.APP_URL ?? `http://127.0.0.1:${config.PORT}`).replace(/\/+$/, ''),
  }));

export type Config = z.infer<typeof configSchema>;

/** Parses the environment once; a bad value stops the process with every problem listed. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
    throw new Error(`Invalid configuration:\n${problems.join('\n')}`);
  }
  return parsed.data;
}
