import { useMutation, useQuery } from '@tanstack/react-query';
import type { ReplacementInput } from '#shared/schemas/workspace-orders.ts';
import { replacementViewSchema } from '#shared/schemas/workspace-orders.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const replacementUrl = (slug: string, token: string) =>
  `/api/storefront/${encodeURIComponent(slug)}/replacements/${encodeURIComponent(token)}`;

/** What the studio asked for (why a new photo is needed), by the private link from its e-mail. */
export const useReplacement = (slug: string, token: string) =>
  useQuery({
    queryKey: ['replacement', slug, token],
    queryFn: ({ signal }) => apiFetch(replacementUrl(slug, token), { schema: replacementViewSchema, signal }),
    retry: false,
  });

/** Sends the new photo and its placement. */
export const useSendReplacement = (slug: string, token: string) =>
  useMutation({ mutationFn: (body: ReplacementInput) => apiFetch(replacementUrl(slug, token), { method: 'POST', body }) });
