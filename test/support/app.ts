import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import { pino } from 'pino';
import request from 'supertest';
import { inject } from 'vitest';
import { createApp } from '../../service/src/app.js';
import { loadConfig, type Config } from '../../service/src/config.js';
import type { Database } from '../../service/src/db/database.js';

/** Settings for a test app; an override of `undefined` removes the test's value and lets the service's default apply. */
export type ConfigOverrides = Record<string, string | undefined>;

export function testConfig(url: string, overrides: ConfigOverrides = {}): Config {
  return loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: url,
    JWT_SECRET: randomBytes(32).toString('hex'),
    LOG_LEVEL: 'silent',
    LOGIN_RATE_LIMIT: '1000',
    LOGIN_ACCOUNT_RATE_LIMIT: '1000',
    // Supertest's cookie jar keeps a Secure cookie but never sends it over plain http.
    COOKIE_SECURE: 'false',
    ...overrides,
  });
}

export function testApp(db: Database, url: string, overrides: ConfigOverrides = {}): { app: Express; config: Config } {
  const config = testConfig(url, overrides);
  return { app: createApp({ db, config, logger: pino({ level: process.env['TEST_LOG_LEVEL'] ?? 'silent' }) }), config };
}

export interface SignedInAgent {
  agent: ReturnType<typeof request.agent>;
  csrfToken: string;
  user: { id: string; email: string; name: string; isAdmin: boolean };
}

/** Signs in through the real route and keeps the cookie, as a script or integration would. */
export async function signIn(app: Express, email: string, password = inject('demoPassword')): Promise<SignedInAgent> {
  const agent = request.agent(app);
  const response = await agent.post('/api/auth/login').send({ email, password });
  if (response.status !== 200) {
    throw new Error(`sign-in as ${email} failed: ${response.status} ${JSON.stringify(response.body)}`);
  }
  return { agent, csrfToken: response.body.csrfToken, user: response.body.user };
}
