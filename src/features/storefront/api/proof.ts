import { useMutation, useQuery } from '@tanstack/react-query';
import type { ProofDecision } from '#shared/schemas/prep.ts';
import { proofViewSchema } from '#shared/schemas/workspace-orders.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const proofUrl = (slug: string, token: string) => `/api/storefront/${encodeURIComponent(slug)}/proofs/${encodeURIComponent(token)}`;

/** The proof opened by its private link; a used or unknown link answers 404 at once, without retries. */
export const useProof = (slug: string, token: string) =>
  useQuery({
    queryKey: ['proof', slug, token],
    queryFn: ({ signal }) => apiFetch(proofUrl(slug, token), { schema: proofViewSchema, signal }),
    retry: false,
  });

/** The buyer's answer: approve, or ask for changes with a note. */
export const useAnswerProof = (slug: string, token: string) =>
  useMutation({ mutationFn: (body: ProofDecision) => apiFetch(proofUrl(slug, token), { method: 'POST', body }) });
