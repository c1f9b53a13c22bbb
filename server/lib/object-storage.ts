import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import type { AppConfig } from '../config';

export type StoredObject = { body: Buffer; contentType: string | undefined };

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
      await client.send(new PutObjectCommand({ Bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.length }));
    },
    async get(key: string): Promise<StoredObject> {
      const res = await client.send(new GetObjectCommand({ Bucket, Key: key }));
      const bytes = await res.Body!.transformToByteArray();
      return { body: Buffer.from(bytes), contentType: res.ContentType };
    },
    async delete(key: string) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
    },
    async list(prefix: string): Promise<{ key: string; lastModified: Date }[]> {
      const out: { key: string; lastModified: Date }[] = [];
      let token: string | undefined;
      do {
        const res = await client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix, ContinuationToken: token }));
        for (const o of res.Contents ?? []) if (o.Key) out.push({ key: o.Key, lastModified: o.LastModified ?? new Date(0) });
        token = res.IsTruncated ? res.NextContinuationToken : undefined;
      } while (token);
      return out;
    },
    destroy: () => client.destroy(),
  };
}

export type ObjectStorage = ReturnType<typeof createObjectStorage>;
