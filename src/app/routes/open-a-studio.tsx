import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { openStudioInputSchema } from '#shared/schemas/accounts.ts';
import { studioSlugSchema } from '#shared/studio.ts';
import { Card } from '#src/components/ui/card.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { openStudio, useSlugAvailability } from '#src/features/accounts/api/open-studio.ts';
import { signInWithPassword } from '#src/features/auth/api/sign-in.ts';
import { meQueries } from '#src/features/auth/api/get-me.ts';
import { useFieldErrors } from '#src/lib/use-field-errors.ts';
import { useDebounced } from '#src/lib/use-debounced.ts';

/** "my Studio Name" → "my-studio-name": a suggestion the owner may change. */
const suggestSlug = (name: string) =>
  name
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40);

export function OpenStudioPage() {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const form = useFieldErrors();
  const [studioName, setStudioName] = useState('');
  const [slug, setSlug] = useState('');
  const [slugTouched, setSlugTouched] = useState(false);
  const shownSlug = slugTouched ? slug : suggestSlug(studioName);
  const checkedSlug = useDebounced(shownSlug);
  const availability = useSlugAvailability(studioSlugSchema.safeParse(checkedSlug).success ? checkedSlug : '');
  const slugFormat = shownSlug ? studioSlugSchema.safeParse(shownSlug) : undefined;
  const slugMessage =
    form.errors.slug ??
    (slugFormat && !slugFormat.success
      ? slugFormat.error.issues[0]!.message
      : availability.data && !availability.data.available
        ? availability.data.reason
        : undefined);
  const slugHint =
    availability.data?.available && availability.data.slug === shownSlug
      ? `Available: your storefront will be at /s/${shownSlug}`
      : 'Your storefront’s address.';

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const data = Object.fromEntries(new FormData(event.currentTarget));
    const values = form.check(openStudioInputSchema, { ...data, slug: shownSlug });
    if (!values) return;
    await form.run(async () => {
      const { studioSlug } = await openStudio(values);
      await signInWithPassword(values.email, values.password);
      await queryClient.invalidateQueries({ queryKey: meQueries.all });
      navigate(`/studio/${studioSlug}`, { replace: true });
    });
  }

  return (
    <>
      <section className="mx-auto max-w-lg px-6 py-16">
        <h1 className="mb-2 text-3xl font-extrabold">Open your studio</h1>
        <p className="mb-6 text-graphite-600">A storefront for your buyers and a workspace for your team, ready in a minute.</p>
        <Card>
          <form onSubmit={onSubmit} className="flex flex-col gap-4" noValidate>
            {form.formError && <Notice tone="error">{form.formError}</Notice>}
            <TextField
              label="Studio name"
              name="studioName"
              value={studioName}
              onChange={(e) => setStudioName(e.target.value)}
              error={form.errors.studioName}
              autoComplete="organization"
            />
            <TextField
              label="Storefront address"
              name="slug"
              value={shownSlug}
              onChange={(e) => {
                setSlugTouched(true);
                setSlug(e.target.value.toLowerCase());
              }}
              hint={slugHint}
              error={slugMessage}
            />
            <TextField label="Your name" name="ownerName" autoComplete="name" error={form.errors.ownerName} />
            <TextField label="Your e-mail address" name="email" type="email" autoComplete="email" error={form.errors.email} />
            <TextField
              label="Password"
              name="password"
              type="password"
              autoComplete="new-password"
              hint="At least 10 characters."
              error={form.errors.password}
            />
            <Button type="submit" busy={form.busy} className="mt-2">
              Open the studio
            </Button>
          </form>
        </Card>
      </section>
    </>
  );
}
