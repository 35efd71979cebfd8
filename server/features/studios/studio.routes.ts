import type { Request } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import { ROLE_PERMISSIONS } from '../../../shared/permissions.ts';
import { orderSettingsInputSchema, studioSettingsInputSchema } from '../../../shared/studio.ts';
import type { Orm } from '../../db/orm.ts';
import type { WorkspaceRoute } from '../../middleware/workspace-routes.ts';
import { randomUUID } from 'node:crypto';
import type { Storage } from '../../adapters/storage.ts';
import { claimUploadSchema, imageUploadRequestSchema, MAX_IMAGE_UPLOAD_BYTES } from '../../../shared/schemas/uploads.ts';
import { LOGO_OPTIONS, toWebPhoto } from '../../imaging/web-photo.ts';
import { issueUpload, readUpload } from '../uploads/uploads.service.ts';
import { logoUrl } from './studios.service.ts';

const describe = (req: Request) => {
  const s = req.studio!;
  return {
    studio: { slug: s.slug, name: s.name, accentColour: s.accentColour, currency: s.currency, units: s.units, contactEmail: s.contactEmail, status: s.status, logoUrl: logoUrl(s) },
    orders: { lowResolutionPolicy: s.lowResolutionPolicy, pickupEnabled: s.pickupEnabled, pickupNote: s.pickupNote, proofsRequired: s.proofsRequired, masterResolution: s.masterResolution },
    role: req.role,
    permissions: ROLE_PERMISSIONS[req.role!],
  };
};

/** The workspace's view of its own studio, what the member may do there, and its settings. */
export function studioRoutes({ orm, storage }: { orm: Orm; storage: Storage }): WorkspaceRoute[] {
  const logoPrefix = (req: Request) => `uploads/${req.studio!.id}/logo`;
  return [
    {
      method: 'get',
      path: '/',
      permission: 'studio:read',
      handler: (req, res) => void res.json(describe(req)),
    },
    {
      method: 'put',
      path: '/settings',
      permission: 'studio:settings',
      sample: () => ({ body: { name: 'Matrix Studio', accentColour: '#224466', currency: 'EUR', units: 'mm', contactEmail: '' } }),
      handler: async (req, res) => {
        const input = studioSettingsInputSchema.parse(req.body);
        (orm.em as EntityManager).assign(req.studio!, input);
        await orm.em.flush();
        res.json(describe(req));
      },
    },
    {
      method: 'put',
      path: '/settings/orders',
      permission: 'studio:settings',
      sample: () => ({ body: { lowResolutionPolicy: 'refuse', pickupEnabled: true, pickupNote: 'At the workshop, weekdays.', proofsRequired: false, masterResolution: 'recipe' } }),
      handler: async (req, res) => {
        (orm.em as EntityManager).assign(req.studio!, orderSettingsInputSchema.parse(req.body));
        await orm.em.flush();
        res.json(describe(req));
      },
    },
    {
      method: 'post',
      path: '/settings/logo-uploads',
      permission: 'studio:settings',
      sample: () => ({ body: { contentType: 'image/png', contentLength: 2000 } }),
      handler: async (req, res) => void res.status(201).json(await issueUpload(storage, logoPrefix(req), imageUploadRequestSchema.parse(req.body))),
    },
    {
      method: 'put',
      path: '/settings/logo',
      permission: 'studio:settings',
      sample: async (f) => ({ body: { key: await f.upload('logo') } }),
      handler: async (req, res) => {
        const { key } = claimUploadSchema.parse(req.body);
        const bytes = await readUpload(storage, logoPrefix(req), key, MAX_IMAGE_UPLOAD_BYTES);
        const logo = await toWebPhoto(bytes, LOGO_OPTIONS).finally(() => storage.remove(key));
        const studio = req.studio!;
        const previous = studio.logoKey;
        studio.logoKey = `studios/${studio.id}/logo/${randomUUID()}.webp`;
        await storage.put(studio.logoKey, logo.data, 'image/webp');
        await orm.em.flush();
        if (previous) await storage.remove(previous);
        res.json(describe(req));
      },
    },
    {
      method: 'delete',
      path: '/settings/logo',
      permission: 'studio:settings',
      handler: async (req, res) => {
        const previous = req.studio!.logoKey;
        req.studio!.logoKey = null;
        await orm.em.flush();
        if (previous) await storage.remove(previous);
        res.json(describe(req));
      },
    },
  ];
}
