import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutBucketCorsCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { AppError } from '#shared/errors.ts';
import type { Env } from '../env.ts';

/**
 * Object storage through the S3 API: the local stand-in by default, any S3-compatible service
 * (AWS S3, MinIO…) by configuration. Keys are chosen by the app, never by users.
 */
export type Storage = ReturnType<typeof createStorage>;

const NETWORK_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EPIPE',
  'EAI_AGAIN',
]);

/**
 * A store that cannot be reached, or answers with a server error, is "unavailable" to the
 * caller: a 503 with words a person can act on, and the caller writes nothing. Other answers
 * (a missing object, a refused signature) pass through as they are.
 */
function unavailable(error: unknown): never {
  const e = error as { code?: string; name?: string; $metadata?: { httpStatusCode?: number }; cause?: { code?: string } };
  const status = e.$metadata?.httpStatusCode;
  const network =
    NETWORK_CODES.has(e.code ?? '') || NETWORK_CODES.has(e.cause?.code ?? '') || e.name === 'TimeoutError' || e.name === 'RequestTimeout';
  if (network || (status !== undefined && status >= 500)) {
    throw new AppError('SERVICE_UNAVAILABLE', 'File storage is not answering just now. Nothing was saved; please try again in a minute.', {
      cause: error,
    });
  }
  throw error;
}

export function createStorage(
  env: Pick<Env, 'S3_ENDPOINT' | 'S3_REGION' | 'S3_ACCESS_KEY_ID' | 'S3_SECRET_ACCESS_KEY' | 'S3_BUCKET' | 'S3_FORCE_PATH_STYLE'>,
) {
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT,
    region: env.S3_REGION,
    forcePathStyle: env.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY },
    // Checksums only where the API requires them: otherwise a presigned PUT would carry the
    // checksum of an empty body, which S3 rejects.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 2,
    // A store that stops answering must not hold requests open for long.
    requestHandler: { connectionTimeout: 3_000, requestTimeout: 30_000 },
  });
  const bucket = env.S3_BUCKET;
  const send: typeof client.send = ((command: Parameters<typeof client.send>[0]) =>
    client.send(command).catch(unavailable)) as typeof client.send;

  return {
    client,
    bucket,

    /**
     * A URL the browser can PUT one object to. Type and length are signed, so the upload must
     * send exactly those headers; the server still checks the object when it accepts it.
     */
    presignUpload(key: string, options: { contentType: string; contentLength: number; expiresInSeconds?: number }): Promise<string> {
      const command = new PutObjectCommand({
        Bucket: bucket,
        Key: key,
        ContentType: options.contentType,
        ContentLength: options.contentLength,
      });
      return getSignedUrl(client, command, {
        expiresIn: options.expiresInSeconds ?? 600,
        signableHeaders: new Set(['content-type', 'content-length']),
      });
    },

    /** A short-lived download URL, issued after the caller's permission check. */
    presignDownload(key: string, options: { expiresInSeconds?: number; downloadName?: string } = {}): Promise<string> {
      const command = new GetObjectCommand({
        Bucket: bucket,
        Key: key,
        ResponseContentDisposition: options.downloadName
          ? `attachment; filename="${options.downloadName.replace(/["\\\r\n]/g, '')}"`
          : undefined,
      });
      return getSignedUrl(client, command, { expiresIn: options.expiresInSeconds ?? 300 });
    },

    async put(key: string, body: Uint8Array, contentType: string, metadata: Record<string, string> = {}): Promise<{ etag: string }> {
      const result = await send(
        new PutObjectCommand({ Bucket: bucket, Key: key, Body: body, ContentType: contentType, Metadata: metadata }),
      );
      return { etag: result.ETag ?? '' };
    },

    async get(key: string): Promise<{ body: Uint8Array; contentType: string | undefined; metadata: Record<string, string> }> {
      const result = await send(new GetObjectCommand({ Bucket: bucket, Key: key }));
      return { body: await result.Body!.transformToByteArray(), contentType: result.ContentType, metadata: result.Metadata ?? {} };
    },

    /** Size and type of an object, or undefined when there is none. */
    async head(key: string): Promise<{ size: number; contentType: string | undefined; etag: string } | undefined> {
      try {
        const result = await send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
        return { size: result.ContentLength ?? 0, contentType: result.ContentType, etag: result.ETag ?? '' };
      } catch (error) {
        if (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404) return undefined;
        throw error;
      }
    },

    /** Keys under a prefix (all pages). */
    async list(prefix: string): Promise<string[]> {
      const keys: string[] = [];
      let token: string | undefined;
      do {
        const page = await send(new ListObjectsV2Command({ Bucket: bucket, Prefix: prefix, ContinuationToken: token }));
        keys.push(...(page.Contents ?? []).flatMap((object) => (object.Key ? [object.Key] : [])));
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
      return keys;
    },

    async remove(key: string): Promise<void> {
      await send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },

    /**
     * Creates the bucket when missing and lets browsers from `allowedOrigins` PUT and GET
     * (ETag exposed). For local stacks and first deployments; real buckets may be set up by ops.
     */
    async ensureBucket(allowedOrigins: string[]): Promise<void> {
      try {
        await send(new HeadBucketCommand({ Bucket: bucket }));
      } catch (error) {
        if (!(error instanceof S3ServiceException) || error.$metadata.httpStatusCode !== 404) throw error;
        await send(new CreateBucketCommand({ Bucket: bucket }));
      }
      await send(
        new PutBucketCorsCommand({
          Bucket: bucket,
          CORSConfiguration: {
            CORSRules: [
              {
                AllowedOrigins: allowedOrigins,
                AllowedMethods: ['PUT', 'GET', 'HEAD'],
                AllowedHeaders: ['content-type', 'content-length'],
                ExposeHeaders: ['ETag'],
                MaxAgeSeconds: 600,
              },
            ],
          },
        }),
      );
    },
  };
}
