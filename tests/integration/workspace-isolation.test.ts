import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { can, ROLES } from '#shared/permissions.ts';
import { workspaceRoutes, type AppDeps } from '#server/app.ts';
import type { WorkspaceFixtures, WorkspaceRoute } from '#server/middleware/workspace-routes.ts';
import { Invite } from '#server/features/team/invite.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { User } from '#server/features/accounts/user.entity.ts';
import { useTestApp } from '../support/test-app.ts';
import { payWithTestCard } from '../support/payments.ts';
import * as catalog from '#server/features/catalog/catalog.service.ts';
import { TENANT_FILTER } from '#server/db/tenant.ts';
import { ShippingRate } from '#server/features/shipping/shipping-rate.entity.ts';
import { BuyerPhoto } from '#server/features/photos/buyer-photo.entity.ts';
import { Order, OrderItem } from '#server/features/orders/order.entity.ts';
import { ProductionBatch, Render } from '#server/features/production/production.entity.ts';
import type { RenderFiles } from '#shared/schemas/production.ts';
import { agentFor, createMember, createStudio, createUser } from '../support/factories.ts';

/**
 * Every workspace route, from the same list the router is built from: a route added later is
 * checked here without anyone adding it. Another studio's records answer 404, never 403.
 */
describe('workspace isolation matrix', () => {
  const t = useTestApp();
  const routes = (): WorkspaceRoute[] => workspaceRoutes({ ...t, logger: undefined, version: 'test' } as unknown as AppDeps);
  let studioA: Studio;
  const agents = {} as Record<'buyer' | 'otherStudio' | 'owner' | 'staff', ReturnType<typeof request.agent>>;
  let fixtures: WorkspaceFixtures;

  beforeAll(async () => {
    const em = t.orm.em.fork();
    studioA = await createStudio(em, { slug: 'matrix-a' });
    // Items may be approved without a proof here, so that route has a valid call too.
    await em.nativeUpdate(Studio, { id: studioA.id }, { proofsRequired: false });
    const studioB = await createStudio(em, { slug: 'matrix-b' });
    const owner = await createMember(em, studioA, 'owner');
    const staff = await createMember(em, studioA, 'staff');
    const otherOwner = await createMember(em, studioB, 'owner');
    const buyer = await createUser(em);
    agents.owner = await agentFor(t.app, owner.user);
    agents.staff = await agentFor(t.app, staff.user);
    agents.otherStudio = await agentFor(t.app, otherOwner.user);
    agents.buyer = await agentFor(t.app, buyer);
    fixtures = {
      studioId: studioA.id,
      ownerId: owner.membership.id,
      staffId: staff.membership.id,
      makeMember: async () => (await createMember(t.orm.em.fork(), studioA, 'staff')).membership.id,
      makeInvite: async () => {
        const fork = t.orm.em.fork();
        const invite = fork.create(Invite, {
          studio: studioA.id,
          email: `i-${Math.random()}@example.com`,
          role: 'staff',
          tokenHash: Math.random().toString(16).slice(2).padEnd(64, '0'),
          expiresAt: new Date(Date.now() + 86_400_000),
          invitedBy: null,
        });
        await fork.flush();
        return invite.id;
      },
      orderItem: async ({ paid = false, stage = 'photo_review' } = {}) => {
        // With `paid`, a real payment through the payments stand-in, so refunds have one to return.
        let paymentIntentId: string | null = null;
        if (paid) {
          const session = await t.payments.stripe.checkout.sessions.create({
            mode: 'payment',
            line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 100, product_data: { name: 'B' } } }],
            success_url: 'http://127.0.0.1/ok',
            cancel_url: 'http://127.0.0.1/no',
          });
          await payWithTestCard(session.url!);
          paymentIntentId = session.payment_intent as string;
        }
        const fork = t.orm.em.fork();
        const key = `studios/${studioA.id}/buyer-photos/${randomUUID()}/original`;
        await t.storage.put(
          key,
          await sharp({ create: { width: 400, height: 500, channels: 3, background: '#777777' } })
            .jpeg()
            .toBuffer(),
          'image/jpeg',
        );
        const photo = fork.create(BuyerPhoto, {
          studio: studioA.id,
          originalKey: key,
          previewKey: key,
          thumbKey: key,
          format: 'jpeg',
          width: 400,
          height: 500,
          previewWidth: 400,
          previewHeight: 500,
          byteSize: 1000,
          quality: { sharpness: 100, blurry: false, shadows: 0, highlights: 0, exposure: 'ok' },
        });
        const number = Math.floor(Math.random() * 1e9);
        const order = fork.create(Order, {
          studio: studioA.id,
          number,
          status: 'paid',
          buyerEmail: 'b@example.com',
          buyerName: 'B',
          deliveryMethod: 'pickup',
          shippingAddress: null,
          shippingRate: null,
          currency: 'USD',
          subtotalMinor: 100,
          shippingMinor: 0,
          totalMinor: 100,
          accessKeyHash: '0'.repeat(64),
          paidAt: new Date(),
          paymentIntentId,
        });
        const snapshot = {
          blank: {
            id: randomUUID(),
            name: 'B',
            shape: 'oval' as const,
            material: {
              id: randomUUID(),
              name: 'Slate',
              surfaceColour: '#333333',
              markColour: '#cccccc',
              defaultTone: 'negative' as const,
              linesPerInchMax: 300,
            },
          },
          size: {
            id: randomUUID(),
            label: 'S',
            areaWidthMm: 90,
            areaHeightMm: 90,
            outerWidthMm: 100,
            outerHeightMm: 100,
            priceMinor: 100,
            sku: '',
          },
          recipe: null,
        };
        const item = fork.create(OrderItem, {
          studio: studioA.id,
          order,
          stage,
          size: null,
          snapshot,
          quantity: 1,
          unitPriceMinor: 100,
          photo,
          placement: { crop: { left: 0, top: 0, width: 400, height: 400 }, rotation: 0, flipHorizontal: false },
          orientation: 'portrait',
          inscription: null,
          effectivePpi: 100,
          lowResolutionConfirmed: false,
        });
        await fork.flush();
        return { orderId: order.id, itemId: item.id, photoId: photo.id };
      },
      production: async (status) => {
        const { orderId, itemId } = await fixtures.orderItem({ stage: 'approved' });
        const fork = t.orm.em.fork();
        fork.setFilterParams(TENANT_FILTER, { studioId: studioA.id });
        const keyPrefix = `studios/${studioA.id}/renders/${randomUUID()}`;
        const files =
          status === 'done'
            ? (Object.fromEntries(
                await Promise.all(
                  (['engrave', 'master', 'sheet'] as const).map(async (kind) => {
                    const key = `${keyPrefix}/${kind}`;
                    await t.storage.put(key, Buffer.from('file'), 'application/octet-stream');
                    return [kind, { key, bytes: 4, contentType: 'application/octet-stream' }];
                  }),
                ),
              ) as RenderFiles)
            : null;
        await fork.nativeUpdate(OrderItem, { id: itemId }, { stage: 'in_production' });
        const batch = fork.create(ProductionBatch, {
          studio: studioA.id,
          number: Math.floor(Math.random() * 1e9),
          materialName: 'Slate',
          recipeId: null,
          machine: null,
          createdBy: 'Test',
        });
        const render = fork.create(Render, {
          studio: studioA.id,
          item: itemId,
          batch,
          status,
          keyPrefix,
          prepVersion: 0,
          files,
          error: status === 'failed' ? 'The photo could not be read.' : null,
        });
        await fork.flush();
        return { orderId, itemId, batchId: batch.id, renderId: render.id };
      },
      shippingRate: async () => {
        const fork = t.orm.em.fork();
        const created = fork.create(ShippingRate, { name: `Rate ${Math.random()}`, priceMinor: 500, sortOrder: 0, studio: studioA.id });
        await fork.flush();
        return created.id;
      },
      upload: async (purpose) => {
        const key = `uploads/${studioA.id}/${purpose}/${randomUUID()}`;
        const jpeg = await sharp({ create: { width: 400, height: 300, channels: 3, background: '#8a6d4b' } })
          .jpeg()
          .toBuffer();
        await t.storage.put(key, jpeg, 'image/jpeg');
        return key;
      },
      catalog: async (kind) => {
        const fork = t.orm.em.fork();
        fork.setFilterParams(TENANT_FILTER, { studioId: studioA.id });
        const studio = await fork.findOneOrFail(Studio, { id: studioA.id });
        const actor = await fork.findOneOrFail(User, { id: owner.user.id });
        const unique = Math.random().toString(36).slice(2);
        const material = () =>
          catalog.createMaterial(fork, studio, {
            name: `M ${unique}`,
            family: 'stone',
            surfaceColour: '#333333',
            markColour: '#cccccc',
            defaultTone: 'negative',
            linesPerInchMin: 250,
            linesPerInchMax: 330,
            safetyNotes: '',
            forbiddenOn: [],
            forbiddenReason: '',
          });
        const machine = () =>
          catalog.createMachine(fork, studio, {
            name: `K ${unique}`,
            laserKind: 'co2',
            powerWatts: 60,
            bedWidthMm: 600,
            bedHeightMm: 400,
            speedUnit: 'mm/s',
            notes: '',
          });
        if (kind === 'material') return (await material()).id;
        if (kind === 'machine') return (await machine()).id;
        if (kind === 'recipe') {
          const [m, k] = [await material(), await machine()];
          return (
            await catalog.createRecipe(
              fork,
              studio,
              {
                materialId: m.id,
                machineId: k.id,
                linesPerInch: 300,
                halftoneMethod: 'stucki',
                tone: 'negative',
                speed: 100,
                powerMinPercent: 5,
                powerMaxPercent: 10,
                passes: 1,
                notes: '',
              },
              actor,
            )
          ).id;
        }
        const blank = await catalog.createBlank(
          fork,
          studio,
          {
            name: 'B',
            description: '',
            materialId: (await material()).id,
            shape: 'oval',
            status: 'draft',
            sortOrder: 0,
          },
          actor,
        );
        if (kind === 'blank') return blank.id;
        if (kind === 'photo') return (await catalog.addPhoto(fork, t.storage, studio, blank.id, await fixtures.upload('blank-photos'))).id;
        return (
          await catalog.addSize(
            fork,
            studio,
            blank.id,
            {
              label: 'S',
              outerWidthMm: 100,
              outerHeightMm: 100,
              areaWidthMm: 70,
              areaHeightMm: 70,
              orientation: 'either',
              priceMinor: 100,
              stock: 3,
              sku: '',
            },
            actor,
          )
        ).id;
      },
    };
  });

  it('covers at least the studio and team routes', () => {
    expect(routes().map((r) => `${r.method} ${r.path}`)).toEqual(
      expect.arrayContaining(['get /', 'get /team', 'post /team/invites', 'patch /team/members/:memberId']),
    );
  });

  const call = async (agent: ReturnType<typeof request.agent> | typeof request, route: WorkspaceRoute, studioSlug: string) => {
    const { params = {}, body } = (await route.sample?.(fixtures)) ?? {};
    const path = route.path.replace(/:(\w+)/g, (_, name: string) => params[name] ?? '00000000-0000-4000-8000-000000000000');
    const url = `/api/studios/${studioSlug}${path === '/' ? '' : path}`;
    const target = agent === request ? request(t.app) : (agent as ReturnType<typeof request.agent>);
    const req = target[route.method](url);
    return body === undefined ? req : req.send(body as object);
  };

  it('answers 401 to anyone not signed in, on every route', async () => {
    for (const route of routes()) {
      const res = await call(request, route, 'matrix-a');
      expect(res.status, `${route.method} ${route.path}`).toBe(401);
    }
  });

  it('answers 404 to a signed-in buyer who is not a member, on every route', async () => {
    for (const route of routes()) {
      const res = await call(agents.buyer, route, 'matrix-a');
      expect(res.status, `${route.method} ${route.path}`).toBe(404);
    }
  });

  it('answers 404 to a member of another studio, on every route', async () => {
    for (const route of routes()) {
      const res = await call(agents.otherStudio, route, 'matrix-a');
      expect(res.status, `${route.method} ${route.path}`).toBe(404);
    }
  });

  for (const role of ROLES) {
    it(`lets ${role} members do exactly what the permission map allows`, async () => {
      for (const route of routes()) {
        const res = await call(agents[role as 'owner' | 'staff'], route, 'matrix-a');
        if (can(role, route.permission)) expect(res.status, `${route.method} ${route.path}: ${JSON.stringify(res.body)}`).toBeLessThan(300);
        else expect(res.status, `${route.method} ${route.path}`).toBe(403);
      }
    });
  }
});
