import { useState, type FormEvent } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { SiteLayout } from '../../components/layouts/site-layout.tsx';
import { Card } from '../../components/ui/card.tsx';
import { TextField } from '../../components/ui/text-field.tsx';
import { Button } from '../../components/ui/button.tsx';
import { Notice } from '../../components/ui/notice.tsx';
import { signInWithPassword } from '../../features/auth/api/sign-in.ts';
import { sessionQueries } from '../../features/auth/api/get-session.ts';

/** Only same-site paths are followed after sign-in, so the link cannot send people elsewhere. */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [error, setError] = useState<string>();
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    setError(undefined);
    try {
      await signInWithPassword(String(form.get('email')), String(form.get('password')));
      await queryClient.invalidateQueries({ queryKey: sessionQueries.current().queryKey });
      navigate(safeNext(params.get('next')), { replace: true });
    } catch (failure) {
      setError((failure as Error).message);
    } finally {
      setBusy(false);
    }
  }

  return (
    <SiteLayout>
      <section className="mx-auto max-w-md px-6 py-16">
        <h1 className="mb-6 text-3xl font-extrabold">Sign in</h1>
        <Card>
          <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
            {error && <Notice tone="error">{error}</Notice>}
            <TextField label="E-mail address" name="email" type="email" autoComplete="email" required />
            <TextField label="Password" name="password" type="password" autoComplete="current-password" required />
            <Button type="submit" busy={busy} className="mt-2">
              Sign in
            </Button>
          </form>
        </Card>
      </section>
    </SiteLayout>
  );
}
