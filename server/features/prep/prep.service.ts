import { randomUUID } from 'node:crypto';
import { absolute, assetPaths, storefrontPaths } from '#shared/routes.ts';
import type { EntityManager } from '@mikro-orm/postgresql';
import { assertItemAction } from '#shared/orders/stages.ts';
import { recipePrep } from '#shared/orders/prep-pipeline.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { renderProofImage } from './proof-image.ts';
import { AppError } from '#shared/errors.ts';
import { prepSettingsSchema, type PrepSettings, type ProofDecision } from '#shared/schemas/prep.ts';
import type { PrepQueueItem } from '#shared/schemas/workspace-orders.ts';
import { hashToken, newLinkToken } from '#server/lib/tokens.ts';
import { displayName, type User } from '#server/features/accounts/user.entity.ts';
import { fromStudio, queueEmail } from '#server/features/outbox/outbox.service.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { proofMail } from '../orders/order-mail.ts';
import { findItem, moveItem } from '../orders/order-stages.service.ts';
import { OrderEvent, OrderItem } from '../orders/order.entity.ts';
import { lookOf } from '../orders/order.views.ts';

/** Prep settings an item starts from: its recipe's (`recipePrep`, shared with the storefront's mock-up). */
export const defaultPrep = (item: OrderItem): PrepSettings => recipePrep(lookOf(item));

/** What burns: the last saved version (read through the schema, so older versions gain new fields' defaults). */
export const currentPrep = (item: OrderItem): PrepSettings => {
  const saved = item.prepVersions.at(-1)?.settings;
  return saved ? prepSettingsSchema.parse(saved) : defaultPrep(item);
};

/** Saves prep settings as a new version; only while the item is being prepared. */
export async function savePrep(em: EntityManager, studio: Studio, itemId: string, user: User, settings: PrepSettings): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  if (item.stage !== 'prep')
    throw new AppError(
      'CONFLICT',
      `This item is ${item.stage.replaceAll('_', ' ')}: prep settings can be changed only while it is being prepared.`,
    );
  const version = (item.prepVersions.at(-1)?.version ?? 0) + 1;
  item.prepVersions = [...item.prepVersions, { version, settings, savedBy: displayName(user), savedAt: new Date().toISOString() }];
  em.create(OrderEvent, {
    studio,
    order: item.order,
    item,
    type: 'prep_saved',
    actor: displayName(user),
    text: `Prep settings version ${version} saved by ${displayName(user)}.`,
  });
  await em.flush();
  return item;
}

/** Sends the buyer a proof: the mock-up of the current prep, with links to approve or ask for changes. */
export async function sendProof(
  em: EntityManager,
  storage: Storage,
  studio: Studio,
  itemId: string,
  user: User,
  appUrl: string,
): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  assertItemAction('sendProof', item.stage);
  // Rendered before anything is written: a proof that cannot be drawn is never sent.
  const image = await renderProofImage(storage, item, currentPrep(item));
  const imageKey = `studios/${studio.id}/proofs/${randomUUID()}.png`;
  await storage.put(imageKey, image, 'image/png');
  const token = newLinkToken();
  moveItem(em, item, 'sendProof', displayName(user), `Proof sent to the buyer by ${displayName(user)}.`, 'proof_sent');
  item.proofTokenHash = token.hash;
  item.proofImageKey = imageKey;
  queueEmail(em, {
    to: item.order.buyerEmail,
    ...fromStudio(studio),
    ...proofMail({
      studioName: studio.name,
      number: item.order.number,
      buyerName: item.order.buyerName,
      what: `${item.snapshot.blank.name}, ${item.snapshot.size.label}`,
      url: absolute(appUrl, storefrontPaths.proof(studio.slug, token.token)),
    }),
  });
  await em.flush();
  return item;
}

/** For studios (or items) that need no proof: straight from prep to approved. */
export async function approveWithoutProof(em: EntityManager, studio: Studio, itemId: string, user: User): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  if (studio.proofsRequired)
    throw new AppError('CONFLICT', 'This studio sends every buyer a proof before engraving. Send a proof, or change that in Settings.');
  moveItem(
    em,
    item,
    'approveWithoutProof',
    displayName(user),
    `Approved for engraving without a proof by ${displayName(user)}.`,
    'approved',
  );
  await em.flush();
  return item;
}

export async function findProof(em: EntityManager, studio: Studio, token: string): Promise<OrderItem> {
  const item = token
    ? await em.findOne(OrderItem, { studio, proofTokenHash: hashToken(token) }, { populate: ['order', 'order.studio', 'photo'] })
    : null;
  if (!item || item.stage !== 'proof_sent')
    throw new AppError(
      'NOT_FOUND',
      'This proof has been answered already or is no longer valid. Your order page shows where things stand.',
    );
  return item;
}

/** The buyer's answer to a proof; the link works once. */
export async function answerProof(em: EntityManager, studio: Studio, token: string, decision: ProofDecision): Promise<OrderItem> {
  const item = await findProof(em, studio, token);
  item.proofTokenHash = null;
  if (decision.decision === 'approve') moveItem(em, item, 'approveProof', 'buyer', 'The buyer approved the proof.', 'proof_approved');
  else moveItem(em, item, 'requestChanges', 'buyer', `The buyer asked for changes: “${decision.message}”`, 'changes_requested');
  await em.flush();
  return item;
}

/** After a change request, back to prep. */
export async function reopenPrep(em: EntityManager, studio: Studio, itemId: string, user: User): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  moveItem(em, item, 'reopenPrep', displayName(user), `Back to prep, by ${displayName(user)}.`, 'prep_reopened');
  await em.flush();
  return item;
}

/** Items waiting for prep, the longest waiting first: approved photos, and proofs sent back. */
export async function prepQueue(em: EntityManager, studio: Studio): Promise<PrepQueueItem[]> {
  const items = await em.find(
    OrderItem,
    { studio, stage: { $in: ['prep', 'changes_requested'] } },
    { populate: ['order', 'photo'], orderBy: { updatedAt: 'asc' } },
  );
  return items.map((item) => ({
    itemId: item.id,
    orderId: item.order.id,
    orderNumber: item.order.number,
    buyerName: item.order.buyerName,
    label: `${item.quantity} × ${item.snapshot.blank.name}, ${item.snapshot.size.label}`,
    stage: item.stage as PrepQueueItem['stage'],
    since: item.updatedAt.toISOString(),
    thumbUrl: assetPaths.buyerPhotoThumb(studio.slug, item.photo.id),
  }));
}
