// A local S3-compatible server on loopback for development and tests (s3rver): the app's package
// files are kept as plain files under one folder, the bucket is made when it starts. Never exposed
// beyond 127.0.0.1; production points S3_ENDPOINT (or AWS's own) at a real bucket instead.
import { mkdirSync } from 'node:fs';
import S3rver from 's3rver';

/** s3rver accepts requests signed with these (its documented defaults); nothing here is secret. */
export const localS3Credentials = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

/**
 * Starts the server with the bucket made. `port: 0` picks a free port; the resolved one is returned.
 * @param {{ dir: string, bucket: string, port?: number, host?: string }} options
 * @returns {Promise<{ port: number, dir: string, endpoint: string, bucket: string, close: () => Promise<void> }>}
 */
export async function startLocalS3({ dir, bucket, port = 0, host = '127.0.0.1' }) {
  mkdirSync(dir, { recursive: true });
  const server = new S3rver({ address: host, port, directory: dir, silent: true, configureBuckets: [{ name: bucket, configs: [] }] });
  const address = await server.run();
  const resolved = typeof address === 'object' && address ? address.port : port;
  return {
    port: resolved,
    dir,
    bucket,
    endpoint: `http://${host}:${resolved}`,
    close: () => server.close(),
  };
}
