import type { FormEvent } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { acceptWithAccountInputSchema } from '#shared/schemas/team.ts';
import { AppError } from '#shared/errors.ts';
import { Card } from '#src/components/ui/card.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Button, buttonClasses } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { acceptInvite, acceptInviteWithAccount, useInvitePreview } from '#src/features/team/api/invites.ts';
import { useMe, meQueries } from '#src/features/auth/api/get-me.ts';
import { signInWithPassword } from '#src/features/auth/api/sign-in.ts';
import { useFieldErrors } from '#src/lib/use-field-errors.ts';

const roleWords = { owner: 'an owner', staff: 'a team member' } as const;
const closed = {
  used: 'This invitation has already been used.',
  revoked: 'This invitation was withdrawn. Ask the studio for a new one.',
  expired: 'This invitation has expired. Ask the studio for a new one.',
} as const;

/** The page an invite e-mail links to: join the studio, signing in or creating an account. */
export function InvitePage() {
  const { token = '' } = useParams();
  const preview = useInvitePreview(token);
  const me = useMe();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const form = useFieldErrors();

  const joined = async (studioSlug: string) => {
    await queryClient.invalidateQueries({ queryKey: meQueries.all });
    navigate(`/studio/${studioSlug}`, { replace: true });
  };

  const onJoin = () => form.run(async () => joined((await acceptInvite(token)).studioSlug));

  async function onCreateAccount(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const values = form.check(acceptWithAccountInputSchema, Object.fromEntries(new FormData(event.currentTarget)));
    if (!values) return;
    await form.run(async () => {
      const result = await acceptInviteWithAccount(token, values);
      await signInWithPassword(result.email, values.password);
      await joined(result.studioSlug);
    });
  }

  let body;
  if (preview.isPending || me.isPending) body = <p className="text-graphite-500">Opening the invitation…</p>;
  else if (preview.error)
    body = (
      <Notice tone="error">
        {preview.error instanceof AppError && preview.error.code === 'NOT_FOUND'
          ? preview.error.message
          : 'The invitation could not be opened. Please try again.'}
      </Notice>
    );
  else {
    const invite = preview.data;
    const user = me.data?.user;
    const intro = (
      <p className="mb-4 text-graphite-700">
        <strong>{invite.studioName}</strong> invites <strong>{invite.email}</strong> to join as {roleWords[invite.role]}.
      </p>
    );
    if (invite.status !== 'open') body = <Notice tone="error">{closed[invite.status]}</Notice>;
    else if (user && user.email === invite.email)
      body = (
        <>
          {intro}
          <Button onClick={onJoin} busy={form.busy}>
            Join {invite.studioName}
          </Button>
        </>
      );
    else if (user)
      body = (
        <>
          {intro}
          <Notice tone="caution">
            You are signed in as {user.email}. Sign out and sign in as {invite.email} to accept.
          </Notice>
        </>
      );
    else if (invite.hasAccount)
      body = (
        <>
          {intro}
          <Link to={`/sign-in?next=${encodeURIComponent(`/invites/${token}`)}`} className={buttonClasses()}>
            Sign in to accept
          </Link>
        </>
      );
    else
      body = (
        <>
          {intro}
          <form onSubmit={onCreateAccount} className="flex flex-col gap-4" noValidate>
            <p className="text-sm text-graphite-600">Create your account to join.</p>
            <TextField label="Your name" name="name" autoComplete="name" error={form.errors.name} />
            <TextField
              label="Choose a password"
              name="password"
              type="password"
              autoComplete="new-password"
              hint="At least 10 characters."
              error={form.errors.password}
            />
            <Button type="submit" busy={form.busy}>
              Create my account and join
            </Button>
          </form>
        </>
      );
  }

  return (
    <>
      <section className="mx-auto max-w-md px-6 py-16">
        <h1 className="mb-6 text-3xl font-extrabold">Invitation</h1>
        <Card>
          {form.formError && (
            <div className="mb-4">
              <Notice tone="error">{form.formError}</Notice>
            </div>
          )}
          {body}
        </Card>
      </section>
    </>
  );
}
