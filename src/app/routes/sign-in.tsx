import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { emailSchema } from '#shared/schemas/accounts.ts';
import { Card } from '#src/components/ui/card.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { getMe, meQueries } from '#src/features/auth/api/get-me.ts';
import { requestSignInLink, signInWithPassword } from '#src/features/auth/api/sign-in.ts';
import { useFieldErrors } from '#src/lib/use-field-errors.ts';

/** Only same-site paths are followed after sign-in, so a link cannot send people elsewhere. */
export function safeNext(next: string | null): string | undefined {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : undefined;
}

const passwordFormSchema = z.object({ email: emailSchema, password: z.string().min(1, 'Enter your password.') });
const linkFormSchema = z.object({ email: emailSchema });

/** What the sign-in service's redirects and our own links say, in words. */
const notices: Record<string, { tone: 'info' | 'error'; text: string }> = {
  'verified=1': { tone: 'info', text: 'Your e-mail address is confirmed. Sign in to continue.' },
  'verified=0': { tone: 'error', text: 'That confirmation link is not valid any more. Sign in; you can ask for a new one later.' },
  'error=Verification': { tone: 'error', text: 'That sign-in link has expired or was already used. Ask for a new one below.' },
};

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [mode, setMode] = useState<'password' | 'link'>('password');
  const form = useFieldErrors();
  const next = safeNext(params.get('next'));
  const notice = Object.entries(notices).find(([key]) => {
    const [name, value] = key.split('=');
    return params.get(name!) === value;
  })?.[1];

  async function onPassword(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const values = form.check(passwordFormSchema, Object.fromEntries(new FormData(event.currentTarget)));
    if (!values) return;
    await form.run(async () => {
      await signInWithPassword(values.email, values.password);
      const me = await queryClient.fetchQuery({ ...meQueries.current(), queryFn: ({ signal }) => getMe(signal), staleTime: 0 });
      const home = me.memberships[0] ? `/studio/${me.memberships[0].studioSlug}` : me.user?.isPlatformAdmin ? '/platform/studios' : '/';
      navigate(next ?? home, { replace: true });
    });
  }

  async function onLink(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const values = form.check(linkFormSchema, Object.fromEntries(new FormData(event.currentTarget)));
    if (!values) return;
    await form.run(async () => {
      await requestSignInLink(values.email, next ?? '/');
      navigate(`/sign-in/link-sent?to=${encodeURIComponent(values.email)}`);
    });
  }

  return (
    <>
      <section className="mx-auto max-w-md px-6 py-16">
        <h1 className="mb-6 text-3xl font-extrabold">Sign in</h1>
        {notice && (
          <div className="mb-4">
            <Notice tone={notice.tone}>{notice.text}</Notice>
          </div>
        )}
        <Card>
          <div
            role="tablist"
            aria-label="How to sign in"
            className="mb-5 grid grid-cols-2 gap-1 rounded-lg bg-birch-100 p-1 text-sm font-semibold"
          >
            {(['password', 'link'] as const).map((m) => (
              <button
                key={m}
                type="button"
                role="tab"
                aria-selected={mode === m}
                onClick={() => {
                  setMode(m);
                  form.clear();
                }}
                className={`rounded-md px-3 py-2 ${mode === m ? 'bg-white shadow-sm' : 'text-graphite-600'}`}
              >
                {m === 'password' ? 'With a password' : 'With an e-mailed link'}
              </button>
            ))}
          </div>
          <form onSubmit={mode === 'password' ? onPassword : onLink} className="flex flex-col gap-4" noValidate>
            {form.formError && <Notice tone="error">{form.formError}</Notice>}
            <TextField label="E-mail address" name="email" type="email" autoComplete="email" error={form.errors.email} />
            {mode === 'password' ? (
              <TextField label="Password" name="password" type="password" autoComplete="current-password" error={form.errors.password} />
            ) : (
              <p className="text-sm text-graphite-600">We will e-mail you a link that signs you in. It works once and for 30 minutes.</p>
            )}
            <Button type="submit" busy={form.busy} className="mt-2">
              {mode === 'password' ? 'Sign in' : 'E-mail me a link'}
            </Button>
          </form>
        </Card>
        <p className="mt-6 text-center text-sm text-graphite-600">
          New to Etchwell?{' '}
          <Link to="/open-a-studio" className="font-semibold text-ember-700 underline">
            Open a studio
          </Link>
        </p>
      </section>
    </>
  );
}

export function LinkSentPage() {
  const [params] = useSearchParams();
  return (
    <>
      <section className="mx-auto max-w-md px-6 py-16">
        <h1 className="mb-4 text-3xl font-extrabold">Check your inbox</h1>
        <Card>
          <p className="text-graphite-700">
            We sent a sign-in link
            {params.get('to') ? (
              <>
                {' '}
                to <strong>{params.get('to')}</strong>
              </>
            ) : null}
            . Open it on this device to sign in. It works once and for 30 minutes.
          </p>
          <p className="mt-4 text-sm text-graphite-500">
            Nothing arrived? Check the spam folder, or{' '}
            <Link to="/sign-in" className="font-semibold underline">
              ask for another link
            </Link>
            .
          </p>
        </Card>
      </section>
    </>
  );
}
