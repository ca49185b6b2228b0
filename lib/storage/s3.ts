import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { assertKey, type StorageDriver } from './types';

export type S3DriverOptions = {
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** An S3-compatible service's address; omitted for AWS itself. */
  endpoint?: string;
  /** bucket in the path (http://host/bucket/key) instead of the host name; most self-hosted stores and the local fake want it. */
  forcePathStyle?: boolean;
};

const isMissing = (error: unknown) =>
  error instanceof S3ServiceException && (error.name === 'NoSuchKey' || error.name === 'NotFound' || error.$metadata?.httpStatusCode === 404);

/** Stores each object in one bucket of an S3-compatible service, so several app servers share the photos. */
export function s3Driver(options: S3DriverOptions): StorageDriver {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint,
    forcePathStyle: options.forcePathStyle ?? false,
    credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
    // Checksums only where the API requires them: several S3-compatible stores refuse the newer
    // default checksum headers, and photos are checked by content on the way in anyway.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
  });
  const Bucket = options.bucket;
  return {
    name: 's3',
    async put(key, data, contentType) {
      assertKey(key);
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: data, ContentType: contentType, ContentLength: data.length }));
    },
    async get(key) {
      assertKey(key);
      try {
        const response = await client.send(new GetObjectCommand({ Bucket, Key: key }));
        if (!response.Body) return null;
        const data = Buffer.from(await response.Body.transformToByteArray());
        return { data, contentType: response.ContentType ?? 'application/octet-stream' };
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      assertKey(key);
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
  };
}
