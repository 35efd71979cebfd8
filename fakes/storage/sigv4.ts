import { createHash, createHmac, timingSafeEqual } from 'node:crypto';

/**
 * Verifies AWS Signature Version 4 on a received S3 request, header form (`Authorization:
 * AWS4-HMAC-SHA256 …`) and presigned-query form (`X-Amz-Signature=…`), following the published
 * SigV4 algorithm: canonical request → string to sign → HMAC chain. The canonical request is built
 * from the request's own SignedHeaders list, as S3 does (see DEVELOPERS.md for why this is not
 * done through the client-side signing library, which the tests use as the oracle instead).
 */

export type Credentials = Record<string, string>; // access key id → secret

export type ReceivedRequest = {
  method: string;
  /** The path exactly as received, still percent-encoded. */
  rawPath: string;
  /** The query string as received, without the leading '?'. */
  rawQuery: string;
  headers: Record<string, string | string[] | undefined>;
};

export type SigV4Result =
  | { ok: true; accessKeyId: string; payloadHash: string; presigned: boolean }
  | { ok: false; status: 403 | 400; code: string; message: string };

const ALGORITHM = 'AWS4-HMAC-SHA256';
const MAX_SKEW_MS = 15 * 60 * 1000;
const MAX_PRESIGN_SECONDS = 7 * 24 * 3600;

const sha256Hex = (data: string | Buffer) => createHash('sha256').update(data).digest('hex');
const hmac = (key: Buffer | string, data: string) => createHmac('sha256', key).update(data).digest();

