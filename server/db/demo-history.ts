import type { EntityManager } from '@mikro-orm/postgresql';
import sharp from 'sharp';
import { effectivePpi } from '#shared/imaging/photo-checks.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';
import type { ItemStage, OrderStatus } from '#shared/orders/stages.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { Blank, Recipe } from '#server/features/catalog/catalog.entity.ts';
import { snapshotForOrder } from '#server/features/catalog/catalog.service.ts';
import { Order, OrderEvent, OrderItem } from '#server/features/orders/order.entity.ts';
import type { BuyerPhoto } from '#server/features/photos/buyer-photo.entity.ts';
import { storeBuyerPhoto } from '#server/features/photos/photos.service.ts';
import { ShippingRate } from '#server/features/shipping/shipping-rate.entity.ts';
import { Studio } from '#server/features/studios/studio.entity.ts';
import { makePhotoDerivatives } from '#server/imaging/photo-derivatives.ts';
import { newLinkToken } from '#server/lib/tokens.ts';
import { withoutTenantFilter } from './tenant.ts';
import { demoStudios } from './demo-scenario.ts';

/** Twelve weeks of orders, so that Today's charts and the order list look like a studio at work. */
export const HISTORY_WEEKS = 12;
const DAY = 86_400_000;

/** Fictional buyers of our own invention, on the reserved .test domain. */
const BUYERS = [
  ['Rosalind Achterberg', 'rosalind@buyers.test'],
  ['Tomasz Ferreira', 'tomasz@buyers.test'],
  ['Priya Lindqvist', 'priya@buyers.test'],
  ['Eoin Okonkwo', 'eoin@buyers.test'],
  ['Mathilde Sørby', 'mathilde@buyers.test'],
  ['Kwame Halloran', 'kwame@buyers.test'],
  ['Ines Vartanian', 'ines@buyers.test'],
  ['Callum Oyelaran', 'callum@buyers.test'],
  ['Hana Brightwater', 'hana@buyers.test'],
  ['Dmitri Fairclough', 'dmitri@buyers.test'],
] as const;
const TOWNS = ['Kettleby', 'Port Alder', 'Wrenmouth', 'Ashcombe Vale', 'Linhope'];

/** A small deterministic generator (mulberry32): the same history on every machine. */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
/** Monday 00:00 UTC of the week `at` falls in (ISO weeks, as PostgreSQL's date_trunc('week')). */
const startOfWeek = (at: Date) => {
  const midnight = Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate());
  return midnight - ((at.getUTCDay() + 6) % 7) * DAY;
};
const seedOf = (text: string) => [...text].reduce((h, c) => Math.imul(h ^ c.charCodeAt(0), 16777619), 2166136261);

/**
 * Our own demo pictures, drawn here rather than taken: a lighthouse on a headland, a dog's head
 * in profile, a tree on a hill. Enough tone and edges for the halftones to show.
 */
