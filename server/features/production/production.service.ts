import { randomUUID } from 'node:crypto';
import { assetPaths } from '#shared/routes.ts';
import type { EntityManager } from '@mikro-orm/postgresql';
import { AppError } from '#shared/errors.ts';
import { HALFTONE_METHODS } from '#shared/imaging/halftone/halftone.ts';
import {
  RENDER_FILE_KINDS,
  RENDER_FILE_LABELS,
  type BatchMachine,
  type BatchSummary,
  type BatchView,
  type ProductionBoard,
  type RenderFileKind,
  type RenderView,
} from '#shared/schemas/production.ts';
import { QUEUES, type Jobs } from '#server/adapters/jobs.ts';
import type { Storage } from '#server/adapters/storage.ts';
import { isUuid } from '#server/lib/tokens.ts';
import { displayName, type User } from '../accounts/user.entity.ts';
import { Recipe } from '../catalog/catalog.entity.ts';
import { findItem, moveItem } from '#server/features/orders/order-stages.service.ts';
import { OrderItem } from '../orders/order.entity.ts';
import { currentPrep } from '#server/features/prep/prep.service.ts';
import type { Studio } from '../studios/studio.entity.ts';
import { ProductionBatch, Render } from './production.entity.ts';
import { burnSecondsFor, renderKeys } from './render.service.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { workspaceOrderPath } from '../orders/order.views.ts';
import { readyToCollectMail } from '#server/features/orders/order-mail.ts';
import { fromStudio, queueEmail } from '#server/features/outbox/outbox.service.ts';

/** Items of one material and one machine recipe burn in one batch. */
const groupKey = (item: OrderItem) => `${item.snapshot.blank.material.id}:${item.snapshot.recipe?.id ?? 'none'}`;

async function machineOf(em: EntityManager, studio: Studio, recipeId: string | undefined): Promise<BatchMachine | null> {
  const recipe = recipeId && isUuid(recipeId) ? await em.findOne(Recipe, { id: recipeId, studio }, { populate: ['machine'] }) : null;
  if (!recipe) return null;
  const { machine } = recipe;
  return {
    name: machine.name,
    laserKind: machine.laserKind,
    speed: recipe.speed,
    speedUnit: machine.speedUnit,
    powerMinPercent: recipe.powerMinPercent,
    powerMaxPercent: recipe.powerMaxPercent,
    passes: recipe.passes,
    notes: recipe.notes,
  };
}

const recipeLine = (item: OrderItem) => {
  const r = item.snapshot.recipe;
  return r
    ? `${r.linesPerInch} lines per inch, ${HALFTONE_METHODS[r.halftoneMethod as keyof typeof HALFTONE_METHODS] ?? r.halftoneMethod}, ${r.tone}`
    : null;
};

function productionItem(studio: Studio, item: OrderItem, machine: BatchMachine | null) {
  return {
    itemId: item.id,
    orderId: item.order.id,
    orderNumber: item.order.number,
    buyerName: item.order.buyerName,
    label: `${item.snapshot.blank.name}, ${item.snapshot.size.label}`,
    quantity: item.quantity,
    stage: item.stage,
    thumbUrl: assetPaths.buyerPhotoThumb(studio.slug, item.photo.id),
    estimatedBurnSeconds: burnSecondsFor(item, currentPrep(item), machine),
  };
}

/** Approved items waiting, grouped by material and machine recipe, and the batches so far. */
export async function productionBoard(em: EntityManager, studio: Studio): Promise<ProductionBoard> {
  const waiting = await em.find(
    OrderItem,
    { studio, stage: 'approved' },
    { populate: ['order', 'photo'], orderBy: { order: { paidAt: 'asc' }, createdAt: 'asc' } },
  );
  const groups = new Map<string, ProductionBoard['groups'][number]>();
  const machines = new Map<string, BatchMachine | null>();
  for (const item of waiting) {
    const key = groupKey(item);
    if (!machines.has(key)) machines.set(key, await machineOf(em, studio, item.snapshot.recipe?.id));
    const machine = machines.get(key)!;
    if (!groups.has(key))
      groups.set(key, {
        key,
        materialName: item.snapshot.blank.material.name,
        machineName: machine?.name ?? null,
        recipe: recipeLine(item),
        items: [],
      });
    groups.get(key)!.items.push(productionItem(studio, item, machine));
  }
  const batches = await em.find(
    ProductionBatch,
    { studio },
    { populate: ['renders', 'renders.item'], orderBy: { number: 'desc' }, limit: 30 },
  );
  return { groups: [...groups.values()], batches: batches.map(batchSummary) };
}

