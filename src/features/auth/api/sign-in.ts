import { z } from 'zod';
import { AppError, errorBodySchema } from '#shared/errors.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const csrfSchema = z.object({ csrfToken: z.string() });
const redirectSchema = z.object({ url: z.string() });

/**
 * Posts one of the sign-in service's forms (fetching its CSRF token first) and returns where it
 * would send the browser. Our own refusals (rate limits, bad input) come back as error bodies.
 */
async function postAuthForm(path: string, fields: Record<string, string>): Promise<URL> {
  const { csrfToken } = await apiFetch('/api/auth/csrf', { schema: csrfSchema });
  const response = await fetch(path, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-auth-return-redirect': '1' },
    body: new URLSearchParams({ csrfToken, ...fields }),
    credentials: 'same-origin',
  });
  const json: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const body = errorBodySchema.safeParse(json);
    if (body.success) throw new AppError(body.data.code, body.data.message, { issues: body.data.issues });
    throw new AppError('INTERNAL', 'Sign-in is not available right now. Please try again.');
  }
  const parsed = redirectSchema.safeParse(json);
  if (!parsed.success) throw new AppError('INTERNAL', 'Sign-in is not available right now. Please try again.');
  return new URL(parsed.data.url, window.location.origin);
}

export async function signInWithPassword(email: string, password: string): Promise<void> {
  const target = await postAuthForm('/api/auth/callback/credentials', { email, password });
  if (target.searchParams.has('error')) throw new AppError('UNAUTHENTICATED', 'That e-mail address and password do not match an account.');
}

/** Sends a sign-in link; after opening it, the browser lands on `next`. */
export async function requestSignInLink(email: string, next: string): Promise<void> {
  const target = await postAuthForm('/api/auth/signin/nodemailer', { email, callbackUrl: next });
  if (target.searchParams.has('error'))
    throw new AppError('SERVICE_UNAVAILABLE', 'The sign-in link could not be sent. Please try again in a moment.');
}

export async function signOut(): Promise<void> {
  await postAuthForm('/api/auth/signout', {});
}

export async function signOutEverywhere(): Promise<void> {
  await apiFetch('/api/me/sign-out-everywhere', { method: 'POST' });
}
