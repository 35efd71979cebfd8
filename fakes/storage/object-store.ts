import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync, renameSync } from 'node:fs';
import { join } from 'node:path';
import { readJsonFile, writeJsonFile } from '../support/json-file.ts';
import type { CorsRule } from './cors.ts';

/**
 * Buckets and objects on disk: `<root>/<bucket>/bucket.json` holds the bucket's settings;
 * each object is `objects/<sha256 of key>.bin` plus a `.json` beside it with key, type, ETag
 * and metadata. File names are hashes, so any key is safe on disk.
 */
export type StoredObject = {
  key: string;
  size: number;
  etag: string; // MD5 of the body, in quotes, as S3 answers it
  contentType: string;
  metadata: Record<string, string>;
  lastModified: string;
};

type BucketFile = { name: string; createdAt: string; cors: CorsRule[] };

const BUCKET_NAME = /^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/;

export class ObjectStore {
  constructor(private readonly root: string) {
    mkdirSync(root, { recursive: true });
  }

  static isValidBucketName(name: string): boolean {
    return BUCKET_NAME.test(name) && !name.includes('..');
  }

  private bucketDir(bucket: string) {
    return join(this.root, bucket);
  }

  private objectPaths(bucket: string, key: string) {
    const id = createHash('sha256').update(key).digest('hex');
    const dir = join(this.bucketDir(bucket), 'objects');
    return { dir, body: join(dir, `${id}.bin`), meta: join(dir, `${id}.json`) };
  }

  bucket(bucket: string): BucketFile | undefined {
    if (!ObjectStore.isValidBucketName(bucket)) return undefined;
    return readJsonFile<BucketFile | undefined>(join(this.bucketDir(bucket), 'bucket.json'), undefined);
  }

  createBucket(bucket: string): 'created' | 'exists' {
    if (this.bucket(bucket)) return 'exists';
    writeJsonFile(join(this.bucketDir(bucket), 'bucket.json'), { name: bucket, createdAt: new Date().toISOString(), cors: [] });
    return 'created';
  }

  setCors(bucket: string, cors: CorsRule[]): void {
    const current = this.bucket(bucket);
    if (!current) throw new Error('no such bucket');
    writeJsonFile(join(this.bucketDir(bucket), 'bucket.json'), { ...current, cors });
  }

  put(bucket: string, key: string, body: Buffer, contentType: string, metadata: Record<string, string>): StoredObject {
    const paths = this.objectPaths(bucket, key);
    mkdirSync(paths.dir, { recursive: true });
    const object: StoredObject = {
      key,
      size: body.length,
      etag: `"${createHash('md5').update(body).digest('hex')}"`,
      contentType,
      metadata,
      lastModified: new Date().toISOString(),
    };
    // Body first, then the description: an object without its .json does not exist yet.
    const temporary = `${paths.body}.${process.pid}.tmp`;
    writeFileSync(temporary, body);
    renameSync(temporary, paths.body);
    writeJsonFile(paths.meta, object);
    return object;
  }

  head(bucket: string, key: string): StoredObject | undefined {
    return readJsonFile<StoredObject | undefined>(this.objectPaths(bucket, key).meta, undefined);
  }

  read(bucket: string, key: string): Buffer {
    return readFileSync(this.objectPaths(bucket, key).body);
  }

  delete(bucket: string, key: string): void {
    const paths = this.objectPaths(bucket, key);
    rmSync(paths.meta, { force: true });
    rmSync(paths.body, { force: true });
  }

  /** Every object of a bucket, sorted by key (S3 lists in UTF-8 binary order). */
  list(bucket: string): StoredObject[] {
    const dir = join(this.bucketDir(bucket), 'objects');
    if (!existsSync(dir)) return [];
    return readdirSync(dir)
      .filter((name) => name.endsWith('.json'))
      .map((name) => readJsonFile<StoredObject | undefined>(join(dir, name), undefined))
      .filter((o): o is StoredObject => Boolean(o))
      .sort((a, b) => Buffer.compare(Buffer.from(a.key), Buffer.from(b.key)));
  }
}
