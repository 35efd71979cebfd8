import { queryOptions, useMutation, useQuery, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { z } from 'zod';
import {
  blankPhotoSchema,
  blankSchema,
  catalogListSchemas,
  machineSchema,
  materialSchema,
  recipeSchema,
  sizeSchema,
  type BlankInput,
  type BlankView,
  type MachineInput,
  type MaterialInput,
  type RecipeInput,
  type SizeInput,
} from '#shared/schemas/catalog.ts';
import { uploadTicketSchema } from '#shared/schemas/uploads.ts';
import { AppError } from '#shared/errors.ts';
import { apiFetch } from '#src/lib/api-client.ts';

const base = (slug: string) => `/api/studios/${encodeURIComponent(slug)}/catalog`;
const list = <S extends z.ZodType>(slug: string, name: string, schema: S) =>
  queryOptions({ queryKey: ['catalog', slug, name], queryFn: ({ signal }) => apiFetch(`${base(slug)}/${name}`, { schema, signal }) });

export const catalogQueries = {
  all: (slug: string) => ['catalog', slug] as const,
  materials: (slug: string) => list(slug, 'materials', catalogListSchemas.materials),
  machines: (slug: string) => list(slug, 'machines', catalogListSchemas.machines),
  recipes: (slug: string) => list(slug, 'recipes', catalogListSchemas.recipes),
  blanks: (slug: string) => list(slug, 'blanks', catalogListSchemas.blanks),
  blank: (slug: string, blankId: string) =>
    queryOptions({
      queryKey: ['catalog', slug, 'blanks', blankId],
      queryFn: ({ signal }) => apiFetch(`${base(slug)}/blanks/${blankId}`, { schema: blankSchema, signal }),
    }),
};

export const useMaterials = (slug: string) => useQuery(catalogQueries.materials(slug));
export const useMachines = (slug: string) => useQuery(catalogQueries.machines(slug));
export const useRecipes = (slug: string) => useQuery(catalogQueries.recipes(slug));
export const useBlanks = (slug: string) => useQuery(catalogQueries.blanks(slug));
export const useBlank = (slug: string, blankId: string) => useQuery(catalogQueries.blank(slug, blankId));

type Optimistic<TInput> = { queryKey: QueryKey; update(old: never, input: TInput): unknown };

/**
 * A catalog change. With `optimistic`, the cached list shows the change at once and is put back
 * if the server refuses it; either way the studio's catalog (and its storefront) is refetched.
 */
function useCatalogMutation<TInput, TResult>(
  slug: string,
  mutationFn: (input: TInput) => Promise<TResult>,
  optimistic?: (input: TInput) => Optimistic<TInput>,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onMutate: async (input: TInput) => {
      if (!optimistic) return undefined;
      const { queryKey, update } = optimistic(input);
      await queryClient.cancelQueries({ queryKey });
      const previous = queryClient.getQueryData(queryKey);
      if (previous !== undefined) queryClient.setQueryData(queryKey, update(previous as never, input));
      return { queryKey, previous };
    },
    onError: (_error, _input, context) => {
      if (context?.previous !== undefined) queryClient.setQueryData(context.queryKey, context.previous);
    },
    onSettled: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: catalogQueries.all(slug) }),
        queryClient.invalidateQueries({ queryKey: ['storefront', slug] }),
      ]),
  });
}

type Listed<K extends string, T> = Record<K, T[]>;
const replaceIn =
  <K extends string, T extends { id: string }>(key: K, id: string, change: (item: T) => T) =>
  (old: Listed<K, T>) => ({ ...old, [key]: old[key].map((item) => (item.id === id ? change(item) : item)) });
const removeFrom =
  <K extends string, T extends { id: string }>(key: K, id: string) =>
  (old: Listed<K, T>) => ({ ...old, [key]: old[key].filter((item) => item.id !== id) });

export const useCreateMaterial = (slug: string) =>
  useCatalogMutation(slug, (input: MaterialInput) =>
    apiFetch(`${base(slug)}/materials`, { method: 'POST', body: input, schema: materialSchema }),
  );
export const useUpdateMaterial = (slug: string) =>
  useCatalogMutation(
    slug,
    ({ id, input }: { id: string; input: MaterialInput }) =>
      apiFetch(`${base(slug)}/materials/${id}`, { method: 'PUT', body: input, schema: materialSchema }),
    ({ id, input }) => ({
      queryKey: catalogQueries.materials(slug).queryKey,
      update: replaceIn('materials', id, (m: z.infer<typeof materialSchema>) => ({ ...m, ...input })) as never,
    }),
  );
export const useDeleteMaterial = (slug: string) =>
  useCatalogMutation(
    slug,
    (id: string) => apiFetch(`${base(slug)}/materials/${id}`, { method: 'DELETE' }),
    (id) => ({ queryKey: catalogQueries.materials(slug).queryKey, update: removeFrom('materials', id) as never }),
  );

export const useCreateMachine = (slug: string) =>
  useCatalogMutation(slug, (input: MachineInput) =>
    apiFetch(`${base(slug)}/machines`, { method: 'POST', body: input, schema: machineSchema }),
  );
