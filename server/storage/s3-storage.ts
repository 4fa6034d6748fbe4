import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client, type S3ClientConfig } from '@aws-sdk/client-s3';

import { assertValidKey, DEFAULT_CONTENT_TYPE, type PhotoStorage } from './storage';

export interface S3StorageOptions {
  bucket: string;
  region: string;
  /** For S3-compatible services (MinIO, R2, a local fake); omit for AWS. */
  endpoint?: string;
  /** Omit both to use the SDK's default chain (env vars, instance role). */
  accessKeyId?: string;
  secretAccessKey?: string;
  /** `endpoint/bucket/key` URLs instead of `bucket.endpoint/key`; most non-AWS services need it. */
  forcePathStyle?: boolean;
}

export function createS3Storage(options: S3StorageOptions): PhotoStorage {
  const { bucket, region, endpoint, accessKeyId, secretAccessKey, forcePathStyle } = options;
  if ((accessKeyId === undefined) !== (secretAccessKey === undefined)) {
    throw new Error('S3 storage needs both accessKeyId and secretAccessKey, or neither');
  }

  const config: S3ClientConfig = { region, forcePathStyle: forcePathStyle ?? false };
  if (endpoint !== undefined) {
    config.endpoint = endpoint;
    // Newer SDKs add CRC checksums to every upload by default, which several
    // S3-compatible services still reject; only send them when the operation
    // requires it. AWS itself is left on the SDK defaults.
    config.requestChecksumCalculation = 'WHEN_REQUIRED';
    config.responseChecksumValidation = 'WHEN_REQUIRED';
  }
  if (accessKeyId !== undefined && secretAccessKey !== undefined) {
    config.credentials = { accessKeyId, secretAccessKey };
  }
  const client = new S3Client(config);

  return {
    kind: 's3',

    async put(key, data, contentType) {
      assertValidKey(key);
      await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: data, ContentType: contentType }));
    },

    async get(key) {
      assertValidKey(key);
      try {
        const response = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        if (response.Body === undefined) return null;
        const bytes = await response.Body.transformToByteArray();
        return {
          data: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength),
          contentType: response.ContentType ?? DEFAULT_CONTENT_TYPE,
        };
      } catch (error) {
        // Only a missing key means "no photo"; a missing bucket or a denied
        // request is a misconfiguration and must surface.
        if (error instanceof NoSuchKey) return null;
        throw error;
      }
    },

    async delete(key) {
      assertValidKey(key);
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },
  };
}
