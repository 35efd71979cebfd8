import type { StoredObject } from './object-store.ts';
import type { CorsRule } from './cors.ts';

export const escapeXml = (value: string) =>
  value.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&apos;');

const HEAD = '<?xml version="1.0" encoding="UTF-8"?>\n';
const NS = 'http://s3.amazonaws.com/doc/2006-03-01/';

/** S3's error document. */
export function errorXml(code: string, message: string, resource: string, requestId: string): string {
  return `${HEAD}<Error><Code>${escapeXml(code)}</Code><Message>${escapeXml(message)}</Message><Resource>${escapeXml(resource)}</Resource><RequestId>${requestId}</RequestId></Error>`;
}

export function listObjectsV2Xml(input: {
  bucket: string;
  prefix: string;
  delimiter?: string;
  maxKeys: number;
  objects: StoredObject[];
  commonPrefixes: string[];
  truncated: boolean;
  continuationToken?: string;
  nextContinuationToken?: string;
  startAfter?: string;
}): string {
  const contents = input.objects
    .map(
      (o) =>
        `<Contents><Key>${escapeXml(o.key)}</Key><LastModified>${o.lastModified}</LastModified><ETag>${escapeXml(o.etag)}</ETag><Size>${o.size}</Size><StorageClass>STANDARD</StorageClass></Contents>`,
    )
    .join('');
  const prefixes = input.commonPrefixes.map((p) => `<CommonPrefixes><Prefix>${escapeXml(p)}</Prefix></CommonPrefixes>`).join('');
  return (
    `${HEAD}<ListBucketResult xmlns="${NS}"><Name>${escapeXml(input.bucket)}</Name><Prefix>${escapeXml(input.prefix)}</Prefix>` +
    (input.delimiter ? `<Delimiter>${escapeXml(input.delimiter)}</Delimiter>` : '') +
    `<MaxKeys>${input.maxKeys}</MaxKeys><KeyCount>${input.objects.length + input.commonPrefixes.length}</KeyCount><IsTruncated>${input.truncated}</IsTruncated>` +
    (input.continuationToken ? `<ContinuationToken>${escapeXml(input.continuationToken)}</ContinuationToken>` : '') +
    (input.nextContinuationToken ? `<NextContinuationToken>${escapeXml(input.nextContinuationToken)}</NextContinuationToken>` : '') +
    (input.startAfter ? `<StartAfter>${escapeXml(input.startAfter)}</StartAfter>` : '') +
    `${contents}${prefixes}</ListBucketResult>`
  );
}

export function listBucketsXml(buckets: Array<{ name: string; createdAt: string }>): string {
  const items = buckets
    .map((b) => `<Bucket><Name>${escapeXml(b.name)}</Name><CreationDate>${b.createdAt}</CreationDate></Bucket>`)
    .join('');
  return `${HEAD}<ListAllMyBucketsResult xmlns="${NS}"><Owner><ID>local</ID><DisplayName>local</DisplayName></Owner><Buckets>${items}</Buckets></ListAllMyBucketsResult>`;
}

export function corsXml(rules: CorsRule[]): string {
  const body = rules
    .map(
      (r) =>
        '<CORSRule>' +
        r.allowedHeaders.map((h) => `<AllowedHeader>${escapeXml(h)}</AllowedHeader>`).join('') +
        r.allowedMethods.map((m) => `<AllowedMethod>${m}</AllowedMethod>`).join('') +
        r.allowedOrigins.map((o) => `<AllowedOrigin>${escapeXml(o)}</AllowedOrigin>`).join('') +
        r.exposeHeaders.map((h) => `<ExposeHeader>${escapeXml(h)}</ExposeHeader>`).join('') +
        (r.maxAgeSeconds === undefined ? '' : `<MaxAgeSeconds>${r.maxAgeSeconds}</MaxAgeSeconds>`) +
        '</CORSRule>',
    )
    .join('');
  return `${HEAD}<CORSConfiguration xmlns="${NS}">${body}</CORSConfiguration>`;
}
