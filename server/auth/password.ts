import argon2 from 'argon2';

/** argon2id with the library's defaults (m = 64 MiB, t = 3, p = 4), as OWASP's guidance allows. */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, { type: argon2.argon2id });
}

export async function verifyPassword(hash: string | null, password: string): Promise<boolean> {
  if (!hash) return false;
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

/**
 * A fixed hash to verify against when the account does not exist, so an unknown e-mail takes as
 * long to refuse as a wrong password (no account discovery by timing).
 */
let dummyHash: Promise<string> | undefined;
export function dummyPasswordHash(): Promise<string> {
  return (dummyHash ??= hashPassword('not-a-real-password-0000'));
}
