import type { EntityManager, FilterQuery } from '@mikro-orm/postgresql';
import { AppError } from '../../../shared/errors.ts';
import { cropMatchesArea } from '../../../shared/imaging/sizing.ts';
import { stretchedMessage } from './checkout.service.ts';
import { formatMoney } from '../../../shared/money.ts';
import { effectivePpi, verdictFor } from '../../../shared/imaging/photo-checks.ts';
import { ITEM_STAGE_LABELS } from '../../../shared/orders/stages.ts';
import type { Placement } from '../../../shared/schemas/checkout.ts';
import { REVIEW_REASONS, type OrderList, type orderListQuerySchema, type ReviewItem, type ReviewReason } from '../../../shared/schemas/workspace-orders.ts';
import type { z } from 'zod';
import { hashToken, isUuid, newLinkToken } from '../../lib/tokens.ts';
import { displayName, type User } from '../accounts/user.entity.ts';
import { queueEmail } from '../outbox/outbox.service.ts';
import { buyerPhotoView, findBuyerPhoto } from '../photos/photos.service.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { newPhotoNeededMail } from './order-mail.ts';
import { findItem, moveItem } from './item-moves.ts';
import { Order, OrderItem } from './order.entity.ts';
import { lookOf } from './order.views.ts';


/** Orders of the studio, searched, filtered, sorted and paged in the database. */
export async function listOrders(em: EntityManager, studio: Studio, query: z.output<typeof orderListQuerySchema>): Promise<OrderList> {
  const where: FilterQuery<Order> = { studio };
  const and: FilterQuery<Order>[] = [];
  if (query.search) {
    const like = `%${query.search.replace(/[%_\\]/g, (c) => `\\${c}`)}%`;
    const number = /^#?\d+$/.test(query.search) ? Number(query.search.replace('#', '')) : undefined;
    and.push({ $or: [{ buyerEmail: { $ilike: like } }, { buyerName: { $ilike: like } }, ...(number ? [{ number }] : [])] });
  }
  if (query.status) and.push({ status: query.status });
  if (query.stage) and.push({ items: { stage: query.stage } });
  if (query.material) and.push({ items: { snapshot: { blank: { material: { name: query.material } } } } } as FilterQuery<Order>);
  if (query.from) and.push({ createdAt: { $gte: new Date(`${query.from}T00:00:00Z`) } });
  if (query.to) and.push({ createdAt: { $lt: new Date(new Date(`${query.to}T00:00:00Z`).getTime() + 86_400_000) } });
  const orderBy = { newest: { createdAt: 'desc' }, oldest: { createdAt: 'asc' }, 'total-high': { totalMinor: 'desc' }, 'total-low': { totalMinor: 'asc' } }[query.sort] as Record<string, 'asc' | 'desc'>;
  const [orders, total] = await em.findAndCount(Order, and.length ? { ...where, $and: and } : where, {
    populate: ['items'],
    orderBy: [orderBy, { number: 'desc' }],
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return {
    orders: orders.map((o) => ({
      id: o.id,
      number: o.number,
      createdAt: o.createdAt.toISOString(),
      status: o.status,
      buyerName: o.buyerName,
      buyerEmail: o.buyerEmail,
      total: formatMoney(o.totalMinor, o.currency),
      items: o.items.getItems().map((i) => ({ id: i.id, stage: i.stage, label: `${i.quantity} × ${i.snapshot.blank.name}, ${i.snapshot.size.label}` })),
    })),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export async function findOrder(em: EntityManager, studio: Studio, id: string): Promise<Order> {
  const order = isUuid(id) ? await em.findOne(Order, { id, studio }, { populate: ['items', 'items.photo', 'events', 'studio'] }) : null;
  if (!order) throw new AppError('NOT_FOUND', 'There is no such order.');
  return order;
}


/** Photos waiting for review, oldest payment first. */
export async function reviewQueue(em: EntityManager, studio: Studio): Promise<ReviewItem[]> {
  const items = await em.find(OrderItem, { studio, stage: 'photo_review' }, { populate: ['order', 'photo'], orderBy: { order: { paidAt: 'asc' }, createdAt: 'asc' } });
  return items.map((item) => {
    const look = lookOf(item);
    const ppi = effectivePpi(item.placement.crop, { widthMm: look.areaWidthMm, heightMm: look.areaHeightMm });
    return {
      itemId: item.id,
      orderId: item.order.id,
      orderNumber: item.order.number,
      paidAt: item.order.paidAt?.toISOString() ?? null,
      buyerName: item.order.buyerName,
      blankName: item.snapshot.blank.name,
      sizeLabel: item.snapshot.size.label,
      areaWidthMm: look.areaWidthMm,
      areaHeightMm: look.areaHeightMm,
      look,
      effectivePpi: Math.floor(ppi),
      verdict: verdictFor(ppi),
      lowResolutionConfirmed: item.lowResolutionConfirmed,
      placement: item.placement,
      photo: { ...buyerPhotoView(studio, item.photo), originalUrl: `/api/studios/${studio.slug}/orders/photos/${item.photo.id}/original` },
      replacements: item.replacements,
    };
  });
}


export async function approvePhoto(em: EntityManager, studio: Studio, itemId: string, user: User): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  moveItem(em, item, 'approvePhoto', displayName(user), `Photo for ${item.snapshot.blank.name}, ${item.snapshot.size.label} approved by ${displayName(user)}.`, 'photo_approved');
  await em.flush();
  return item;
}

/**
 * Asks the buyer for a new photo: the item waits, and the buyer gets the reason and a private,
 * single-use link to upload a replacement (its token is stored only as a hash).
 */
export async function askNewPhoto(em: EntityManager, studio: Studio, itemId: string, user: User, input: { reason: ReviewReason; note: string }, appUrl: string): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  const token = newLinkToken();
  moveItem(em, item, 'askNewPhoto', displayName(user), `New photo asked for by ${displayName(user)}: ${REVIEW_REASONS[input.reason].toLowerCase()}${input.note ? ` (“${input.note}”)` : ''}.`, 'new_photo_asked');
  Object.assign(item, { replacementTokenHash: token.hash, replacementReason: input.reason, replacementNote: input.note });
  queueEmail(em, {
    to: item.order.buyerEmail,
    ...newPhotoNeededMail({
      studioName: studio.name,
      number: item.order.number,
      buyerName: item.order.buyerName,
      what: `${item.snapshot.blank.name}, ${item.snapshot.size.label}`,
      reason: REVIEW_REASONS[input.reason],
      note: input.note,
      url: `${appUrl}/s/${studio.slug}/replace/${token.token}`,
    }),
  });
  await em.flush();
  return item;
}

/** The item a replacement link is for, while it still waits for the new photo. */
export async function findReplacement(em: EntityManager, studio: Studio, token: string): Promise<OrderItem> {
  const item = token ? await em.findOne(OrderItem, { studio, replacementTokenHash: hashToken(token) }, { populate: ['order', 'photo', 'order.studio'] }) : null;
  if (!item || item.stage !== 'needs_new_photo') throw new AppError('NOT_FOUND', 'This link has been used or is no longer valid. Your order page shows what is needed now.');
  return item;
}

/** The buyer's new photo: checked like the first, the item back in review, the link used up. */
export async function submitReplacement(em: EntityManager, studio: Studio, token: string, input: { photoId: string; placement: Placement }): Promise<OrderItem> {
  const item = await findReplacement(em, studio, token);
  const photo = await findBuyerPhoto(em, studio, input.photoId);
  const look = lookOf(item);
  const area = { widthMm: look.areaWidthMm, heightMm: look.areaHeightMm };
  if (!cropMatchesArea(input.placement.crop, area)) {
    const message = stretchedMessage(input.placement.crop, area);
    throw new AppError('VALIDATION_FAILED', message, { issues: [{ path: ['placement'], message }] });
  }
  const ppi = effectivePpi(input.placement.crop, area);
  Object.assign(item, { photo, placement: input.placement, effectivePpi: Math.floor(ppi), replacementTokenHash: null, replacements: item.replacements + 1 });
  moveItem(em, item, 'receiveNewPhoto', 'buyer', `The buyer sent a new photo (${Math.floor(ppi)} pixels per inch at the size): ${ITEM_STAGE_LABELS.photo_review.toLowerCase()}.`, 'new_photo_received');
  await em.flush();
  return item;
}