/** RFC 3986 encoding as SigV4 wants it: unreserved characters kept, everything else %XX. */
export function uriEncode(value: string): string {
  return encodeURIComponent(value).replace(/[!'()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}

function parseQuery(rawQuery: string): Array<[string, string]> {
  if (!rawQuery) return [];
  return rawQuery
    .split('&')
    .filter(Boolean)
    .map((pair) => {
      const index = pair.indexOf('=');
      const key = index < 0 ? pair : pair.slice(0, index);
      const value = index < 0 ? '' : pair.slice(index + 1);
      const decode = (s: string) => decodeURIComponent(s.replace(/\+/g, '%20'));
      return [decode(key), decode(value)];
    });
}

function canonicalQuery(pairs: Array<[string, string]>): string {
  return pairs
    .map(([k, v]) => [uriEncode(k), uriEncode(v)] as const)
    .sort(([ak, av], [bk, bv]) => (ak < bk ? -1 : ak > bk ? 1 : av < bv ? -1 : av > bv ? 1 : 0))
    .map(([k, v]) => `${k}=${v}`)
    .join('&');
}

function headerValue(headers: ReceivedRequest['headers'], name: string): string | undefined {
  const value = headers[name];
  return Array.isArray(value) ? value.join(',') : value;
}

function amzDateToMs(amzDate: string): number {
  const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(amzDate);
  if (!m) return Number.NaN;
  return Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, +m[6]!);
}

function signature(secret: string, amzDate: string, scope: string, canonicalRequest: string): string {
  const [shortDate, region, service] = scope.split('/') as [string, string, string];
  const stringToSign = [ALGORITHM, amzDate, scope, sha256Hex(canonicalRequest)].join('\n');
  const key = hmac(hmac(hmac(hmac(`AWS4${secret}`, shortDate), region), service), 'aws4_request');
  return createHmac('sha256', key).update(stringToSign).digest('hex');
}

const denied = (code: string, message: string, status: 403 | 400 = 403): SigV4Result => ({ ok: false, status, code, message });

export function verifySigV4(request: ReceivedRequest, credentials: Credentials, now = Date.now()): SigV4Result {
  const query = parseQuery(request.rawQuery);
  const queryValue = (name: string) => query.find(([k]) => k === name)?.[1];
  const authorization = headerValue(request.headers, 'authorization');
  const presigned = queryValue('X-Amz-Signature') !== undefined;

  let credential: string, signedHeaders: string, givenSignature: string, amzDate: string, payloadHash: string;
  let signedQuery = query;
  if (presigned) {
    if (queryValue('X-Amz-Algorithm') !== ALGORITHM)
      return denied('AuthorizationQueryParametersError', 'X-Amz-Algorithm only supports "AWS4-HMAC-SHA256"', 400);
    credential = queryValue('X-Amz-Credential') ?? '';
    signedHeaders = queryValue('X-Amz-SignedHeaders') ?? '';
    givenSignature = queryValue('X-Amz-Signature') ?? '';
    amzDate = queryValue('X-Amz-Date') ?? '';
    const expires = Number(queryValue('X-Amz-Expires'));
    if (!Number.isInteger(expires) || expires < 1 || expires > MAX_PRESIGN_SECONDS) {
      return denied('AuthorizationQueryParametersError', 'X-Amz-Expires must be between 1 and 604800 seconds', 400);
    }
    const signedAt = amzDateToMs(amzDate);
    if (Number.isNaN(signedAt)) return denied('AuthorizationQueryParametersError', 'X-Amz-Date must be in the ISO8601 Long Format', 400);
    if (now > signedAt + expires * 1000) return denied('AccessDenied', 'Request has expired');
    if (signedAt - now > MAX_SKEW_MS) return denied('AccessDenied', 'Request is not valid yet');
    payloadHash = queryValue('X-Amz-Content-Sha256') ?? 'UNSIGNED-PAYLOAD';
    signedQuery = query.filter(([k]) => k !== 'X-Amz-Signature');
  } else if (authorization) {
    const m = /^AWS4-HMAC-SHA256 Credential=([^,]+),\s*SignedHeaders=([^,]+),\s*Signature=([0-9a-f]{64})$/.exec(authorization.trim());
    if (!m) return denied('AuthorizationHeaderMalformed', 'The authorization header is malformed.', 400);
    [, credential, signedHeaders, givenSignature] = m as unknown as [string, string, string, string];
    amzDate = headerValue(request.headers, 'x-amz-date') ?? '';
    const signedAt = amzDateToMs(amzDate);
    if (Number.isNaN(signedAt)) return denied('AccessDenied', 'AWS authentication requires a valid Date or x-amz-date header');
    if (Math.abs(now - signedAt) > MAX_SKEW_MS) {
      return denied('RequestTimeTooSkewed', 'The difference between the request time and the current time is too large.');
    }
    payloadHash = headerValue(request.headers, 'x-amz-content-sha256') ?? '';
    if (!payloadHash) return denied('InvalidRequest', 'Missing required header for this request: x-amz-content-sha256', 400);
  } else {
    return denied('AccessDenied', 'Access Denied');
  }

  const [accessKeyId, ...scopeParts] = credential.split('/');
  const scope = scopeParts.join('/');
  if (scopeParts.length !== 4 || scopeParts[3] !== 'aws4_request' || scopeParts[2] !== 's3') {
    return denied('AuthorizationHeaderMalformed', 'The credential scope is malformed.', 400);
  }
  if (!amzDate.startsWith(scopeParts[0]!)) return denied('SignatureDoesNotMatch', 'The credential date does not match the request date.');
  const secret = accessKeyId ? credentials[accessKeyId] : undefined;
  if (!secret) return denied('InvalidAccessKeyId', 'The AWS Access Key Id you provided does not exist in our records.');

  const names = signedHeaders.split(';');
  if (!names.includes('host')) return denied('AccessDenied', 'Host must be a signed header.');
  const canonicalHeaders = names
    .map((name) => `${name}:${(headerValue(request.headers, name) ?? '').trim().replace(/\s+/g, ' ')}\n`)
    .join('');
  const canonicalRequest = [
    request.method,
    request.rawPath || '/',
    canonicalQuery(signedQuery),
    canonicalHeaders,
    signedHeaders,
    payloadHash,
  ].join('\n');
  const expected = signature(secret, amzDate, scope, canonicalRequest);
  const matches = expected.length === givenSignature.length && timingSafeEqual(Buffer.from(expected), Buffer.from(givenSignature));
  if (!matches) {
    return denied(
      'SignatureDoesNotMatch',
      'The request signature we calculated does not match the signature you provided. Check your key and signing method.',
    );
  }
  return { ok: true, accessKeyId: accessKeyId!, payloadHash, presigned };
}
