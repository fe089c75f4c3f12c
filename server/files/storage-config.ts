import type { Config } from '../config';
import { DEFAULT_UPLOAD_DIR, diskStorage } from './disk-storage';
import type { FileStorage } from './storage';

/**
 * The attachment storage the configuration chooses: S3 when S3_BUCKET is set, else disk.
 * The S3 SDK is loaded only when it is used.
 */
export async function storageFromConfig(
  config: Pick<Config, 'UPLOAD_DIR' | 'S3_BUCKET' | 'S3_REGION' | 'S3_ENDPOINT' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY'>,
): Promise<FileStorage> {
  if (!config.S3_BUCKET) return diskStorage(config.UPLOAD_DIR ?? DEFAULT_UPLOAD_DIR);
  const { s3Storage } = await import('./s3-storage');
  return s3Storage({
    bucket: config.S3_BUCKET,
    region: config.S3_REGION ?? 'us-east-1',
    endpoint: config.S3_ENDPOINT,
    accessKeyId: config.S3_ACCESS_KEY_ID,
    secretAccessKey: config.S3_SECRET_ACCESS_KEY,
  });
}