function batchSummary(batch: ProductionBatch): BatchSummary {
  const renders = batch.renders.getItems();
  return {
    id: batch.id,
    number: batch.number,
    materialName: batch.materialName,
    machineName: batch.machine?.name ?? null,
    createdAt: batch.createdAt.toISOString(),
    createdBy: batch.createdBy,
    itemCount: renders.length,
    rendered: renders.filter((r) => r.status === 'done').length,
    failed: renders.filter((r) => r.status === 'failed').length,
    burned: renders.filter((r) => ['burned', 'shipped', 'picked_up'].includes(r.item.stage)).length,
  };
}

/**
 * Starts a batch: the chosen approved items (one material, one recipe) go into production and a
 * render is queued for each. Nothing is queued unless the whole batch is written.
 */
export async function createBatch(em: EntityManager, jobs: Jobs, studio: Studio, user: User, itemIds: string[]): Promise<ProductionBatch> {
  const unique = [...new Set(itemIds)];
  const items = await em.find(OrderItem, { id: { $in: unique }, studio }, { populate: ['order', 'photo'] });
  if (items.length !== unique.length) throw new AppError('NOT_FOUND', 'Some of these items are not in this studio.');
  const keys = new Set(items.map(groupKey));
  if (keys.size > 1)
    throw new AppError('VALIDATION_FAILED', 'A batch holds one material on one machine recipe. Start a batch per group.', {
      issues: [{ path: ['itemIds'], message: 'Choose items from one group.' }],
    });
  const first = items[0]!;
  const renders = await em.transactional(async (tx) => {
    await tx.execute('select "id" from "studio" where "id" = ? for update', [studio.id]);
    const [row] = await tx.execute<Array<{ next: number }>>(
      'select coalesce(max("number"), 0) + 1 as "next" from "production_batch" where "studio_id" = ?',
      [studio.id],
    );
    const batch = tx.create(ProductionBatch, {
      studio,
      number: Number(row!.next),
      materialName: first.snapshot.blank.material.name,
      recipeId: first.snapshot.recipe?.id ?? null,
      machine: await machineOf(tx, studio, first.snapshot.recipe?.id),
      createdBy: displayName(user),
    });
    const made: Render[] = [];
    for (const item of items) {
      const managed = tx.merge(item);
      moveItem(
        tx,
        managed,
        'startProduction',
        displayName(user),
        `Into production in batch ${batch.number}, by ${displayName(user)}.`,
        'in_production',
      );
      made.push(
        tx.create(Render, {
          studio,
          item: managed,
          batch,
          status: 'queued',
          keyPrefix: `studios/${studio.id}/renders/${randomUUID()}`,
          prepVersion: managed.prepVersions.at(-1)?.version ?? 0,
        }),
      );
    }
    return { batch, made };
  });
  // After the commit, so a worker never looks for a row it cannot see yet. A send that fails
  // leaves the render queued, and "Render again" sends it once more.
  for (const render of renders.made) await jobs.send(QUEUES.render, { renderId: render.id });
  return renders.batch;
}

/** A render may be retried when it failed, or when its worker has said nothing for longer than a render may take. */
const isStalled = (render: Render, timeoutSeconds: number) =>
  render.status === 'running' && Date.now() - render.updatedAt.getTime() > timeoutSeconds * 1000;

export function renderView(render: Render, timeoutSeconds: number): RenderView {
  return {
    id: render.id,
    status: render.status,
    progress: render.progress,
    step: render.step,
    attempts: render.attempts,
    error: render.error,
    stalled: isStalled(render, timeoutSeconds),
    prepVersion: render.prepVersion,
    files:
      render.status === 'done' && render.files
        ? RENDER_FILE_KINDS.map((kind) => ({
            kind,
            label: RENDER_FILE_LABELS[kind],
            bytes: render.files![kind].bytes,
            width: render.files![kind].width,
            height: render.files![kind].height,
          }))
        : [],
    finishedAt: render.finishedAt?.toISOString() ?? null,
  };
}

export async function findBatch(em: EntityManager, studio: Studio, batchId: string): Promise<ProductionBatch> {
  const batch = isUuid(batchId)
    ? await em.findOne(
        ProductionBatch,
        { id: batchId, studio },
        { populate: ['renders', 'renders.item', 'renders.item.order', 'renders.item.photo'] },
      )
    : null;
  if (!batch) throw new AppError('NOT_FOUND', 'There is no such batch.');
  return batch;
}

export function batchView(studio: Studio, batch: ProductionBatch, timeoutSeconds: number): BatchView {
  const renders = batch.renders
    .getItems()
    .sort((a, b) => a.item.order.number - b.item.order.number || a.item.createdAt.getTime() - b.item.createdAt.getTime());
  const items = renders.map((render) => ({
    ...productionItem(studio, render.item, batch.machine),
    render: renderView(render, timeoutSeconds),
  }));
  const times = items.map((i) => (i.estimatedBurnSeconds === null ? null : i.estimatedBurnSeconds * i.quantity));
  return {
    ...batchSummary(batch),
    recipe: renders[0] ? recipeLine(renders[0].item) : null,
    estimatedBurnSeconds: times.length && times.every((t) => t !== null) ? times.reduce((a, b) => a! + b!, 0) : null,
    items,
  };
}

