import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { AppError } from '@/lib/errors';
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

/**
 * A store that cannot be reached, times out or answers 5xx (after the SDK's retries) becomes a 503
 * for the learner, like a database that does not answer. A refused key or a missing bucket stays
 * an error for the logs: that is the operator's configuration, not a passing outage.
 */
function unavailableOr(error: unknown): unknown {
  const status = error instanceof S3ServiceException ? error.$metadata?.httpStatusCode : undefined;
  const code = (error as { code?: string; name?: string } | null)?.code ?? (error as { name?: string } | null)?.name ?? '';
  const network = ['ECONNREFUSED', 'ECONNRESET', 'EHOSTUNREACH', 'ENOTFOUND', 'ETIMEDOUT', 'EPIPE', 'TimeoutError', 'RequestTimeout'].includes(code);
  if (network || (status !== undefined && status >= 500)) {
    return new AppError('unavailable', 'The photo store cannot be reached right now. Please try again in a moment.');
  }
  return error;
}

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
    // Without these a store that stops answering would hold the request for good.
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 20_000 },
  });
  const send = async <T>(run: () => Promise<T>): Promise<T> => {
    try {
      return await run();
    } catch (error) {
      throw unavailableOr(error);
    }
  };
  const Bucket = options.bucket;
  return {
    name: 's3',
    async put(key, data, contentType) {
      assertKey(key);
      await send(() => client.send(new PutObjectCommand({ Bucket, Key: key, Body: data, ContentType: contentType, ContentLength: data.length })));
    },
    async get(key) {
      assertKey(key);
      try {
        const response = await send(() => client.send(new GetObjectCommand({ Bucket, Key: key })));
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
      await send(() => client.send(new DeleteObjectCommand({ Bucket, Key: key })));
    },
  };
}
