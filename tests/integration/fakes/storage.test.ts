import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, S3ServiceException } from '@aws-sdk/client-s3';
import { startStorageFake, type StorageFake } from '#fakes/storage/server.ts';
import { createStorage } from '#server/adapters/storage.ts';
import { loadEnv } from '#server/env.ts';
import { settle, temporaryDataDir } from '#tests/support/fakes.ts';

// Behaviour follows the Amazon S3 API Reference (PutObject, GetObject, HeadObject, DeleteObject,
// ListObjectsV2, PutBucketCors, "Error responses") and the S3 User Guide ("Sharing objects with
// presigned URLs", "Using cross-origin resource sharing (CORS)").
const KEYS = { S3_ACCESS_KEY_ID: 'test-key', S3_SECRET_ACCESS_KEY: 'test-secret' };
const APP_ORIGIN = 'http://127.0.0.1:3000';

describe('object storage stand-in, through the AWS SDK', () => {
  const data = temporaryDataDir('storage');
  let fake: StorageFake;
  let clockOffsetMs = 0;
  const start = (port = 0) =>
    startStorageFake({
      port,
      dataDir: data.dir,
      credentials: { [KEYS.S3_ACCESS_KEY_ID]: KEYS.S3_SECRET_ACCESS_KEY },
      maxObjectBytes: 64 * 1024,
      now: () => Date.now() + clockOffsetMs,
    });
  const storageWith = (overrides: Record<string, string> = {}) =>
    createStorage(loadEnv({ S3_ENDPOINT: fake.url, S3_BUCKET: 'photos', ...KEYS, ...overrides }));

  beforeAll(async () => {
    fake = await start();
    await storageWith().ensureBucket([APP_ORIGIN]);
  });
  afterAll(async () => {
    await fake.stop();
    data.remove();
  });

  it('takes a browser-style PUT to a presigned URL and serves the same bytes and type to the SDK', async () => {
    const storage = storageWith();
    const body = Buffer.from('a small test image body');
    const url = await storage.presignUpload('studios/s1/photos/p1/original', { contentType: 'image/jpeg', contentLength: body.length });
    const put = await fetch(url, { method: 'PUT', body, headers: { 'content-type': 'image/jpeg' } });
    expect(put.status).toBe(200);
    // ETag is the MD5 of the body for single-part uploads (PutObject reference).
    expect(put.headers.get('etag')).toBe(`"${createHash('md5').update(body).digest('hex')}"`);
    const got = await storage.get('studios/s1/photos/p1/original');
    expect(Buffer.from(got.body)).toEqual(body);
    expect(got.contentType).toBe('image/jpeg');
  });

  it('refuses a presigned PUT whose type differs from the signed one', async () => {
    const url = await storageWith().presignUpload('k/typed', { contentType: 'image/png', contentLength: 3 });
    const put = await fetch(url, { method: 'PUT', body: 'abc', headers: { 'content-type': 'text/html' } });
    expect(put.status).toBe(403);
    expect(await put.text()).toContain('<Code>SignatureDoesNotMatch</Code>');
  });

  it('answers 403 with an S3 error document for a tampered signature', async () => {
    const url = new URL(await storageWith().presignDownload('studios/s1/photos/p1/original'));
    const signature = url.searchParams.get('X-Amz-Signature')!;
    url.searchParams.set('X-Amz-Signature', (signature[0] === 'a' ? 'b' : 'a') + signature.slice(1));
    const res = await fetch(url);
    expect(res.status).toBe(403);
    expect(res.headers.get('content-type')).toBe('application/xml');
    expect(await res.text()).toMatch(/<Error><Code>SignatureDoesNotMatch<\/Code><Message>[^<]+<\/Message>/);
  });

  it('answers 403 for a URL signed with the wrong secret, and for an unknown key', async () => {
    const wrongSecret = await storageWith({ S3_SECRET_ACCESS_KEY: 'not-the-secret' }).presignDownload('studios/s1/photos/p1/original');
    expect((await fetch(wrongSecret)).status).toBe(403);
    const unknownKey = await fetch(await storageWith({ S3_ACCESS_KEY_ID: 'nobody' }).presignDownload('studios/s1/photos/p1/original'));
    expect(unknownKey.status).toBe(403);
    expect(await unknownKey.text()).toContain('<Code>InvalidAccessKeyId</Code>');
  });

  it('answers 403 "Request has expired" once a presigned URL is past its expiry', async () => {
    const url = await storageWith().presignDownload('studios/s1/photos/p1/original', { expiresInSeconds: 60 });
    expect((await fetch(url)).status).toBe(200);
    clockOffsetMs = 61_000;
    try {
      const res = await fetch(url);
      expect(res.status).toBe(403);
      expect(await res.text()).toContain('<Message>Request has expired</Message>');
    } finally {
      clockOffsetMs = 0;
    }
  });

  it('raises the SDK error for header-signed calls with a wrong secret', async () => {
    const error = await storageWith({ S3_SECRET_ACCESS_KEY: 'nope' })
      .get('studios/s1/photos/p1/original')
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(S3ServiceException);
    expect((error as S3ServiceException).name).toBe('SignatureDoesNotMatch');
    expect((error as S3ServiceException).$metadata.httpStatusCode).toBe(403);
  });

  it('answers a CORS preflight from the app’s origin, exposing ETag, and refuses another origin', async () => {
    const objectUrl = `${fake.url}/photos/studios/s1/photos/p2/original`;
    const allowed = await fetch(objectUrl, {
      method: 'OPTIONS',
      headers: { origin: APP_ORIGIN, 'access-control-request-method': 'PUT', 'access-control-request-headers': 'content-type' },
    });
    expect(allowed.status).toBe(200);
    expect(allowed.headers.get('access-control-allow-origin')).toBe(APP_ORIGIN);
    expect(allowed.headers.get('access-control-allow-methods')).toContain('PUT');
    expect(allowed.headers.get('access-control-expose-headers')).toBe('ETag');
    const refused = await fetch(objectUrl, {
      method: 'OPTIONS',
      headers: { origin: 'https://elsewhere.example', 'access-control-request-method': 'PUT' },
    });
    expect(refused.status).toBe(403);
    expect(refused.headers.get('access-control-allow-origin')).toBeNull();
  });

  it('refuses a body over the per-object limit with EntityTooLarge', async () => {
    const body = Buffer.alloc(65 * 1024, 1);
    const url = await storageWith().presignUpload('k/too-big', { contentType: 'image/jpeg', contentLength: body.length });
    const res = await fetch(url, { method: 'PUT', body, headers: { 'content-type': 'image/jpeg' } });
    expect(res.status).toBe(400);
    expect(await res.text()).toContain('<Code>EntityTooLarge</Code>');
    expect(await storageWith().head('k/too-big')).toBeUndefined();
  });

  it('serves byte ranges, keeps metadata, lists with paging and deletes', async () => {
    const storage = storageWith();
    await storage.put('list/a', Buffer.from('0123456789'), 'text/plain', { studio: 's1' });
    await storage.put('list/b', Buffer.from('b'), 'text/plain');
    await storage.put('list/c', Buffer.from('c'), 'text/plain');

    const ranged = await storage.client.send(new GetObjectCommand({ Bucket: 'photos', Key: 'list/a', Range: 'bytes=2-5' }));
    expect(ranged.ContentRange).toBe('bytes 2-5/10');
    expect(await ranged.Body!.transformToString()).toBe('2345');
    expect((await storage.get('list/a')).metadata).toEqual({ studio: 's1' });
    expect(await storage.head('list/a')).toMatchObject({ size: 10, contentType: 'text/plain' });

    const first = await storage.client.send(new ListObjectsV2Command({ Bucket: 'photos', Prefix: 'list/', MaxKeys: 2 }));
    expect(first.Contents?.map((o) => o.Key)).toEqual(['list/a', 'list/b']);
    expect(first.IsTruncated).toBe(true);
    const second = await storage.client.send(
      new ListObjectsV2Command({ Bucket: 'photos', Prefix: 'list/', ContinuationToken: first.NextContinuationToken }),
    );
    expect(second.Contents?.map((o) => o.Key)).toEqual(['list/c']);
    expect(second.IsTruncated).toBe(false);

    await storage.client.send(new DeleteObjectCommand({ Bucket: 'photos', Key: 'list/b' }));
    expect(await storage.head('list/b')).toBeUndefined();
    const missing = await storage.get('list/b').catch((e: unknown) => e);
    expect((missing as S3ServiceException).name).toBe('NoSuchKey');
  });

  it('keeps objects across a restart', async () => {
    await storageWith().put('durable/key', Buffer.from('still here'), 'text/plain');
    const port = fake.port;
    await fake.stop();
    await settle();
    fake = await start(port);
    expect(Buffer.from((await storageWith().get('durable/key')).body).toString()).toBe('still here');
  });
});
