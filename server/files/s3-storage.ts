import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, NoSuchKey, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { assertStorageKey, isStorageKey, type FileStorage } from './storage';

export interface S3Settings {
  bucket: string;
  region: string;
  /** An S3-compatible service's address (MinIO, R2, a local fake); unset for AWS itself. */
  endpoint?: string;
  /** Both or neither; without them the SDK's usual chain (environment, instance role) is used. */
  accessKeyId?: string;
  secretAccessKey?: string;
}

/**
 * Objects in one bucket of an S3-compatible service. Objects are private (no ACL is set, so the
 * bucket's default applies: keep the bucket private); the app streams them after its own checks.
 */
export function s3Storage(settings: S3Settings): FileStorage {
  const client = new S3Client({
    region: settings.region,
    // S3-compatible services: bucket in the path (not the host name), and checksums only where S3
    // requires them, since not every such service understands the SDK's newer default checksum headers.
    ...(settings.endpoint
      ? { endpoint: settings.endpoint, forcePathStyle: true, requestChecksumCalculation: 'WHEN_REQUIRED' as const, responseChecksumValidation: 'WHEN_REQUIRED' as const }
      : {}),
    ...(settings.accessKeyId && settings.secretAccessKey
      ? { credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey } }
      : {}),
  });
  const Bucket = settings.bucket;
  return {
    kind: 's3',
    async put(key, bytes, contentType) {
      assertStorageKey(key);
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.length }));
    },
    async get(key) {
      assertStorageKey(key);
      try {
        const res = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        if (!res.Body) return null;
        return Buffer.from(await res.Body.transformToByteArray());
      } catch (err) {
        if (err instanceof NoSuchKey || (err as { name?: string }).name === 'NoSuchKey') return null;
        throw err;
      }
    },
    async delete(key) {
      assertStorageKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
    async *list() {
      let ContinuationToken: string | undefined;
      do {
        const res = await client.send(new ListObjectsV2Command({ Bucket, ContinuationToken }));
        yield (res.Contents ?? [])
          .filter((o) => o.Key !== undefined && isStorageKey(o.Key))
          .map((o) => ({ key: o.Key!, modifiedAt: o.LastModified ?? new Date(0) }));
        ContinuationToken = res.IsTruncated ? res.NextContinuationToken : undefined;
      } while (ContinuationToken);
    },
  };
}
