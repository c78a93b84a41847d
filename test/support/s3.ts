import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { localS3Credentials, startLocalS3, type LocalS3 } from '../../service/ops/s3-server.mjs';
import type { ConfigOverrides } from './app.js';

export interface TestS3 extends LocalS3 {
  /** The settings that point a test app at this server. */
  settings: ConfigOverrides;
  /** Stops the server and removes its folder. */
  stop(): Promise<void>;
}

/** A local S3 server of one test file, on a free port, with its own folder and bucket. */
export async function startTestS3(): Promise<TestS3> {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'allowlight-test-s3-'));
  const server = await startLocalS3({ dir, bucket: 'test-packages' });
  return {
    ...server,
    settings: {
      S3_ENDPOINT: server.endpoint,
      S3_BUCKET: server.bucket,
      S3_FORCE_PATH_STYLE: 'true',
      S3_ACCESS_KEY_ID: localS3Credentials.accessKeyId,
      S3_SECRET_ACCESS_KEY: localS3Credentials.secretAccessKey,
    },
    async stop() {
      await server.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
