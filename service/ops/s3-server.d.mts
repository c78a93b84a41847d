export interface LocalS3 {
  port: number;
  dir: string;
  bucket: string;
  endpoint: string;
  close(): Promise<void>;
}

export const localS3Credentials: { accessKeyId: string; secretAccessKey: string };

export function startLocalS3(options: { dir: string; bucket: string; port?: number; host?: string }): Promise<LocalS3>;
