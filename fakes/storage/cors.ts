import { XMLParser } from 'fast-xml-parser';

/** One rule of a bucket's CORS configuration, as PutBucketCors sends it. */
export type CorsRule = {
  allowedOrigins: string[];
  allowedMethods: string[];
  allowedHeaders: string[];
  exposeHeaders: string[];
  maxAgeSeconds?: number;
};

const asArray = <T>(value: T | T[] | undefined): T[] => (value === undefined ? [] : Array.isArray(value) ? value : [value]);

/** Parses a `<CORSConfiguration>` body; throws on a body that is not one. */
export function parseCorsConfiguration(xml: string): CorsRule[] {
  const parsed = new XMLParser({ ignoreAttributes: true, parseTagValue: false }).parse(xml) as {
    CORSConfiguration?: { CORSRule?: unknown };
  };
  if (!parsed.CORSConfiguration) throw new Error('not a CORSConfiguration');
  return asArray(parsed.CORSConfiguration.CORSRule as Record<string, string | string[]>[] | undefined).map((rule) => ({
    allowedOrigins: asArray(rule.AllowedOrigin),
    allowedMethods: asArray(rule.AllowedMethod).map((m) => m.toUpperCase()),
    allowedHeaders: asArray(rule.AllowedHeader).map((h) => h.toLowerCase()),
    exposeHeaders: asArray(rule.ExposeHeader),
    maxAgeSeconds: rule.MaxAgeSeconds === undefined ? undefined : Number(rule.MaxAgeSeconds),
  }));
}

/** An allowed origin or header may hold one `*` wildcard, as S3 allows. */
function wildcardMatch(pattern: string, value: string): boolean {
  if (pattern === '*') return true;
  const star = pattern.indexOf('*');
  if (star < 0) return pattern === value;
  return value.startsWith(pattern.slice(0, star)) && value.endsWith(pattern.slice(star + 1)) && value.length >= pattern.length - 1;
}

/** The first rule that allows this origin, method and request headers (S3 uses the first match). */
export function findCorsRule(rules: CorsRule[], origin: string, method: string, requestHeaders: string[] = []): CorsRule | undefined {
  return rules.find(
    (rule) =>
      rule.allowedOrigins.some((o) => wildcardMatch(o, origin)) &&
      rule.allowedMethods.includes(method.toUpperCase()) &&
      requestHeaders.every((h) => rule.allowedHeaders.some((allowed) => wildcardMatch(allowed, h.toLowerCase()))),
  );
}
