import type { EntityManager } from '@mikro-orm/postgresql';
import { workspacePaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import { shippingRateInputSchema, type ShippingRateView } from '#shared/studio.ts';
import { isUuid } from '#server/lib/tokens.ts';
import type { WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { ShippingRate } from './shipping-rate.entity.ts';
import { formatMoney } from '#shared/money.ts';
import type { User } from '../accounts/user.entity.ts';
import { recordAudit } from '../audit/audit.service.ts';

/** Shipping prices are prices: their changes go to the audit log. */
function auditRate(em: EntityManager, studio: Studio, actor: User, rate: ShippingRate, summary: string, details: Record<string, unknown>) {
  recordAudit(em, studio, actor, {
    action: 'price.changed',
    subject: `Shipping: ${rate.name}`,
    summary,
    link: workspacePaths.settings(studio.slug),
    details: { shippingRateId: rate.id, currency: studio.currency, ...details },
  });
}

const view = (r: ShippingRate): ShippingRateView => ({ id: r.id, name: r.name, priceMinor: r.priceMinor, sortOrder: r.sortOrder });
const rate = { name: 'Tracked post', priceMinor: 895, sortOrder: 0 };

async function findRate(em: EntityManager, studio: Studio, id: string): Promise<ShippingRate> {
  const found = isUuid(id) ? await em.findOne(ShippingRate, { id, studio }) : null;
  if (!found) throw new AppError('NOT_FOUND', 'There is no such shipping rate.');
  return found;
}

/**
 * A studio's flat shipping rates (owners set them; checkout offers them). An order keeps a copy
 * of the rate it was placed with, so rates may change or go at any time.
 */
export function shippingRoutes(): WorkspaceRoute[] {
  return [
    {
      method: 'get',
      path: '/shipping-rates',
      permission: 'studio:read',
      handler: async (ctx, req, res) =>
        void res.json({
          rates: (await ctx.em.find(ShippingRate, { studio: ctx.studio }, { orderBy: { sortOrder: 'asc', priceMinor: 'asc' } })).map(view),
        }),
    },
    {
      method: 'post',
      path: '/shipping-rates',
      permission: 'studio:settings',
      sample: () => ({ body: rate }),
      handler: async (ctx, req, res) => {
        const created = ctx.em.create(ShippingRate, { ...shippingRateInputSchema.parse(req.body), studio: ctx.studio });
        auditRate(ctx.em, ctx.studio, ctx.user, created, `New shipping rate at ${formatMoney(created.priceMinor, ctx.studio.currency)}.`, {
          priceMinor: created.priceMinor,
        });
        await ctx.em.flush();
        res.status(201).json(view(created));
      },
    },
    {
      method: 'put',
      path: '/shipping-rates/:rateId',
      permission: 'studio:settings',
      sample: async (f) => ({ params: { rateId: await f.shippingRate() }, body: rate }),
      handler: async (ctx, req, res) => {
        const found = await findRate(ctx.em, ctx.studio, String(req.params.rateId));
        const fromMinor = found.priceMinor;
        ctx.em.assign(found, shippingRateInputSchema.parse(req.body));
        if (found.priceMinor !== fromMinor) {
          const money = (minor: number) => formatMoney(minor, ctx.studio.currency);
          auditRate(ctx.em, ctx.studio, ctx.user, found, `Price: ${money(fromMinor)} → ${money(found.priceMinor)}.`, {
            fromMinor,
            toMinor: found.priceMinor,
          });
        }
        await ctx.em.flush();
        res.json(view(found));
      },
    },
    {
      method: 'delete',
      path: '/shipping-rates/:rateId',
      permission: 'studio:settings',
      sample: async (f) => ({ params: { rateId: await f.shippingRate() } }),
      handler: async (ctx, req, res) => {
        const found = await findRate(ctx.em, ctx.studio, String(req.params.rateId));
        auditRate(
          ctx.em,
          ctx.studio,
          ctx.user,
          found,
          `Shipping rate removed (it was ${formatMoney(found.priceMinor, ctx.studio.currency)}).`,
          { fromMinor: found.priceMinor },
        );
        ctx.em.remove(found);
        await ctx.em.flush();
        res.status(204).end();
      },
    },
  ];
}
