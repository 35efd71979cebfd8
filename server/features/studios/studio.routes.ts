import { ROLE_PERMISSIONS } from '#shared/permissions.ts';
import { orderSettingsInputSchema, studioSettingsInputSchema } from '#shared/studio.ts';
import type { WorkspaceContext, WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { randomUUID } from 'node:crypto';
import type { Storage } from '#server/adapters/storage.ts';
import { claimUploadSchema, imageUploadRequestSchema, MAX_IMAGE_UPLOAD_BYTES } from '#shared/schemas/uploads.ts';
import { LOGO_OPTIONS, toWebPhoto } from '#server/imaging/web-photo.ts';
import { issueUpload, readUpload } from '../uploads/uploads.service.ts';
import { assertOrderNumberFree, logoUrl } from './studios.service.ts';

const describe = (ctx: WorkspaceContext) => {
  const s = ctx.studio;
  return {
    studio: {
      slug: s.slug,
      name: s.name,
      accentColour: s.accentColour,
      currency: s.currency,
      units: s.units,
      contactEmail: s.contactEmail,
      status: s.status,
      logoUrl: logoUrl(s),
    },
    orders: {
      lowResolutionPolicy: s.lowResolutionPolicy,
      pickupEnabled: s.pickupEnabled,
      pickupNote: s.pickupNote,
      proofsRequired: s.proofsRequired,
      masterResolution: s.masterResolution,
      nextOrderNumber: s.nextOrderNumber,
    },
    role: ctx.role,
    permissions: ROLE_PERMISSIONS[ctx.role],
  };
};

/** The workspace's view of its own studio, what the member may do there, and its settings. */
export function studioRoutes({ storage }: { storage: Storage }): WorkspaceRoute[] {
  const logoPrefix = (ctx: WorkspaceContext) => `uploads/${ctx.studio.id}/logo`;
  return [
    {
      method: 'get',
      path: '/',
      permission: 'studio:read',
      handler: (ctx, req, res) => void res.json(describe(ctx)),
    },
    {
      method: 'put',
      path: '/settings',
      permission: 'studio:settings',
      sample: () => ({ body: { name: 'Matrix Studio', accentColour: '#224466', currency: 'EUR', units: 'mm', contactEmail: '' } }),
      handler: async (ctx, req, res) => {
        const input = studioSettingsInputSchema.parse(req.body);
        ctx.em.assign(ctx.studio, input);
        await ctx.em.flush();
        res.json(describe(ctx));
      },
    },
    {
      method: 'put',
      path: '/settings/orders',
      permission: 'studio:settings',
      sample: () => ({
        body: {
          lowResolutionPolicy: 'refuse',
          pickupEnabled: true,
          pickupNote: 'At the workshop, weekdays.',
          proofsRequired: false,
          masterResolution: 'recipe',
        },
      }),
      handler: async (ctx, req, res) => {
        const input = orderSettingsInputSchema.parse(req.body);
        if (input.nextOrderNumber !== undefined) await assertOrderNumberFree(ctx.em, ctx.studio, input.nextOrderNumber);
        ctx.em.assign(ctx.studio, input);
        await ctx.em.flush();
        res.json(describe(ctx));
      },
    },
    {
      method: 'post',
      path: '/settings/logo-uploads',
      permission: 'studio:settings',
      sample: () => ({ body: { contentType: 'image/png', contentLength: 2000 } }),
      handler: async (ctx, req, res) =>
        void res.status(201).json(await issueUpload(storage, logoPrefix(ctx), imageUploadRequestSchema.parse(req.body))),
    },
    {
      method: 'put',
      path: '/settings/logo',
      permission: 'studio:settings',
      sample: async (f) => ({ body: { key: await f.upload('logo') } }),
      handler: async (ctx, req, res) => {
        const { key } = claimUploadSchema.parse(req.body);
        const bytes = await readUpload(storage, logoPrefix(ctx), key, MAX_IMAGE_UPLOAD_BYTES);
        const logo = await toWebPhoto(bytes, LOGO_OPTIONS).finally(() => storage.remove(key));
        const studio = ctx.studio;
        const previous = studio.logoKey;
        studio.logoKey = `studios/${studio.id}/logo/${randomUUID()}.webp`;
        await storage.put(studio.logoKey, logo.data, 'image/webp');
        await ctx.em.flush();
        if (previous) await storage.remove(previous);
        res.json(describe(ctx));
      },
    },
    {
      method: 'delete',
      path: '/settings/logo',
      permission: 'studio:settings',
      handler: async (ctx, req, res) => {
        const previous = ctx.studio.logoKey;
        ctx.studio.logoKey = null;
        await ctx.em.flush();
        if (previous) await storage.remove(previous);
        res.json(describe(ctx));
      },
    },
  ];
}
