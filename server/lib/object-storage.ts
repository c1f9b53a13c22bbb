import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { AppConfig } from '../config';
import { HttpError } from './http-error';

export type StoredObject = { body: Buffer; contentType: string | undefined };

const NETWORK_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN']);

/** The store could not be reached, or answered that it is unavailable: a retry later may succeed. */
export const storageUnavailable = () => new HttpError(503, 'storage_unavailable', 'Photo storage cannot be reached just now. Nothing was saved; try again in a minute.');

/** A network failure or a 5xx from the store (after the SDK's own retries), as opposed to an answer about the object. */
export function isStorageOutage(err: unknown): boolean {
  const e = err as { code?: string; name?: string; $metadata?: { httpStatusCode?: number } } | null;
  if (!e) return false;
  const status = e.$metadata?.httpStatusCode;
  if (status !== undefined) return status >= 500;
  return NETWORK_CODES.has(e.code ?? '') || e.name === 'TimeoutError';
}

async function unlessDown<T>(call: Promise<T>): Promise<T> {
  try {
    return await call;
  } catch (err) {
    throw isStorageOutage(err) ? storageUnavailable() : err;
  }
}

/** Photo storage through the real S3 SDK; in development and tests the endpoint is the local fake on loopback. */
export function createObjectStorage(config: Pick<AppConfig, 'S3_ENDPOINT' | 'S3_REGION' | 'S3_BUCKET' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY'>) {
  const client = new S3Client({
    endpoint: config.S3_ENDPOINT,
    region: config.S3_REGION,
    credentials: { accessKeyId: config.S3_ACCESS_KEY_ID, secretAccessKey: config.S3_SECRET_ACCESS_KEY },
    forcePathStyle: true,
    // Without these, newer SDKs stream uploads with chunk framing that S3-compatible fakes store inside the object.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  const Bucket = config.S3_BUCKET;

  return {
    async put(key: string, body: Buffer, contentType: string) {
      await unlessDown(client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length })));
    },
    async get(key: string): Promise<StoredObject> {
      const res = await unlessDown(client.send(new GetObjectCommand({ Bucket, Key: key })));
      const bytes = await res.Body!.transformToByteArray();
      return { body: Buffer.from(bytes), contentType: res.ContentType };
    },
    async delete(key: string) {
      await unlessDown(client.send(new DeleteObjectCommand({ Bucket, Key: key })));
    },
    async list(prefix: string): Promise<{ key: string; lastModified: Date }[]> {
      const out: { key: string; lastModified: Date }[] = [];
      let token: string | undefined;
      do {
        const res = await unlessDown(client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix, ContinuationToken: token })));
        for (const o of res.Contents ?? []) if (o.Key) out.push({ key: o.Key, lastModified: o.LastModified ?? new Date(0) });
        token = res.IsTruncated ? res.NextContinuationToken : undefined;
      } while (token);
      return out;
    },
    destroy: () => client.destroy(),
  };
}

export type ObjectStorage = ReturnType<typeof createObjectStorage>;
