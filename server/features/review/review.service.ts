import type { EntityManager } from '@mikro-orm/postgresql';
import { absolute, assetPaths, storefrontPaths } from '#shared/routes.ts';
import { AppError } from '#shared/errors.ts';
import { cropMatchesArea } from '#shared/imaging/sizing.ts';
import { stretchedMessage } from '../checkout/checkout.service.ts';
import { effectivePpi, verdictFor } from '#shared/imaging/photo-checks.ts';
import { ITEM_STAGE_LABELS } from '#shared/orders/stages.ts';
import type { Placement } from '#shared/schemas/checkout.ts';
import { REVIEW_REASONS, type ReviewItem, type ReviewReason } from '#shared/schemas/workspace-orders.ts';
import { hashToken, newLinkToken } from '#server/lib/tokens.ts';
import { displayName, type User } from '#server/features/accounts/user.entity.ts';
import { fromStudio, queueEmail } from '#server/features/outbox/outbox.service.ts';
import { buyerPhotoView, findBuyerPhoto } from '#server/features/photos/photos.service.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { newPhotoNeededMail } from '../orders/order-mail.ts';
import { findItem, moveItem } from '../orders/order-stages.service.ts';
import { OrderItem } from '../orders/order.entity.ts';
import { lookOf } from '../orders/order.views.ts';

/** Photos waiting for review, oldest payment first. */
export async function reviewQueue(em: EntityManager, studio: Studio): Promise<ReviewItem[]> {
  const items = await em.find(
    OrderItem,
    { studio, stage: 'photo_review' },
    { populate: ['order', 'photo'], orderBy: { order: { paidAt: 'asc' }, createdAt: 'asc' } },
  );
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
      inscription: item.inscription,
      photo: { ...buyerPhotoView(studio, item.photo), originalUrl: assetPaths.buyerPhotoOriginal(studio.slug, item.photo.id) },
      replacements: item.replacements,
    };
  });
}

export async function approvePhoto(em: EntityManager, studio: Studio, itemId: string, user: User): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  moveItem(
    em,
    item,
    'approvePhoto',
    displayName(user),
    `Photo for ${item.snapshot.blank.name}, ${item.snapshot.size.label} approved by ${displayName(user)}.`,
    'photo_approved',
  );
  await em.flush();
  return item;
}

/**
 * Asks the buyer for a new photo: the item waits, and the buyer gets the reason and a private,
 * single-use link to upload a replacement (its token is stored only as a hash).
 */
export async function askNewPhoto(
  em: EntityManager,
  studio: Studio,
  itemId: string,
  user: User,
  input: { reason: ReviewReason; note: string },
  appUrl: string,
): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  const token = newLinkToken();
  moveItem(
    em,
    item,
    'askNewPhoto',
    displayName(user),
    `New photo asked for by ${displayName(user)}: ${REVIEW_REASONS[input.reason].toLowerCase()}${input.note ? ` (“${input.note}”)` : ''}.`,
    'new_photo_asked',
  );
  Object.assign(item, { replacementTokenHash: token.hash, replacementReason: input.reason, replacementNote: input.note });
  queueEmail(em, {
    to: item.order.buyerEmail,
    ...fromStudio(studio),
    ...newPhotoNeededMail({
      studioName: studio.name,
      number: item.order.number,
      buyerName: item.order.buyerName,
      what: `${item.snapshot.blank.name}, ${item.snapshot.size.label}`,
      reason: REVIEW_REASONS[input.reason],
      note: input.note,
      url: absolute(appUrl, storefrontPaths.replacement(studio.slug, token.token)),
    }),
  });
  await em.flush();
  return item;
}

/** The item a replacement link is for, while it still waits for the new photo. */
export async function findReplacement(em: EntityManager, studio: Studio, token: string): Promise<OrderItem> {
  const item = token
    ? await em.findOne(OrderItem, { studio, replacementTokenHash: hashToken(token) }, { populate: ['order', 'photo', 'order.studio'] })
    : null;
  if (!item || item.stage !== 'needs_new_photo')
    throw new AppError('NOT_FOUND', 'This link has been used or is no longer valid. Your order page shows what is needed now.');
  return item;
}

/** The buyer's new photo: checked like the first, the item back in review, the link used up. */
export async function submitReplacement(
  em: EntityManager,
  studio: Studio,
  token: string,
  input: { photoId: string; placement: Placement },
): Promise<OrderItem> {
  const item = await findReplacement(em, studio, token);
  const photo = await findBuyerPhoto(em, studio, input.photoId);
  const look = lookOf(item);
  const area = { widthMm: look.areaWidthMm, heightMm: look.areaHeightMm };
  if (!cropMatchesArea(input.placement.crop, area)) {
    const message = stretchedMessage(input.placement.crop, area);
    throw new AppError('VALIDATION_FAILED', message, { issues: [{ path: ['placement'], message }] });
  }
  const ppi = effectivePpi(input.placement.crop, area);
  Object.assign(item, {
    photo,
    placement: input.placement,
    effectivePpi: Math.floor(ppi),
    replacementTokenHash: null,
    replacements: item.replacements + 1,
    // The buyer's "engrave it soft anyway" was about the old photo: a sharp enough new one clears it.
    lowResolutionConfirmed: item.lowResolutionConfirmed && verdictFor(ppi) === 'too-low',
  });
  moveItem(
    em,
    item,
    'receiveNewPhoto',
    'buyer',
    `The buyer sent a new photo (${Math.floor(ppi)} pixels per inch at the size): ${ITEM_STAGE_LABELS.photo_review.toLowerCase()}.`,
    'new_photo_received',
  );
  await em.flush();
  return item;
}