export const useUpdateMachine = (slug: string) =>
  useCatalogMutation(
    slug,
    ({ id, input }: { id: string; input: MachineInput }) =>
      apiFetch(`${base(slug)}/machines/${id}`, { method: 'PUT', body: input, schema: machineSchema }),
    ({ id, input }) => ({
      queryKey: catalogQueries.machines(slug).queryKey,
      update: replaceIn('machines', id, (m: z.infer<typeof machineSchema>) => ({ ...m, ...input })) as never,
    }),
  );
export const useDeleteMachine = (slug: string) =>
  useCatalogMutation(
    slug,
    (id: string) => apiFetch(`${base(slug)}/machines/${id}`, { method: 'DELETE' }),
    (id) => ({ queryKey: catalogQueries.machines(slug).queryKey, update: removeFrom('machines', id) as never }),
  );

export const useCreateRecipe = (slug: string) =>
  useCatalogMutation(slug, (input: RecipeInput) =>
    apiFetch(`${base(slug)}/recipes`, { method: 'POST', body: input, schema: recipeSchema }),
  );
export const useUpdateRecipe = (slug: string) =>
  useCatalogMutation(
    slug,
    ({ id, input }: { id: string; input: RecipeInput }) =>
      apiFetch(`${base(slug)}/recipes/${id}`, { method: 'PUT', body: input, schema: recipeSchema }),
    ({ id, input }) => ({
      queryKey: catalogQueries.recipes(slug).queryKey,
      update: replaceIn('recipes', id, (r: z.infer<typeof recipeSchema>) => ({ ...r, ...input })) as never,
    }),
  );
export const useDeleteRecipe = (slug: string) =>
  useCatalogMutation(
    slug,
    (id: string) => apiFetch(`${base(slug)}/recipes/${id}`, { method: 'DELETE' }),
    (id) => ({ queryKey: catalogQueries.recipes(slug).queryKey, update: removeFrom('recipes', id) as never }),
  );

export const useCreateBlank = (slug: string) =>
  useCatalogMutation(slug, (input: BlankInput) => apiFetch(`${base(slug)}/blanks`, { method: 'POST', body: input, schema: blankSchema }));
export const useUpdateBlank = (slug: string, blankId: string) =>
  useCatalogMutation(
    slug,
    (input: BlankInput) => apiFetch(`${base(slug)}/blanks/${blankId}`, { method: 'PUT', body: input, schema: blankSchema }),
    (input) => ({ queryKey: catalogQueries.blank(slug, blankId).queryKey, update: ((old: BlankView) => ({ ...old, ...input })) as never }),
  );

/** Size changes show at once on the blank's page. */
const onBlank = (slug: string, blankId: string, change: (sizes: BlankView['sizes']) => BlankView['sizes']) => ({
  queryKey: catalogQueries.blank(slug, blankId).queryKey,
  update: ((old: BlankView) => ({ ...old, sizes: change(old.sizes) })) as never,
});
export const useAddSize = (slug: string, blankId: string) =>
  useCatalogMutation(slug, (input: SizeInput) =>
    apiFetch(`${base(slug)}/blanks/${blankId}/sizes`, { method: 'POST', body: input, schema: sizeSchema }),
  );
export const useUpdateSize = (slug: string, blankId: string) =>
  useCatalogMutation(
    slug,
    ({ id, input }: { id: string; input: SizeInput }) =>
      apiFetch(`${base(slug)}/sizes/${id}`, { method: 'PUT', body: input, schema: sizeSchema }),
    ({ id, input }) => onBlank(slug, blankId, (sizes) => sizes.map((s) => (s.id === id ? { ...s, ...input } : s))),
  );
export const useRemoveSize = (slug: string, blankId: string) =>
  useCatalogMutation(
    slug,
    (id: string) => apiFetch(`${base(slug)}/sizes/${id}`, { method: 'DELETE' }),
    (id) => onBlank(slug, blankId, (sizes) => sizes.filter((s) => s.id !== id)),
  );

/**
 * A product photo: a ticket from the app, the file PUT straight to storage with the ticket's
 * headers, then the app takes it (and checks it really is a photo).
 */
export const useAddPhoto = (slug: string, blankId: string) =>
  useCatalogMutation(slug, async (file: File) => {
    const ticket = await apiFetch(`${base(slug)}/blanks/${blankId}/photo-uploads`, {
      method: 'POST',
      body: { contentType: file.type, contentLength: file.size },
      schema: uploadTicketSchema,
    });
    let put: Response;
    try {
      put = await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: file });
    } catch (cause) {
      throw new AppError('SERVICE_UNAVAILABLE', 'The photo could not be uploaded. Check your connection and try again.', { cause });
    }
    if (!put.ok) throw new AppError('SERVICE_UNAVAILABLE', `The photo store refused the upload (${put.status}). Please try again.`);
    return apiFetch(`${base(slug)}/blanks/${blankId}/photos`, { method: 'POST', body: { key: ticket.key }, schema: blankPhotoSchema });
  });
export const useRemovePhoto = (slug: string, blankId: string) =>
  useCatalogMutation(
    slug,
    (id: string) => apiFetch(`${base(slug)}/photos/${id}`, { method: 'DELETE' }),
    (id) => ({
      queryKey: catalogQueries.blank(slug, blankId).queryKey,
      update: ((old: BlankView) => ({ ...old, photos: old.photos.filter((p) => p.id !== id) })) as never,
    }),
  );