async function findRender(em: EntityManager, studio: Studio, renderId: string): Promise<Render> {
  const render = isUuid(renderId)
    ? await em.findOne(Render, { id: renderId, studio }, { populate: ['item', 'item.order', 'batch'] })
    : null;
  if (!render) throw new AppError('NOT_FOUND', 'There is no such render.');
  return render;
}

/** Queues a failed (or stalled) render again; its files keep their keys. */
export async function retryRender(
  em: EntityManager,
  jobs: Jobs,
  studio: Studio,
  renderId: string,
  timeoutSeconds: number,
): Promise<Render> {
  const render = await findRender(em, studio, renderId);
  if (render.status !== 'failed' && !isStalled(render, timeoutSeconds)) {
    throw new AppError(
      'CONFLICT',
      render.status === 'done' ? 'This render is done already.' : 'This render is still on its way; it can be retried once it fails.',
    );
  }
  render.status = 'queued';
  render.progress = 0;
  render.step = 'Waiting for a worker';
  await em.flush();
  await jobs.send(QUEUES.render, { renderId: render.id });
  return render;
}

/** A short-lived link to one of a render's files, after the caller's permission check. */
export async function renderDownload(
  em: EntityManager,
  storage: Storage,
  studio: Studio,
  renderId: string,
  kind: string,
  user: User,
): Promise<{ url: string; expiresInSeconds: number; fileName: string }> {
  if (!(RENDER_FILE_KINDS as readonly string[]).includes(kind)) throw new AppError('NOT_FOUND', 'There is no such file.');
  const render = await findRender(em, studio, renderId);
  if (render.status !== 'done' || !render.files) throw new AppError('CONFLICT', 'The files are not ready yet.');
  const file = render.files[kind as RenderFileKind];
  // Named after its key (engrave.png, grayscale-master.png, job-sheet.pdf), for the order and item.
  const fileName = `order-${render.item.order.number}-${render.item.id.slice(0, 8)}-${file.key.split('/').pop()}`;
  const expiresInSeconds = 60;
  const url = await storage.presignDownload(file.key, { expiresInSeconds, downloadName: fileName });
  // Every file of a render is made from the buyer's photo or names the buyer: each link is logged.
  recordAudit(em, studio, user, {
    action: 'render.downloaded',
    subject: `Order ${render.item.order.number}`,
    summary: `Downloaded the ${RENDER_FILE_LABELS[kind as RenderFileKind].toLowerCase()} for ${render.item.snapshot.blank.name}, ${render.item.snapshot.size.label}.`,
    link: workspaceOrderPath(studio.slug, render.item.order.id),
    details: { renderId: render.id, itemId: render.item.id, kind },
  });
  await em.flush();
  return { url, expiresInSeconds, fileName };
}

/** After the machine: the item is burned. Only from a finished render. */
export async function markBurned(em: EntityManager, studio: Studio, itemId: string, user: User): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  const render = await em.findOne(Render, { item, studio });
  if (item.stage === 'in_production' && render?.status !== 'done')
    throw new AppError('CONFLICT', 'Render the files before marking the item burned.');
  moveItem(em, item, 'markBurned', displayName(user), `Burned; marked by ${displayName(user)}.`, 'burned');
  // A pickup order whose last piece is now engraved: the buyer hears it is ready, and where.
  const order = item.order;
  await em.populate(order, ['items']);
  const rest = order.items.getItems().filter((other) => other.id !== item.id && other.stage !== 'cancelled');
  if (order.deliveryMethod === 'pickup' && rest.every((other) => other.stage === 'burned' || other.stage === 'picked_up'))
    queueEmail(em, {
      to: order.buyerEmail,
      ...fromStudio(studio),
      ...readyToCollectMail({ studioName: studio.name, number: order.number, buyerName: order.buyerName, pickupNote: studio.pickupNote }),
    });
  await em.flush();
  return item;
}

/** Out of its batch and back to approved (a wrong blank, a burn to redo): its render and files go. */
export async function takeOutOfBatch(em: EntityManager, storage: Storage, studio: Studio, itemId: string, user: User): Promise<OrderItem> {
  const item = await findItem(em, studio, itemId);
  const render = await em.findOne(Render, { item, studio }, { populate: ['batch'] });
  moveItem(
    em,
    item,
    'takeOutOfBatch',
    displayName(user),
    `Taken out of ${render ? `batch ${render.batch.number}` : 'production'} by ${displayName(user)}; waiting for a new batch.`,
    'out_of_batch',
  );
  if (render) em.remove(render);
  await em.flush();
  if (render) await Promise.all(Object.values(renderKeys(render.keyPrefix)).map((key) => storage.remove(key)));
  return item;
}
