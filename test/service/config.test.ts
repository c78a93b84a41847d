import { describe, expect, it } from 'vitest';
import { loadConfig } from '../../service/src/config.js';

const required = { DATABASE_URL: 'postgres://app@127.0.0.1:5432/allowlight', JWT_SECRET: 'a-secret-long-enough-for-the-service-to-accept' };

describe('loadConfig', () => {
  it('makes the session cookie Secure unless the service runs in development', () => {
    expect(loadConfig({ ...required, NODE_ENV: 'production' }).COOKIE_SECURE).toBe(true);
    expect(loadConfig({ ...required, NODE_ENV: 'test' }).COOKIE_SECURE).toBe(true);
    expect(loadConfig({ ...required, NODE_ENV: 'development' }).COOKIE_SECURE).toBe(false);
    expect(loadConfig({ ...required, NODE_ENV: 'production', COOKIE_SECURE: 'false' }).COOKIE_SECURE).toBe(false);
    expect(loadConfig({ ...required, NODE_ENV: 'development', COOKIE_SECURE: 'true' }).COOKIE_SECURE).toBe(true);
  });

  it('trusts no proxy unless told which', () => {
    expect(loadConfig(required).TRUST_PROXY).toBe(false);
    expect(loadConfig({ ...required, TRUST_PROXY: '' }).TRUST_PROXY).toBe(false);
    expect(loadConfig({ ...required, TRUST_PROXY: 'false' }).TRUST_PROXY).toBe(false);
    expect(loadConfig({ ...required, TRUST_PROXY: '1' }).TRUST_PROXY).toBe(1);
    expect(loadConfig({ ...required, TRUST_PROXY: 'loopback, 10.0.0.0/8, fd00::/8, 192.0.2.10' }).TRUST_PROXY).toEqual([
      'loopback',
      '10.0.0.0/8',
      'fd00::/8',
      '192.0.2.10',
    ]);
  });

  it('refuses a TRUST_PROXY that would believe anyone, or that is not an address', () => {
    for (const value of ['true', 'everyone', '10.0.0.0/33', '10.0.0.0/8/1', 'loopback,']) {
      expect(() => loadConfig({ ...required, TRUST_PROXY: value }), value).toThrow(/TRUST_PROXY/);
    }
  });

  it('keeps the per-account sign-in limit apart from the per-address one', () => {
    const config = loadConfig({ ...required, LOGIN_ACCOUNT_RATE_LIMIT: '3', LOGIN_ACCOUNT_RATE_WINDOW_MINUTES: '30' });
    expect(config).toMatchObject({ LOGIN_ACCOUNT_RATE_LIMIT: 3, LOGIN_ACCOUNT_RATE_WINDOW_MINUTES: 30, LOGIN_RATE_LIMIT: 10 });
  });

  it("counts the review digest in a named time zone, the server's own unless told", () => {
    expect(loadConfig(required).REVIEW_DIGEST_TIME_ZONE).toBe(Intl.DateTimeFormat().resolvedOptions().timeZone);
    expect(loadConfig({ ...required, REVIEW_DIGEST_TIME_ZONE: 'America/Chicago', REVIEW_DIGEST_HOUR: '6' })).toMatchObject({
      REVIEW_DIGEST_TIME_ZONE: 'America/Chicago',
      REVIEW_DIGEST_HOUR: 6,
    });
    expect(() => loadConfig({ ...required, REVIEW_DIGEST_TIME_ZONE: 'Mars/Olympus' })).toThrow(/REVIEW_DIGEST_TIME_ZONE/);
    expect(() => loadConfig({ ...required, REVIEW_DIGEST_HOUR: '24' })).toThrow(/REVIEW_DIGEST_HOUR/);
  });

  it('points the package files at AWS S3 by default, or at the endpoint, bucket and keys it is given', () => {
    expect(loadConfig(required)).toMatchObject({ S3_REGION: 'us-east-1', S3_BUCKET: 'allowlight-packages', S3_FORCE_PATH_STYLE: false });
    expect(loadConfig(required).S3_ENDPOINT).toBeUndefined();
    const local = loadConfig({
      ...required,
      S3_ENDPOINT: 'http://127.0.0.1:4568',
      S3_FORCE_PATH_STYLE: 'true',
      S3_ACCESS_KEY_ID: 'key',
      S3_SECRET_ACCESS_KEY: 'secret',
    });
    expect(local).toMatchObject({ S3_ENDPOINT: 'http://127.0.0.1:4568', S3_FORCE_PATH_STYLE: true, S3_ACCESS_KEY_ID: 'key' });
    expect(() => loadConfig({ ...required, S3_ACCESS_KEY_ID: 'key' })).toThrow(/S3_SECRET_ACCESS_KEY/);
    expect(() => loadConfig({ ...required, S3_BUCKET: 'Not A Bucket' })).toThrow(/S3_BUCKET/);
  });
});
