import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { Config } from '../config.js';
import { Unavailable } from '../domain-errors.js';

/** Where package files are kept: keys are made by the service only, never from what a person typed. */
export interface FileStorage {
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  /** Removes a file no revision names (after a failed record); a key that is not there is no error. */
  remove(key: string): Promise<void>;
}

/** How long one request to the store may take before it counts as down. */
const requestTimeoutMs = 30_000;

/** The S3 bucket the settings name: a real one in production, the local server in development and tests. */
export function s3Storage(config: Config): FileStorage {
  const client = new S3Client({
    region: config.S3_REGION,
    ...(config.S3_ENDPOINT ? { endpoint: config.S3_ENDPOINT } : {}),
    forcePathStyle: config.S3_FORCE_PATH_STYLE,
    ...(config.S3_ACCESS_KEY_ID && config.S3_SECRET_ACCESS_KEY
      ? { credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY } }
      : {}),
    maxAttempts: 2,
    requestHandler: { requestTimeout: requestTimeoutMs, connectionTimeout: 5_000 },
  });
  const bucket = config.S3_BUCKET;
  return {
    async put(key, body, contentType) {
      try {
        await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType }));
      } catch (error) {
        throw new Unavailable('The package files could not be stored: the file store did not answer. Try again in a minute.', error);
      }
    },
    async get(key) {
      try {
        const answer = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        if (!answer.Body) throw new Error('empty body');
        return Buffer.from(await answer.Body.transformToByteArray());
      } catch (error) {
        throw new Unavailable('The file could not be read from the file store. Try again in a minute.', error);
      }
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },
  };
}