const PICTURES = [
  `<rect width="2400" height="3000" fill="url(#sky)"/><circle cx="1750" cy="700" r="260" fill="#fff6d8"/>
   <path d="M0 2100 L900 1500 L1500 1750 L2400 1400 L2400 3000 L0 3000 Z" fill="#4a3b33"/>
   <rect x="1000" y="700" width="260" height="900" fill="#f3efe6"/><rect x="1000" y="900" width="260" height="120" fill="#a3302a"/>
   <rect x="1000" y="1200" width="260" height="120" fill="#a3302a"/><path d="M960 700 L1130 520 L1300 700 Z" fill="#2b2b2b"/>
   <path d="M0 2400 Q1200 2250 2400 2450 L2400 3000 L0 3000 Z" fill="#1f3f57"/>`,
  `<rect width="2400" height="3000" fill="url(#sky)"/>
   <path d="M700 2900 Q600 1900 900 1300 Q1100 900 1500 850 Q1900 820 2050 1100 Q2150 1350 1900 1450 Q1750 1500 1700 1700 Q1650 2200 1800 2900 Z" fill="#6b4a32"/>
   <path d="M1450 850 Q1350 500 1600 420 Q1700 700 1650 880 Z" fill="#4d3322"/><circle cx="1700" cy="1080" r="55" fill="#111"/>
   <ellipse cx="2030" cy="1180" rx="70" ry="50" fill="#111"/>`,
  `<rect width="2400" height="3000" fill="url(#sky)"/>
   <path d="M0 2300 Q1200 1700 2400 2300 L2400 3000 L0 3000 Z" fill="#5d6b3a"/>
   <rect x="1150" y="1300" width="110" height="800" fill="#3b2a1e"/>
   <circle cx="1200" cy="1150" r="420" fill="#2f4a2a"/><circle cx="950" cy="1300" r="260" fill="#3c5a33"/><circle cx="1450" cy="1280" r="280" fill="#36532f"/>`,
];
const pictureSvg = (body: string) =>
  Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg" width="2400" height="3000"><defs>
  <linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#9cc3de"/><stop offset="1" stop-color="#f2d7b0"/></linearGradient>
  </defs>${body}</svg>`);

async function storeDemoPhoto(em: EntityManager, storage: Storage, studio: Studio, svg: string): Promise<BuyerPhoto> {
  const bytes = await sharp(pictureSvg(svg)).jpeg({ quality: 88 }).toBuffer();
  return storeBuyerPhoto(em, storage, studio, bytes, await makePhotoDerivatives(bytes));
}

/** Where an order of this age stands: work done long ago, work in hand this week. */
function standing(ageDays: number, pickup: boolean, pick: () => number): { status: OrderStatus; stage: ItemStage } {
  if (ageDays > 10) return { status: 'fulfilled', stage: pickup ? 'picked_up' : 'shipped' };
  const recent: ItemStage[] = ['photo_review', 'prep', 'proof_sent', 'approved'];
  return { status: 'paid', stage: recent[Math.floor(pick() * recent.length)]! };
}

/**
 * Adds twelve weeks of paid orders to each demo studio that has none yet (a second run adds
 * nothing): a few orders a week, growing towards now, the older ones shipped or picked up, this
 * fortnight's still in review, prep or proof. Buyers, addresses and pictures are our own.
 * Returns how many orders it added.
 */
export async function seedDemoHistory(em: EntityManager, storage: Storage, now = new Date()): Promise<number> {
  let added = 0;
  for (const demo of demoStudios) {
    const studio = await em.findOne(Studio, { slug: demo.slug });
    if (!studio) continue;
    const scoped = withoutTenantFilter;
    if ((await em.count(Order, { studio }, scoped)) > 0) continue;
    const blanks = await em.find(Blank, { studio, status: 'active' }, { ...scoped, populate: ['material', 'sizes'] });
    const rates = await em.find(ShippingRate, { studio }, { ...scoped, orderBy: { priceMinor: 'asc' } });
    const recipes = new Map<string, Recipe | null>();
    // As checkout picks it: the first recipe for the blank's material.
    for (const blank of blanks)
      recipes.set(blank.id, await em.findOne(Recipe, { studio, material: blank.material }, { ...scoped, orderBy: { createdAt: 'asc' } }));
    const sizes = blanks.flatMap((blank) => blank.sizes.getItems().map((size) => ({ blank, size })));
    if (!sizes.length) continue;
    const pick = random(seedOf(studio.slug));
    const photos = [];
    for (const svg of PICTURES) photos.push(await storeDemoPhoto(em, storage, studio, svg));

    let number = studio.nextOrderNumber;
    // Calendar weeks from Monday, as Today counts them, so that each of the twelve has orders.
    const thisMonday = startOfWeek(now);
    for (let week = HISTORY_WEEKS - 1; week >= 0; week--) {
      const start = thisMonday - week * 7 * DAY;
      const span = Math.max(60_000, Math.min(start + 7 * DAY, now.getTime() - 30 * 60_000) - start);
      const count = 2 + Math.floor(pick() * 3) + Math.round((HISTORY_WEEKS - week) / 4);
      const times = Array.from({ length: count }, () => start + pick() * span).sort((x, y) => x - y);
      for (const time of times) {
        const paidAt = new Date(time);
        const ageDays = (now.getTime() - paidAt.getTime()) / DAY;
        const [buyerName, buyerEmail] = BUYERS[Math.floor(pick() * BUYERS.length)]!;
        const pickup = studio.pickupEnabled && (pick() < 0.25 || rates.length === 0);
        const rate = pickup ? null : rates[Math.floor(pick() * rates.length)];
        if (!pickup && !rate) continue;
        const lines = Array.from({ length: pick() < 0.2 ? 2 : 1 }, () => sizes[Math.floor(pick() * sizes.length)]!);
        const subtotal = lines.reduce((sum, { size }) => sum + size.priceMinor, 0);
        const shipping = rate?.priceMinor ?? 0;
        const { status, stage } = standing(ageDays, pickup, pick);
        const order = em.create(Order, {
          studio,
          number: number++,
          status,
          buyerEmail,
          buyerName,
          deliveryMethod: pickup ? 'pickup' : 'ship',
          shippingAddress: pickup
            ? null
            : {
                line1: `${1 + Math.floor(pick() * 80)} Orchard Row`,
                line2: '',
                city: TOWNS[Math.floor(pick() * TOWNS.length)]!,
                region: '',
                postalCode: 'KB1 2CD',
                country: 'GB',
              },
          shippingRate: rate ? { id: rate.id, name: rate.name, priceMinor: rate.priceMinor } : null,
          currency: studio.currency,
          subtotalMinor: subtotal,
          shippingMinor: shipping,
          totalMinor: subtotal + shipping,
          // The key is thrown away: demo orders open from the workspace, not by a buyer's link.
          accessKeyHash: newLinkToken().hash,
          paidAt,
          createdAt: new Date(paidAt.getTime() - 6 * 60_000),
          updatedAt: paidAt,
        });
        for (const [position, { blank, size }] of lines.entries()) {
          const photo = photos[Math.floor(pick() * photos.length)]!;
          const orientation = size.orientation === 'landscape' ? 'landscape' : 'portrait';
          const area = orientedArea(size, orientation);
          const aspect = area.widthMm / area.heightMm;
          const width = Math.min(photo.width, photo.height * aspect);
          const crop = { left: (photo.width - width) / 2, top: (photo.height - width / aspect) / 2, width, height: width / aspect };
          const recipe = recipes.get(blank.id) ?? null;
          const item = em.create(OrderItem, {
            studio,
            order,
            position,
            stage,
            size,
            snapshot: snapshotForOrder(blank, size, recipe),
            quantity: 1,
            unitPriceMinor: size.priceMinor,
            photo,
            placement: { crop, rotation: 0, flipHorizontal: false },
            orientation,
            inscription: null,
            effectivePpi: Math.floor(effectivePpi(crop, area)),
            lowResolutionConfirmed: false,
            handover:
              stage === 'shipped' || stage === 'picked_up'
                ? {
                    method: stage === 'shipped' ? 'ship' : 'pickup',
                    carrier: stage === 'shipped' ? 'Royal Mail' : null,
                    trackingNumber: stage === 'shipped' ? `DM${100000 + Math.floor(pick() * 899999)}GB` : null,
                    at: new Date(paidAt.getTime() + 4 * DAY).toISOString(),
                    by: 'the studio',
                  }
                : null,
            createdAt: order.createdAt,
            updatedAt: paidAt,
          });
          void item;
        }
        const at = (offsetDays: number) => new Date(paidAt.getTime() + offsetDays * DAY);
        em.create(OrderEvent, {
          studio,
          order,
          type: 'placed',
          actor: 'buyer',
          text: `Order placed by ${buyerName}.`,
          createdAt: order.createdAt,
        });
        em.create(OrderEvent, { studio, order, type: 'paid', actor: 'payments', text: 'Payment received.', createdAt: paidAt });
        if (status === 'fulfilled')
          em.create(OrderEvent, {
            studio,
            order,
            type: 'fulfilled',
            actor: 'the studio',
            text: 'Every item has left the studio: the order is complete.',
            createdAt: at(4),
          });
        added++;
      }
    }
    studio.nextOrderNumber = number;
    await em.flush();
  }
  return added;
}
