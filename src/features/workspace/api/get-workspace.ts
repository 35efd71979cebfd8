import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { PERMISSIONS, ROLES } from '#shared/permissions.ts';
import { apiFetch } from '#src/lib/api-client.ts';

export const workspaceSchema = z.object({
  studio: z.object({
    slug: z.string(),
    name: z.string(),
    accentColour: z.string(),
    currency: z.string(),
    units: z.enum(['in', 'mm']),
    contactEmail: z.string().nullable(),
    status: z.enum(['active', 'suspended']),
    logoUrl: z.string().nullable(),
  }),
  orders: z.object({
    lowResolutionPolicy: z.enum(['confirm', 'refuse']),
    pickupEnabled: z.boolean(),
    pickupNote: z.string(),
    proofsRequired: z.boolean(),
    masterResolution: z.enum(['1000-ppi', 'recipe']),
    nextOrderNumber: z.number().int(),
  }),
  role: z.enum(ROLES),
  permissions: z.array(z.enum(PERMISSIONS)),
});
export type Workspace = z.infer<typeof workspaceSchema>;

export const workspaceQueries = {
  all: ['workspace'] as const,
  detail: (slug: string) =>
    queryOptions({
      queryKey: [...workspaceQueries.all, slug],
      queryFn: ({ signal }) => apiFetch(`/api/studios/${encodeURIComponent(slug)}`, { schema: workspaceSchema, signal }),
    }),
};

export const useWorkspace = (slug: string) => useQuery(workspaceQueries.detail(slug));
