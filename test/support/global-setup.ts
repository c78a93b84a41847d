import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import knex from 'knex';
import type { TestProject } from 'vitest/node';
import { knexConfig } from '../../schema/knexfile.js';
import { freePort, startCluster, type Cluster } from '../../service/ops/postgres.mjs';
import { templateDatabase, withDatabase } from './database-names.js';

declare module 'vitest' {
  export interface ProvidedContext {
    adminDatabaseUrl: string;
    templateDatabaseUrl: string;
    demoPassword: string;
  }
}

/**
 * Starts a throwaway PostgreSQL cluster on a free port (never the development data), builds a
 * migrated and seeded template database, and hands its address to the tests. TEST_DATABASE_URL
 * points the tests at an existing server instead (its user must be allowed to create databases).
 */
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  let cluster: Cluster | null = null;
  let baseDir: string | null = null;
  let adminUrl = process.env['TEST_DATABASE_URL'];
  if (!adminUrl) {
    baseDir = mkdtempSync(path.join(os.tmpdir(), 'allowlight-test-pg-'));
    const password = randomBytes(12).toString('base64url');
    cluster = startCluster({ baseDir, port: await freePort(), password, fsync: false });
    adminUrl = cluster.url('postgres');
  }

  const stop = async () => {
    if (cluster) cluster.stop();
    if (baseDir) rmSync(baseDir, { recursive: true, force: true });
  };

  const demoPassword = `test-${randomBytes(6).toString('base64url')}`;
  process.env['DEMO_PASSWORD'] = demoPassword;
  const templateUrl = withDatabase(adminUrl, templateDatabase);
  try {
    const admin = knex({ client: 'pg', connection: adminUrl });
    await admin.raw(`drop database if exists ${templateDatabase}`);
    await admin.raw(`create database ${templateDatabase}`);
    await admin.destroy();

    const template = knex(knexConfig(templateUrl));
    try {
      await template.migrate.latest();
      await template.seed.run();
    } finally {
      await template.destroy();
    }
  } catch (error) {
    await stop();
    throw error;
  }

  project.provide('adminDatabaseUrl', adminUrl);
  project.provide('templateDatabaseUrl', templateUrl);
  project.provide('demoPassword', demoPassword);

  return stop;
}
