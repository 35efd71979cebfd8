import { z } from 'zod';
import { AppError } from '../../../../shared/errors.ts';
import { apiFetch } from '../../../lib/api-client.ts';

const csrfSchema = z.object({ csrfToken: z.string() });
const redirectSchema = z.object({ url: z.string() });

/**
 * Password sign-in through the sign-in service's form flow: fetch a CSRF token, post the form,
 * read where it would redirect. A redirect carrying `error=` means the sign-in was refused.
 */
export async function signInWithPassword(email: string, password: string): Promise<void> {
  const { csrfToken } = await apiFetch('/api/auth/csrf', { schema: csrfSchema });
  const response = await fetch('/api/auth/callback/credentials', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-auth-return-redirect': '1' },
    body: new URLSearchParams({ csrfToken, email, password }),
    credentials: 'same-origin',
  });
  const parsed = redirectSchema.safeParse(await response.json().catch(() => null));
  if (!response.ok || !parsed.success) throw new AppError('INTERNAL', 'Sign-in is not available right now. Please try again.');
  if (new URL(parsed.data.url, window.location.origin).searchParams.has('error')) {
    throw new AppError('UNAUTHENTICATED', 'That e-mail address and password do not match an account.');
  }
}
