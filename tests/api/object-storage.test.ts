import crypto from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startFakeS3 } from '../../fakes/s3';
import { createObjectStorage, type ObjectStorage } from '../../server/lib/object-storage';
import { freePort } from '../support/global-setup';

let fake: Awaited<ReturnType<typeof startFakeS3>>;
let storage: ObjectStorage;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lifeplate-s3-'));

beforeAll(async () => {
  fake = await startFakeS3({ port: await freePort(), directory: dir, bucket: 'photos-test' });
  storage = createObjectStorage({ S3_ENDPOINT: fake.endpoint, S3_REGION: 'us-east-1', S3_BUCKET: 'photos-test', S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER' });
});
afterAll(async () => {
  storage.destroy();
  await fake.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('object storage through the S3 SDK', () => {
  it('gives back exactly the bytes it was given', async () => {
    const bytes = crypto.randomBytes(200_000);
    await storage.put('t/roundtrip.bin', bytes, 'application/octet-stream');
    const back = await storage.get('t/roundtrip.bin');
    expect(back.body.length).toBe(200_000);
    expect(back.body.equals(bytes)).toBe(true);
    expect(back.contentType).toBe('application/octet-stream');
  });

  it('lists by prefix and deletes', async () => {
    await storage.put('list/a.jpg', Buffer.from('a'), 'image/jpeg');
    await storage.put('list/b.jpg', Buffer.from('b'), 'image/jpeg');
    expect((await storage.list('list/')).map((o) => o.key).sort()).toEqual(['list/a.jpg', 'list/b.jpg']);
    await storage.delete('list/a.jpg');
    expect((await storage.list('list/')).map((o) => o.key)).toEqual(['list/b.jpg']);
  });
});
