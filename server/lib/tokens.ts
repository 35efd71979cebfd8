import { createHash, randomBytes } from 'node:crypto';

/** A random token for a link (256 bits) and the SHA-256 that is stored in its place. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** `ada@example.com` → `a••@example.com`: enough to recognise, not enough to harvest. */
export function maskEmail(email: string): string {
  const [local = '', domain = ''] = email.split('@');
  return `${local.slice(0, 1)}••@${domain}`;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Ids in URLs are checked before they reach the database, which would refuse a malformed one. */
export const isUuid = (value: string) => UUID.test(value);
