import { createHash, randomBytes } from 'node:crypto';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { readdirSync } from 'node:fs';
import { close, listen } from '../support/listen.ts';
import { logLine, silentLogger, type RequestLogger } from '../support/request-log.ts';
import { findCorsRule, parseCorsConfiguration, type CorsRule } from './cors.ts';
import { ObjectStore } from './object-store.ts';
import { verifySigV4, type Credentials } from './sigv4.ts';
import { corsXml, errorXml, listBucketsXml, listObjectsV2Xml } from './xml.ts';

/**
 * A local S3-compatible object store with path-style addressing (`/bucket/key`), for
 * development and tests. It checks SigV4 signatures (header and presigned), answers CORS per
 * bucket, enforces a size limit per object and keeps objects on disk.
 */
export type StorageFakeOptions = {
  port?: number;
  host?: string;
  dataDir: string;
  credentials: Credentials;
  /** Largest object accepted, in bytes. */
  maxObjectBytes?: number;
  log?: RequestLogger;
  /** For tests: the clock used to check expiry and skew. */
  now?: () => number;
};

export type StorageFake = { url: string; port: number; stop(): Promise<void> };

class S3Error extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

const DEFAULT_MAX_OBJECT_BYTES = 50 * 1024 * 1024;

export async function startStorageFake(options: StorageFakeOptions): Promise<StorageFake> {
  const store = new ObjectStore(options.dataDir);
  const maxObjectBytes = options.maxObjectBytes ?? DEFAULT_MAX_OBJECT_BYTES;
  const log = options.log ?? silentLogger;
  const now = options.now ?? Date.now;

  const server: Server = createServer((req, res) => {
    const startedAt = Date.now();
    const requestId = randomBytes(8).toString('hex').toUpperCase();
    res.setHeader('x-amz-request-id', requestId);
    res.on('finish', () => log(logLine(req.method ?? '?', req.url ?? '/', res.statusCode, startedAt)));
    handle(req, res).catch((error: unknown) => {
      const s3 =
        error instanceof S3Error ? error : new S3Error(500, 'InternalError', 'We encountered an internal error. Please try again.');
      if (!(error instanceof S3Error)) console.warn('[fake:storage]', error);
      if (res.headersSent) return void res.destroy();
      const body = req.method === 'HEAD' ? undefined : errorXml(s3.code, s3.message, req.url ?? '/', requestId);
      res.writeHead(s3.status, { 'content-type': 'application/xml', connection: req.complete ? 'keep-alive' : 'close' });
      res.end(body);
      // Whatever is left of a refused upload is not read: drop the connection after answering.
      if (!req.complete) req.destroy();
    });
  });

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = req.url ?? '/';
    const queryIndex = url.indexOf('?');
    const rawPath = queryIndex < 0 ? url : url.slice(0, queryIndex);
    const rawQuery = queryIndex < 0 ? '' : url.slice(queryIndex + 1);
    const query = new URLSearchParams(rawQuery);
    const [rawBucket = '', ...rawKey] = rawPath.slice(1).split('/');
    const bucket = decodeURIComponent(rawBucket);
    const key = rawKey.length ? decodeURIComponent(rawKey.join('/')) : '';
    const method = req.method ?? 'GET';
    const origin = req.headers.origin;

    if (method === 'OPTIONS') return preflight(req, res, bucket);

    const auth = verifySigV4({ method, rawPath, rawQuery, headers: req.headers }, options.credentials, now());
    if (!auth.ok) throw new S3Error(auth.status, auth.code, auth.message);

    const bucketFile = bucket ? store.bucket(bucket) : undefined;
    if (bucketFile && origin) applyCors(res, bucketFile.cors, origin, method);

    if (!bucket) {
      if (method !== 'GET') throw new S3Error(405, 'MethodNotAllowed', 'The specified method is not allowed against this resource.');
      const buckets = readdirSync(options.dataDir)
        .map((name) => store.bucket(name))
        .filter((b) => b !== undefined);
      return sendXml(res, 200, listBucketsXml(buckets));
    }

    if (!key) {
      if (method === 'PUT' && query.has('cors')) {
        requireBucket(bucketFile, bucket);
        const body = await readBody(req, 64 * 1024, auth.payloadHash);
        let rules: CorsRule[];
        try {
          rules = parseCorsConfiguration(body.toString('utf8'));
        } catch {
          throw new S3Error(
            400,
            'MalformedXML',
            'The XML you provided was not well-formed or did not validate against our published schema.',
          );
        }
        store.setCors(bucket, rules);
        return void res.writeHead(200).end();
      }
      if (method === 'GET' && query.has('cors')) {
        requireBucket(bucketFile, bucket);
        if (!bucketFile.cors.length) throw new S3Error(404, 'NoSuchCORSConfiguration', 'The CORS configuration does not exist');
        return sendXml(res, 200, corsXml(bucketFile.cors));
      }
      if (method === 'PUT') {
        await readBody(req, 64 * 1024, auth.payloadHash);
        if (!ObjectStore.isValidBucketName(bucket)) throw new S3Error(400, 'InvalidBucketName', 'The specified bucket is not valid.');
        if (store.createBucket(bucket) === 'exists') {
          throw new S3Error(
            409,
            'BucketAlreadyOwnedByYou',
            'Your previous request to create the named bucket succeeded and you already own it.',
          );
        }
        return void res.writeHead(200, { location: `/${bucket}` }).end();
      }
      if (method === 'HEAD') {
        requireBucket(bucketFile, bucket);
        return void res.writeHead(200, { 'x-amz-bucket-region': 'us-east-1' }).end();
      }
      if (method === 'GET') {
        requireBucket(bucketFile, bucket);
        return listObjects(res, bucket, query);
      }
      throw new S3Error(405, 'MethodNotAllowed', 'The specified method is not allowed against this resource.');
    }

    requireBucket(bucketFile, bucket);
    switch (method) {
      case 'PUT':
        return putObject(req, res, bucket, key, auth.payloadHash);
      case 'GET':
      case 'HEAD':
        return getObject(req, res, bucket, key, method === 'HEAD');
      case 'DELETE':
        store.delete(bucket, key);
        return void res.writeHead(204).end();
      default:
        throw new S3Error(405, 'MethodNotAllowed', 'The specified method is not allowed against this resource.');
    }
  }

  function requireBucket(found: unknown, bucket: string): asserts found {
    if (!found) throw new S3Error(404, 'NoSuchBucket', `The specified bucket does not exist: ${bucket}`);
  }

  function preflight(req: IncomingMessage, res: ServerResponse, bucket: string): void {
    const origin = req.headers.origin;
    const requestedMethod = req.headers['access-control-request-method'];
    if (!origin || typeof requestedMethod !== 'string') {
      throw new S3Error(400, 'BadRequest', 'Insufficient information. Origin request header needed.');
    }
    const requestedHeaders = String(req.headers['access-control-request-headers'] ?? '')
      .split(',')
      .map((h) => h.trim())
      .filter(Boolean);
    const rule = findCorsRule(store.bucket(bucket)?.cors ?? [], origin, requestedMethod, requestedHeaders);
    if (!rule)
      throw new S3Error(
        403,
        'AccessForbidden',
        "CORSResponse: This CORS request is not allowed. This is usually because the evalution of Origin, request method / Access-Control-Request-Method or Access-Control-Request-Headers are not whitelisted by the resource's CORS spec.",
      );
    res.writeHead(200, {
      'access-control-allow-origin': rule.allowedOrigins.includes('*') ? '*' : origin,
      'access-control-allow-methods': rule.allowedMethods.join(', '),
      ...(requestedHeaders.length ? { 'access-control-allow-headers': requestedHeaders.join(', ') } : {}),
      ...(rule.exposeHeaders.length ? { 'access-control-expose-headers': rule.exposeHeaders.join(', ') } : {}),
      ...(rule.maxAgeSeconds !== undefined ? { 'access-control-max-age': String(rule.maxAgeSeconds) } : {}),
      vary: 'Origin, Access-Control-Request-Headers, Access-Control-Request-Method',
    });
    res.end();
  }

  function applyCors(res: ServerResponse, rules: CorsRule[], origin: string, method: string): void {
    const rule = findCorsRule(rules, origin, method);
    if (!rule) return;
    res.setHeader('access-control-allow-origin', rule.allowedOrigins.includes('*') ? '*' : origin);
    if (rule.exposeHeaders.length) res.setHeader('access-control-expose-headers', rule.exposeHeaders.join(', '));
    res.setHeader('vary', 'Origin');
  }

  /** Reads the body up to `limit` bytes and checks it against the signed payload hash. */
  async function readBody(req: IncomingMessage, limit: number, payloadHash: string): Promise<Buffer> {
    if (payloadHash.startsWith('STREAMING-')) {
      throw new S3Error(501, 'NotImplemented', 'Chunked (aws-chunked) uploads are not supported by this store; send the body whole.');
    }
    const declared = Number(req.headers['content-length'] ?? Number.NaN);
    if (declared > limit) throw tooLarge(limit);
    const chunks: Buffer[] = [];
    let size = 0;
    for await (const chunk of req) {
      size += (chunk as Buffer).length;
      if (size > limit) throw tooLarge(limit);
      chunks.push(chunk as Buffer);
    }
    const body = Buffer.concat(chunks);
    if (/^[0-9a-f]{64}$/.test(payloadHash) && createHash('sha256').update(body).digest('hex') !== payloadHash) {
      throw new S3Error(400, 'XAmzContentSHA256Mismatch', "The provided 'x-amz-content-sha256' header does not match what was computed.");
    }
    const md5 = req.headers['content-md5'];
    if (typeof md5 === 'string' && createHash('md5').update(body).digest('base64') !== md5) {
      throw new S3Error(400, 'BadDigest', 'The Content-MD5 you specified did not match what we received.');
    }
    return body;
  }

  const tooLarge = (limit: number) =>
    new S3Error(400, 'EntityTooLarge', `Your proposed upload exceeds the maximum allowed size of ${limit} bytes.`);

  async function putObject(req: IncomingMessage, res: ServerResponse, bucket: string, key: string, payloadHash: string): Promise<void> {
    if (req.headers['x-amz-copy-source']) throw new S3Error(501, 'NotImplemented', 'CopyObject is not supported by this store.');
    if (Buffer.byteLength(key) > 1024) throw new S3Error(400, 'KeyTooLongError', 'Your key is too long');
    const body = await readBody(req, maxObjectBytes, payloadHash);
    const metadata: Record<string, string> = {};
    for (const [name, value] of Object.entries(req.headers)) {
      if (name.startsWith('x-amz-meta-') && typeof value === 'string') metadata[name.slice('x-amz-meta-'.length)] = value;
    }
    const stored = store.put(bucket, key, body, String(req.headers['content-type'] ?? 'binary/octet-stream'), metadata);
    res.writeHead(200, { etag: stored.etag }).end();
  }

  function getObject(req: IncomingMessage, res: ServerResponse, bucket: string, key: string, headOnly: boolean): void {
    const object = store.head(bucket, key);
    if (!object) throw new S3Error(404, 'NoSuchKey', 'The specified key does not exist.');
    const headers: Record<string, string> = {
      'content-type': object.contentType,
      etag: object.etag,
      'last-modified': new Date(object.lastModified).toUTCString(),
      'accept-ranges': 'bytes',
    };
    for (const [name, value] of Object.entries(object.metadata)) headers[`x-amz-meta-${name}`] = value;
    // As S3 does for signed requests: response-content-disposition and friends override the stored headers.
    const query = new URL(req.url ?? '/', 'http://store').searchParams;
    for (const header of ['content-type', 'content-disposition', 'cache-control', 'content-language', 'expires', 'content-encoding']) {
      const override = query.get(`response-${header}`);
      if (override) headers[header] = override;
    }
    const ifNoneMatch = req.headers['if-none-match'];
    if (ifNoneMatch && ifNoneMatch === object.etag) return void res.writeHead(304, headers).end();

    const range = parseRange(req.headers.range, object.size);
    if (range === 'invalid') throw new S3Error(416, 'InvalidRange', 'The requested range is not satisfiable');
    if (headOnly) return void res.writeHead(200, { ...headers, 'content-length': String(object.size) }).end();
    const body = store.read(bucket, key);
    if (!range) return void res.writeHead(200, { ...headers, 'content-length': String(object.size) }).end(body);
    const part = body.subarray(range.start, range.end + 1);
    res.writeHead(206, {
      ...headers,
      'content-length': String(part.length),
      'content-range': `bytes ${range.start}-${range.end}/${object.size}`,
    });
    res.end(part);
  }

  function listObjects(res: ServerResponse, bucket: string, query: URLSearchParams): void {
    if (query.get('list-type') !== '2')
      throw new S3Error(501, 'NotImplemented', 'Only ListObjectsV2 (list-type=2) is supported by this store.');
    const prefix = query.get('prefix') ?? '';
    const delimiter = query.get('delimiter') || undefined;
    const maxKeys = Math.min(Math.max(Number(query.get('max-keys') ?? 1000) || 0, 0), 1000);
    const continuationToken = query.get('continuation-token') ?? undefined;
    const startAfter = query.get('start-after') ?? undefined;
    const after = continuationToken ? Buffer.from(continuationToken, 'base64url').toString('utf8') : startAfter;

    const objects = [] as ReturnType<ObjectStore['list']>;
    const commonPrefixes: string[] = [];
    let truncated = false;
    let lastKey: string | undefined;
    for (const object of store.list(bucket)) {
      if (!object.key.startsWith(prefix)) continue;
      if (after !== undefined && Buffer.compare(Buffer.from(object.key), Buffer.from(after)) <= 0) continue;
      const rest = object.key.slice(prefix.length);
      const cut = delimiter ? rest.indexOf(delimiter) : -1;
      const commonPrefix = cut >= 0 ? prefix + rest.slice(0, cut + delimiter!.length) : undefined;
      if (commonPrefix && commonPrefixes.includes(commonPrefix)) continue;
      if (objects.length + commonPrefixes.length >= maxKeys) {
        truncated = true;
        break;
      }
      if (commonPrefix) commonPrefixes.push(commonPrefix);
      else objects.push(object);
      lastKey = commonPrefix ?? object.key;
    }
    const nextContinuationToken = truncated && lastKey ? Buffer.from(lastKey).toString('base64url') : undefined;
    sendXml(
      res,
      200,
      listObjectsV2Xml({
        bucket,
        prefix,
        delimiter,
        maxKeys,
        objects,
        commonPrefixes,
        truncated,
        continuationToken,
        nextContinuationToken,
        startAfter,
      }),
    );
  }

  const port = await listen(server, options.port ?? 0, options.host ?? '127.0.0.1');
  return { url: `http://${options.host ?? '127.0.0.1'}:${port}`, port, stop: () => close(server) };
}

function sendXml(res: ServerResponse, status: number, xml: string): void {
  res.writeHead(status, { 'content-type': 'application/xml' }).end(xml);
}

/** `bytes=a-b`, `bytes=a-` or `bytes=-n` (RFC 9110 §14.1.2); anything else is ignored as S3 does. */
function parseRange(header: string | undefined, size: number): { start: number; end: number } | 'invalid' | undefined {
  if (!header) return undefined;
  const m = /^bytes=(\d*)-(\d*)$/.exec(header.trim());
  if (!m || (m[1] === '' && m[2] === '')) return undefined;
  if (m[1] === '') {
    const suffix = Number(m[2]);
    if (suffix === 0) return 'invalid';
    return { start: Math.max(size - suffix, 0), end: size - 1 };
  }
  const start = Number(m[1]);
  const end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
  if (start >= size || end < start) return 'invalid';
  return { start, end };
}
